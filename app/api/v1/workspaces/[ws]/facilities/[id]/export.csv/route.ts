import { route } from "@/lib/api";
import { facilityParams } from "@/features/facilities/schema";
import { prepareExport } from "@/features/schedule/queries";
import { scheduleCsv } from "@/features/schedule/workbook";

/** The equipment schedule as CSV; the export is recorded. */
export const GET = route({
  params: facilityParams,
  action: "schedule.export",
  handler: async ({ access, user, params }) => {
    const p = await prepareExport({ workspaceId: access!.workspace.id, facilityId: params.id, user, kind: "schedule.csv" });
    const csv = scheduleCsv(p.input);
    await p.record();
    return new Response(csv, {
      headers: {
        "content-type": "text/csv; charset=utf-8",
        "content-disposition": `attachment; filename="${p.fileBase}.csv"`,
        "cache-control": "no-store",
      },
    });
  },
});
