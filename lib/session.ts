import "server-only";
import { and, eq, gt, sql } from "drizzle-orm";
import { cookies } from "next/headers";
import { redirect } from "next/navigation";
import { cache } from "react";
import { db } from "@/db/client";
import { sessions, users } from "@/db/schema";
import { env } from "./env";
import { decodeSessionToken } from "./session-token";

export interface CurrentUser {
  id: string;
  email: string;
  name: string;
  unitSystem: "SI" | "IP";
  theme: "system" | "light" | "dark";
  sessionId: string;
}

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

/** next-auth's session cookie names (the `__Secure-` one when served over https). */
const SESSION_COOKIES = ["__Secure-authjs.session-token", "authjs.session-token"];

/**
 * The session id in the request's next-auth cookie, or null: the token is decrypted and its
 * expiry checked as next-auth does (lib/session-token.ts). Cheaper than `auth()`, which also
 * derives the key again, runs the callbacks and encrypts a refreshed token that a route
 * handler cannot send back anyway (profiled: see docs/operations.md).
 */
async function sessionIdOfRequest(): Promise<string | null> {
  if (!env.AUTH_SECRET) throw new Error("AUTH_SECRET is not set");
  const jar = await cookies();
  for (const name of SESSION_COOKIES) {
    let token = jar.get(name)?.value;
    if (!token) {
      // next-auth splits a token over name.0, name.1, … when it is longer than a cookie may be.
      const parts = jar.getAll().filter((c) => c.name.startsWith(name + ".") && /^\d+$/.test(c.name.slice(name.length + 1)));
      token = parts.sort((a, b) => Number(a.name.slice(name.length + 1)) - Number(b.name.slice(name.length + 1))).map((c) => c.value).join("") || undefined;
    }
    if (!token) continue;
    // A token we cannot decrypt, or an expired one, is no session.
    const payload = decodeSessionToken(token, env.AUTH_SECRET, name);
    if (typeof payload?.sid === "string" && UUID.test(payload.sid)) return payload.sid;
  }
  return null;
}

/** Asked on every request: a prepared statement, parsed and planned once per connection. */
const sessionUser = db
  .select({
    id: users.id,
    email: users.email,
    name: users.name,
    unitSystem: users.unitSystem,
    theme: users.theme,
  })
  .from(sessions)
  .innerJoin(users, eq(users.id, sessions.userId))
  .where(and(eq(sessions.id, sql.placeholder("sid")), gt(sessions.expiresAt, sql`now()`)))
  .limit(1)
  .prepare("rimeplan_session_user");

/**
 * The signed-in user, or null. The token only names a session row; a deleted or expired row
 * (signed out, removed member, password reset) means signed out, whatever the cookie says.
 * Every instance decides from the database alone, so a session made on one works on all and
 * a sign-out on one ends it on all. Memoised per server render (layout and page share one).
 */
export const currentUser = cache(async (): Promise<CurrentUser | null> => {
  const sid = await sessionIdOfRequest();
  if (!sid) return null;
  const rows = await sessionUser.execute({ sid });
  const row = rows[0];
  return row ? { ...row, sessionId: sid } : null;
});

/** For pages: the user, or a redirect to the sign-in page. */
export async function requireUser(): Promise<CurrentUser> {
  const u = await currentUser();
  if (!u) redirect("/signin");
  return u;
}
