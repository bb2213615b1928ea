import "server-only";
import { and, count, eq, gt } from "drizzle-orm";
import { db } from "@/db/client";
import { signInAttempts } from "@/db/schema";
import { env } from "./env";

/**
 * Sign-in rate limit kept in PostgreSQL: at most SIGNIN_MAX_ATTEMPTS failed attempts per
 * e-mail address, and four times that per client address, within SIGNIN_WINDOW_MINUTES.
 */
export async function signInAllowed(email: string, clientKey: string): Promise<boolean> {
  const since = new Date(Date.now() - env.SIGNIN_WINDOW_MINUTES * 60_000);
  const [byEmail] = await db
    .select({ n: count() })
    .from(signInAttempts)
    .where(and(eq(signInAttempts.email, email), eq(signInAttempts.succeeded, 0), gt(signInAttempts.at, since)));
  const [byClient] = await db
    .select({ n: count() })
    .from(signInAttempts)
    .where(and(eq(signInAttempts.clientKey, clientKey), eq(signInAttempts.succeeded, 0), gt(signInAttempts.at, since)));
  return byEmail.n < env.SIGNIN_MAX_ATTEMPTS && byClient.n < env.SIGNIN_MAX_ATTEMPTS * 4;
}

export async function recordSignInAttempt(email: string, clientKey: string, succeeded: boolean): Promise<void> {
  await db.insert(signInAttempts).values({ email, clientKey, succeeded: succeeded ? 1 : 0 });
  if (succeeded) {
    // A good sign-in clears that address's failures, so a typo yesterday does not count today.
    await db
      .delete(signInAttempts)
      .where(and(eq(signInAttempts.email, email), eq(signInAttempts.succeeded, 0)));
  }
}

export function clientKeyOf(headers: Headers): string {
  const fwd = headers.get("x-forwarded-for");
  return (fwd ? fwd.split(",")[0].trim() : headers.get("x-real-ip")) || "local";
}

