import { z } from "zod";
import { and, desc, eq, inArray, isNull, lt, or } from "drizzle-orm";
import { route } from "@/lib/api";
import { db } from "@/db/client";
import { auditLog, memberships } from "@/db/schema";

export const GET = route({
  params: z.object({ ws: z.string().min(1) }),
  query: z.object({
    before: z.coerce.number().int().positive().optional(),
    limit: z.coerce.number().int().min(1, "limit must be between 1 and 500").max(500, "limit must be between 1 and 500").default(100),
  }),
  action: "audit.read",
  handler: async ({ access, query }) => {
    const rows = await db
      .select()
      .from(auditLog)
      .where(
        and(
          or(
            eq(auditLog.workspaceId, access!.workspace.id),
            // Sign-ins belong to no workspace: show those of this workspace's members.
            and(
              isNull(auditLog.workspaceId),
              inArray(
                auditLog.actorId,
                db.select({ id: memberships.userId }).from(memberships).where(eq(memberships.workspaceId, access!.workspace.id)),
              ),
            ),
          ),
          query.before ? lt(auditLog.id, query.before) : undefined,
        ),
      )
      .orderBy(desc(auditLog.id))
      .limit(query.limit);
    return { entries: rows.map((r) => ({ ...r, at: r.at.toISOString() })) };
  },
});
