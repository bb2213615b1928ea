import { z } from "zod";
import { route } from "@/lib/api";
import { listAudit } from "@/features/audit/queries";

export const GET = route({
  params: z.object({ ws: z.string().min(1) }),
  query: z.object({
    before: z.coerce
      .number({ error: "before must be an audit entry id" })
      .int("before must be a whole number")
      .positive("before must be 1 or more")
      .max(Number.MAX_SAFE_INTEGER, `before must be at most ${Number.MAX_SAFE_INTEGER}`)
      .optional(),
    limit: z.coerce.number().int().min(1, "limit must be between 1 and 500").max(500, "limit must be between 1 and 500").default(100),
  }),
  action: "audit.read",
  handler: async ({ access, query }) => {
    const rows = await listAudit(access!.workspace.id, query);
    return { entries: rows.map((r) => ({ ...r, at: r.at.toISOString() })) };
  },
});
