import "server-only";
import { eq } from "drizzle-orm";
import bcrypt from "bcryptjs";
import { db } from "@/db/client";
import { sessions, users } from "@/db/schema";
import { TOKEN_MINUTES } from "@/lib/email-tokens";

export { issueEmailToken } from "@/lib/email-tokens";
export const LINK_MINUTES = TOKEN_MINUTES.signin_link;
export const RESET_MINUTES = TOKEN_MINUTES.password_reset;

export async function findUserByEmail(email: string) {
  const [u] = await db.select().from(users).where(eq(users.email, email)).limit(1);
  return u ?? null;
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
