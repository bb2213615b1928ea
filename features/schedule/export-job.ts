import "server-only";
import { and, eq } from "drizzle-orm";
import { db } from "@/db/client";
import { memberships, users } from "@/db/schema";
import { can } from "@/lib/authz";
import { AppError } from "@/lib/errors";
import type { JobContext, JobOutput } from "@/lib/jobs/worker";
import { prepareExport } from "./queries";
import { scheduleCsv, workbookBuffer } from "./workbook";

export type ExportFormat = "xlsx" | "csv";

const MIME: Record<ExportFormat, string> = {
  xlsx: "application/vnd.openxmlformats-officedocument.spreadsheetml.sheet",
  csv: "text/csv; charset=utf-8",
};

/**
 * The "schedule.export" job: computes the schedule of the facility's current version, writes
 * the workbook or CSV, and records the export (exports log, audit) as the person who asked.
 * The permission is checked again here: a role taken away while the job waited is respected.
 */
export async function runScheduleExport(ctx: JobContext): Promise<JobOutput> {
  const { job } = ctx;
  const format = (job.input as { format?: string }).format;
  if (format !== "xlsx" && format !== "csv") throw new AppError("validation", `Unknown export format "${String(format)}": xlsx or csv.`, "format");
  if (!job.workspaceId || !job.facilityId || !job.createdBy) throw new AppError("not_found", "The export has no facility or requester any more.");
  const [who] = await db
    .select({ id: users.id, email: users.email, name: users.name, unitSystem: users.unitSystem, role: memberships.role })
    .from(users)
    .innerJoin(memberships, and(eq(memberships.userId, users.id), eq(memberships.workspaceId, job.workspaceId)))
    .where(eq(users.id, job.createdBy))
    .limit(1);
  if (!who || !can(who.role, "schedule.export")) throw new AppError("forbidden", "The person who asked for this export may no longer export the equipment schedule.");

  await ctx.progress(0.1, "Computing room loads, circuits and the equipment schedule");
  const p = await prepareExport({ workspaceId: job.workspaceId, facilityId: job.facilityId, user: who, kind: `schedule.${format}` });
  const n = p.input.schedule.length;
  await ctx.progress(0.55, format === "xlsx" ? `Writing the workbook: ${n} items on 5 sheets${p.input.options ? `, ${p.input.options.comparison.options.length} plants on 4 option sheets` : ""}` : `Writing the CSV: ${n} items`);
  const bytes = format === "xlsx" ? await workbookBuffer(p.input) : Buffer.from(scheduleCsv(p.input), "utf8");
  await ctx.progress(0.9, "Recording the export");
  await p.record();
  return {
    file: { name: `${p.fileBase}.${format}`, mime: MIME[format], bytes },
    json: { format, items: n, revision: p.input.revision.number },
    stage: `Ready: ${n} items exported as .${format}; the export is recorded.`,
  };
}
