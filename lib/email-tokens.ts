import "server-only";
import { and, eq, gt, isNull } from "drizzle-orm";
import { db } from "@/db/client";
import { emailTokens } from "@/db/schema";
import { hashToken, newToken } from "./tokens";

export type EmailTokenPurpose = "signin_link" | "password_reset";
export const TOKEN_MINUTES: Record<EmailTokenPurpose, number> = { signin_link: 15, password_reset: 60 };

/** Issues a single-use, expiring token; only its hash is stored. Returns the token for the e-mail. */
export async function issueEmailToken(userId: string, purpose: EmailTokenPurpose, now = new Date()): Promise<string> {
  const { token, hash } = newToken();
  await db.insert(emailTokens).values({
    userId,
    purpose,
    tokenHash: hash,
    expiresAt: new Date(now.getTime() + TOKEN_MINUTES[purpose] * 60_000),
  });
  return token;
}

/** Spends a token of a purpose (atomically: a second use finds it used); returns its user id or null. */
export async function consumeEmailToken(token: string, purpose: EmailTokenPurpose): Promise<string | null> {
  const [row] = await db
    .update(emailTokens)
    .set({ usedAt: new Date() })
    .where(
      and(
        eq(emailTokens.tokenHash, hashToken(token)),
        eq(emailTokens.purpose, purpose),
        isNull(emailTokens.usedAt),
        gt(emailTokens.expiresAt, new Date()),
      ),
    )
    .returning({ userId: emailTokens.userId });
  return row?.userId ?? null;
}
