import "server-only";
import { and, desc, eq, inArray, isNull, lt, or } from "drizzle-orm";
import { db } from "@/db/client";
import { auditLog, memberships } from "@/db/schema";

/**
 * A workspace's audit entries, newest first: its own records, plus sign-ins (which belong to
 * no workspace) of its current members.
 */
export async function listAudit(workspaceId: string, opts: { before?: number; limit: number }) {
  return db
    .select()
    .from(auditLog)
    .where(
      and(
        or(
          eq(auditLog.workspaceId, workspaceId),
          and(
            isNull(auditLog.workspaceId),
            inArray(auditLog.actorId, db.select({ id: memberships.userId }).from(memberships).where(eq(memberships.workspaceId, workspaceId))),
          ),
        ),
        opts.before ? lt(auditLog.id, opts.before) : undefined,
      ),
    )
    .orderBy(desc(auditLog.id))
    .limit(opts.limit);
}
