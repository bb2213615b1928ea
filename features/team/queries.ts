import "server-only";
import { and, asc, count, eq, gt, isNull, sql } from "drizzle-orm";
import { db } from "@/db/client";
import { invites, memberships, sessions, users, workspaces } from "@/db/schema";
import bcrypt from "bcryptjs";
import { AppError } from "@/lib/errors";
import { audit } from "@/lib/audit";
import { hashPassword } from "@/features/auth/queries";
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

/**
 * Accepts an invitation in one transaction holding the invitation's row lock, so parallel
 * accepts are taken one at a time: the first creates the account (for a new person) and the
 * membership and marks the invitation used; the others find it used and get a 409.
 * A new person gives a name and password; an existing account proves itself by being signed
 * in as the invited address or by its password.
 */
export async function acceptInvite(args: { token: string; name?: string; password?: string; signedInUserId: string | null }) {
  return db.transaction(async (tx) => {
    const [found] = await tx
      .select({ invite: invites, workspaceSlug: workspaces.slug })
      .from(invites)
      .innerJoin(workspaces, eq(workspaces.id, invites.workspaceId))
      .where(eq(invites.tokenHash, hashToken(args.token)))
      .for("update", { of: invites });
    if (!found || found.invite.revokedAt || found.invite.expiresAt <= new Date())
      throw new AppError("invalid_token", "This invitation is invalid, used, revoked or expired.", "token");
    const { invite } = found;
    if (invite.acceptedAt) throw new AppError("conflict", "This invitation was already accepted; sign in to use the workspace.", "token");
    let [account] = await tx.select().from(users).where(eq(users.email, invite.email)).limit(1);
    if (account) {
      const signedInAsInvitee = args.signedInUserId === account.id;
      const passwordOk = !!args.password && !!account.passwordHash && (await bcrypt.compare(args.password, account.passwordHash));
      if (!signedInAsInvitee && !passwordOk) throw new AppError("validation", `Enter the password of the existing account ${invite.email}.`, "password");
    } else {
      if (!args.name) throw new AppError("validation", "Name is required (1 to 80 characters)", "name");
      if (!args.password) throw new AppError("validation", "Password must be at least 10 characters", "password");
      [account] = await tx.insert(users).values({ email: invite.email, name: args.name, passwordHash: await hashPassword(args.password) }).returning();
    }
    await tx.update(invites).set({ acceptedAt: new Date() }).where(eq(invites.id, invite.id));
    await tx.insert(memberships).values({ workspaceId: invite.workspaceId, userId: account.id, role: invite.role }).onConflictDoUpdate({
      target: [memberships.workspaceId, memberships.userId],
      set: { role: invite.role },
    });
    await audit(
      { workspaceId: invite.workspaceId, actorId: account.id, actorEmail: account.email, action: "member.joined", targetType: "invite", targetId: invite.id, detail: { role: invite.role } },
      tx,
    );
    return { ok: true, workspace: found.workspaceSlug, email: account.email };
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
