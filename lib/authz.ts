import "server-only";
import { and, eq, sql } from "drizzle-orm";
import { db } from "@/db/client";
import { memberships, workspaces } from "@/db/schema";
import { AppError } from "./errors";

/**
 * All authorization in one place. Route handlers and server actions call `authorize` with the
 * workspace and the action; the role is read from the database on every call, never from the
 * session token.
 */
export const ROLES = ["owner", "designer", "operations", "purchaser", "viewer"] as const;
export type Role = (typeof ROLES)[number];

export const ACTIONS = [
  "workspace.read",
  "workspace.settings", // currency
  "facility.read",
  "facility.create",
  "facility.update", // rename, site conditions
  "facility.duplicate",
  "facility.archive",
  "model.edit",
  "revision.issue",
  "scenario.create",
  "scenario.apply",
  "schedule.export",
  "members.read",
  "members.invite",
  "members.changeRole",
  "members.remove",
  "audit.read",
] as const;
export type Action = (typeof ACTIONS)[number];

const ALL: readonly Role[] = ROLES;
const DESIGN: readonly Role[] = ["owner", "designer"];

const POLICY: Record<Action, readonly Role[]> = {
  "workspace.read": ALL,
  "workspace.settings": ["owner"],
  "facility.read": ALL,
  "facility.create": DESIGN,
  "facility.update": DESIGN,
  "facility.duplicate": DESIGN,
  "facility.archive": DESIGN,
  "model.edit": DESIGN,
  "revision.issue": DESIGN,
  "scenario.create": ["owner", "designer", "operations"],
  "scenario.apply": DESIGN,
  "schedule.export": ["owner", "designer", "purchaser"],
  "members.read": ALL,
  "members.invite": ["owner"],
  "members.changeRole": ["owner"],
  "members.remove": ["owner"],
  "audit.read": ["owner"],
};

/** Whether a role may perform an action (pure; used by the UI to hide what the server refuses). */
export function can(role: Role, action: Action): boolean {
  return POLICY[action].includes(role);
}

const ACTION_WORDS: Record<Action, string> = {
  "workspace.read": "open this workspace",
  "workspace.settings": "change the workspace's settings",
  "facility.read": "read facilities",
  "facility.create": "create facilities",
  "facility.update": "change a facility",
  "facility.duplicate": "duplicate a facility",
  "facility.archive": "archive a facility",
  "model.edit": "edit the model",
  "revision.issue": "issue a revision",
  "scenario.create": "create stocking checks",
  "scenario.apply": "apply a stocking check to the model",
  "schedule.export": "export the equipment schedule",
  "members.read": "see the members",
  "members.invite": "invite people",
  "members.changeRole": "change roles",
  "members.remove": "remove members",
  "audit.read": "read the audit log",
};

export interface WorkspaceAccess {
  workspace: { id: string; slug: string; name: string };
  role: Role;
}

/** Asked on every workspace request: a prepared statement, parsed and planned once per connection. */
const membershipOf = db
  .select({ id: workspaces.id, slug: workspaces.slug, name: workspaces.name, role: memberships.role })
  .from(memberships)
  .innerJoin(workspaces, eq(workspaces.id, memberships.workspaceId))
  .where(and(eq(memberships.userId, sql.placeholder("userId")), eq(workspaces.slug, sql.placeholder("slug"))))
  .limit(1)
  .prepare("rimeplan_membership_of");

/**
 * Loads the caller's membership of a workspace (by slug) and checks the action.
 * Not a member → not_found (the workspace's existence is not revealed); member without the
 * permission → forbidden, with a message that says which role may.
 */
export async function authorize(userId: string, workspaceSlug: string, action: Action): Promise<WorkspaceAccess> {
  // No slug holds a NUL (PostgreSQL text cannot): such a page address names no workspace.
  if (workspaceSlug.includes("\0")) throw new AppError("not_found", "Workspace not found, or you are not a member of it.");
  const rows = await membershipOf.execute({ userId, slug: workspaceSlug });
  const row = rows[0];
  if (!row) throw new AppError("not_found", "Workspace not found, or you are not a member of it.");
  if (!can(row.role, action)) {
    const allowed = POLICY[action].join(", ");
    throw new AppError(
      "forbidden",
      `Your role (${row.role}) may not ${ACTION_WORDS[action]}. Allowed roles: ${allowed}.`,
    );
  }
  return { workspace: { id: row.id, slug: row.slug, name: row.name }, role: row.role };
}
