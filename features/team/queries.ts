import "server-only";
import { and, asc, count, eq, gt, isNull, sql } from "drizzle-orm";
import { db } from "@/db/client";
import { invites, memberships, sessions, users, workspaces } from "@/db/schema";
import { AppError } from "@/lib/errors";
import { hashToken, newToken } from "@/lib/tokens";
import type { InviteDto, MemberDto } from "./schema";
import type { RoleName } from "./roles";

export const INVITE_DAYS = 7;

export async function listMembers(workspaceId: string): Promise<MemberDto[]> {
  const rows = await db
    .select({ userId: users.id, email: users.email, name: users.name, role: memberships.role, joinedAt: memberships.createdAt })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .where(eq(memberships.workspaceId, workspaceId))
    .orderBy(asc(users.email));
  return rows.map((r) => ({ ...r, joinedAt: r.joinedAt.toISOString() }));
}

export async function listOpenInvites(workspaceId: string): Promise<InviteDto[]> {
  const rows = await db
    .select()
    .from(invites)
    .where(and(eq(invites.workspaceId, workspaceId), isNull(invites.acceptedAt), isNull(invites.revokedAt), gt(invites.expiresAt, new Date())))
    .orderBy(asc(invites.email));
  return rows.map((r) => ({ id: r.id, email: r.email, role: r.role, expiresAt: r.expiresAt.toISOString() }));
}

export async function createInvite(workspaceId: string, invitedBy: string, email: string, role: RoleName) {
  const existing = await db
    .select({ id: users.id })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .where(and(eq(memberships.workspaceId, workspaceId), eq(users.email, email)))
    .limit(1);
  if (existing.length) throw new AppError("conflict", `${email} is already a member of this workspace.`, "email");
  const { token, hash } = newToken();
  const [row] = await db
    .insert(invites)
    .values({ workspaceId, email, role, tokenHash: hash, invitedBy, expiresAt: new Date(Date.now() + INVITE_DAYS * 86_400_000) })
    .returning();
  return { invite: row, token };
}

export async function findOpenInvite(token: string) {
  const [row] = await db
    .select({ invite: invites, workspaceName: workspaces.name, workspaceSlug: workspaces.slug })
    .from(invites)
    .innerJoin(workspaces, eq(workspaces.id, invites.workspaceId))
    .where(and(eq(invites.tokenHash, hashToken(token)), isNull(invites.acceptedAt), isNull(invites.revokedAt), gt(invites.expiresAt, new Date())))
    .limit(1);
  return row ?? null;
}

async function ownerCount(tx: Pick<typeof db, "select">, workspaceId: string): Promise<number> {
  const [r] = await tx
    .select({ n: count() })
    .from(memberships)
    .where(and(eq(memberships.workspaceId, workspaceId), eq(memberships.role, "owner")));
  return r.n;
}

/** Changes a member's role; the last owner cannot be demoted. Serialised per workspace. */
export async function changeRole(workspaceId: string, userId: string, role: RoleName): Promise<{ from: RoleName; to: RoleName }> {
  return db.transaction(async (tx) => {
    await tx.execute(sql`select pg_advisory_xact_lock(hashtext(${"ws:" + workspaceId}))`);
    const [m] = await tx
      .select()
      .from(memberships)
      .where(and(eq(memberships.workspaceId, workspaceId), eq(memberships.userId, userId)))
      .limit(1);
    if (!m) throw new AppError("not_found", "That person is not a member of this workspace.");
    if (m.role === "owner" && role !== "owner" && (await ownerCount(tx, workspaceId)) <= 1) {
      throw new AppError("last_owner", "The last owner cannot be demoted. Make someone else an owner first.", "role");
    }
    await tx.update(memberships).set({ role }).where(and(eq(memberships.workspaceId, workspaceId), eq(memberships.userId, userId)));
    return { from: m.role, to: role };
  });
}

/** Removes a member and ends all their sessions at once; the last owner cannot be removed. */
export async function removeMember(workspaceId: string, userId: string): Promise<{ email: string; role: RoleName }> {
  return db.transaction(async (tx) => {
    await tx.execute(sql`select pg_advisory_xact_lock(hashtext(${"ws:" + workspaceId}))`);
    const [m] = await tx
      .select({ role: memberships.role, email: users.email })
      .from(memberships)
      .innerJoin(users, eq(users.id, memberships.userId))
      .where(and(eq(memberships.workspaceId, workspaceId), eq(memberships.userId, userId)))
      .limit(1);
    if (!m) throw new AppError("not_found", "That person is not a member of this workspace.");
    if (m.role === "owner" && (await ownerCount(tx, workspaceId)) <= 1) {
      throw new AppError("last_owner", "The last owner cannot be removed. Make someone else an owner first.");
    }
    await tx.delete(memberships).where(and(eq(memberships.workspaceId, workspaceId), eq(memberships.userId, userId)));
    await tx.delete(sessions).where(eq(sessions.userId, userId));
    return m;
  });
}

export async function acceptInvite(inviteId: string, workspaceId: string, userId: string, role: RoleName): Promise<boolean> {
  return db.transaction(async (tx) => {
    const [used] = await tx
      .update(invites)
      .set({ acceptedAt: new Date() })
      .where(and(eq(invites.id, inviteId), isNull(invites.acceptedAt)))
      .returning({ id: invites.id });
    if (!used) return false;
    await tx.insert(memberships).values({ workspaceId, userId, role }).onConflictDoUpdate({
      target: [memberships.workspaceId, memberships.userId],
      set: { role },
    });
    return true;
  });
}

export async function myWorkspaces(userId: string) {
  return db
    .select({ id: workspaces.id, slug: workspaces.slug, name: workspaces.name, role: memberships.role })
    .from(memberships)
    .innerJoin(workspaces, eq(workspaces.id, memberships.workspaceId))
    .where(eq(memberships.userId, userId))
    .orderBy(asc(workspaces.name));
}

/** Revokes a pending invitation of this workspace; used, revoked or unknown ones are not found. */
export async function revokeInvite(workspaceId: string, inviteId: string) {
  const [row] = await db
    .update(invites)
    .set({ revokedAt: new Date() })
    .where(and(eq(invites.workspaceId, workspaceId), eq(invites.id, inviteId), isNull(invites.acceptedAt), isNull(invites.revokedAt)))
    .returning();
  if (!row) throw new AppError("not_found", "No pending invitation with that id in this workspace.");
  return row;
}
