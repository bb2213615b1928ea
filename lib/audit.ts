import "server-only";
import { db, type Db } from "@/db/client";
import { auditLog } from "@/db/schema";

export type AuditAction =
  | "auth.signin"
  | "auth.signin_failed"
  | "auth.signout"
  | "auth.password_reset"
  | "member.invited"
  | "member.invite_revoked"
  | "member.joined"
  | "member.role_changed"
  | "member.removed"
  | "facility.created"
  | "facility.updated"
  | "facility.duplicated"
  | "facility.archived"
  | "facility.restored"
  | "model.edited"
  | "revision.issued"
  | "scenario.applied"
  | "export.created"
  | "import.committed"
  | "workspace.updated"
  | "weather.stored";

/** Appends one audit record (the table refuses updates and deletes); inside `exec` when it is a transaction. */
export async function audit(entry: {
  workspaceId?: string | null;
  actorId?: string | null;
  actorEmail?: string | null;
  action: AuditAction;
  targetType?: string;
  targetId?: string;
  detail?: Record<string, unknown>;
}, exec: Pick<Db, "insert"> = db): Promise<void> {
  await exec.insert(auditLog).values({
    workspaceId: entry.workspaceId ?? null,
    actorId: entry.actorId ?? null,
    actorEmail: entry.actorEmail ?? null,
    action: entry.action,
    targetType: entry.targetType,
    targetId: entry.targetId,
    detail: entry.detail ?? {},
  });
}
