import "server-only";
import { eq } from "drizzle-orm";
import bcrypt from "bcryptjs";
import { db } from "@/db/client";
import { emailTokens, sessions, users } from "@/db/schema";
import { newToken } from "@/lib/tokens";

export const LINK_MINUTES = 15;
export const RESET_MINUTES = 60;

export async function findUserByEmail(email: string) {
  const [u] = await db.select().from(users).where(eq(users.email, email)).limit(1);
  return u ?? null;
}

export async function issueEmailToken(userId: string, purpose: "signin_link" | "password_reset"): Promise<string> {
  const { token, hash } = newToken();
  const minutes = purpose === "signin_link" ? LINK_MINUTES : RESET_MINUTES;
  await db.insert(emailTokens).values({ userId, purpose, tokenHash: hash, expiresAt: new Date(Date.now() + minutes * 60_000) });
  return token;
}

export function hashPassword(password: string): Promise<string> {
  return bcrypt.hash(password, 11);
}

/** Sets a new password and ends every session of that user (a reset means "not me"). */
export async function setPassword(userId: string, password: string): Promise<void> {
  const hash = await hashPassword(password);
  await db.transaction(async (tx) => {
    await tx.update(users).set({ passwordHash: hash }).where(eq(users.id, userId));
    await tx.delete(sessions).where(eq(sessions.userId, userId));
  });
}
