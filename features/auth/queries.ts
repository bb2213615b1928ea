import "server-only";
import { eq } from "drizzle-orm";
import bcrypt from "bcryptjs";
import { db } from "@/db/client";
import { sessions, users } from "@/db/schema";
import { issueEmailToken, TOKEN_MINUTES } from "@/lib/email-tokens";
import { appLink, sendMail } from "@/lib/mail";

export { issueEmailToken };

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

const TOKEN_MAIL = {
  signin_link: {
    path: "/signin/link",
    subject: "Your Rimeplan sign-in link",
    text: (link: string) =>
      `Sign in to Rimeplan: ${link}\n\nThe link works once and expires in ${TOKEN_MINUTES.signin_link} minutes. If you did not ask for it, ignore this message.`,
    answer: "If that address has an account, a sign-in link is on its way.",
  },
  password_reset: {
    path: "/reset",
    subject: "Reset your Rimeplan password",
    text: (link: string) =>
      `Choose a new password: ${link}\n\nThe link works once and expires in ${TOKEN_MINUTES.password_reset} minutes. Resetting signs you out everywhere. If you did not ask for it, ignore this message.`,
    answer: "If that address has an account, a reset link is on its way.",
  },
} as const;

/**
 * E-mails a one-time link of a purpose if the address has an account. The answer is the same
 * either way, so the form does not reveal who has an account.
 */
export async function mailTokenLink(email: string, purpose: keyof typeof TOKEN_MAIL): Promise<{ ok: true; message: string }> {
  const t = TOKEN_MAIL[purpose];
  const user = await findUserByEmail(email);
  if (user) {
    const token = await issueEmailToken(user.id, purpose);
    const link = appLink(`${t.path}?token=${encodeURIComponent(token)}`);
    await sendMail({ to: user.email, subject: t.subject, text: t.text(link) }, { userId: user.id });
  }
  return { ok: true, message: t.answer };
}
