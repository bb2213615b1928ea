import "server-only";
import { and, eq, gt } from "drizzle-orm";
import { redirect } from "next/navigation";
import { db } from "@/db/client";
import { sessions, users } from "@/db/schema";
import { auth } from "./auth";

export interface CurrentUser {
  id: string;
  email: string;
  name: string;
  unitSystem: "SI" | "IP";
  theme: "system" | "light" | "dark";
  sessionId: string;
}

/**
 * The signed-in user, or null. The token only names a session row; a deleted or expired row
 * (signed out, removed member, password reset) means signed out, whatever the cookie says.
 */
export async function currentUser(): Promise<CurrentUser | null> {
  const s = (await auth()) as { sid?: string } | null;
  const sid = s?.sid;
  if (!sid) return null;
  const rows = await db
    .select({
      id: users.id,
      email: users.email,
      name: users.name,
      unitSystem: users.unitSystem,
      theme: users.theme,
    })
    .from(sessions)
    .innerJoin(users, eq(users.id, sessions.userId))
    .where(and(eq(sessions.id, sid), gt(sessions.expiresAt, new Date())))
    .limit(1);
  const row = rows[0];
  return row ? { ...row, sessionId: sid } : null;
}

/** For pages: the user, or a redirect to the sign-in page. */
export async function requireUser(): Promise<CurrentUser> {
  const u = await currentUser();
  if (!u) redirect("/signin");
  return u;
}
