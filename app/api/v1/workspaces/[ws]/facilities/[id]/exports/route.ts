import { z } from "zod";
import { route } from "@/lib/api";
import { enqueue } from "@/lib/jobs/queue";
import { facilityParams } from "@/features/facilities/schema";
import { getFacilityRow } from "@/features/facilities/queries";
import { accepted } from "@/features/jobs/queries";

const exportBody = z.object({ format: z.enum(["xlsx", "csv"], "format must be \"xlsx\" or \"csv\"") }).strict();

/**
 * Starts an export of the equipment schedule (.xlsx or .csv) as a job: 202 with the job to
 * poll; its result is the file, and the export is recorded when it is made. The same person
 * asking again for the same format while theirs is still queued or running gets that job.
 */
export const POST = route({
  params: facilityParams,
  body: exportBody,
  action: "schedule.export",
  handler: async ({ access, user, params, body }) => {
    const ws = access!.workspace;
    await getFacilityRow(ws.id, params.id);
    const { job, reused } = await enqueue({
      kind: "schedule.export",
      workspaceId: ws.id,
      facilityId: params.id,
      createdBy: user.id,
      input: { format: body.format },
      dedupeKey: `${params.id}:${user.id}:${body.format}`,
      stage: "Waiting for a worker",
    });
    return accepted(ws.slug, job, reused);
  },
});
