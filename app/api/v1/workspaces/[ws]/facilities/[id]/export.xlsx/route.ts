import { route } from "@/lib/api";
import { facilityParams } from "@/features/facilities/schema";
import { prepareExport } from "@/features/schedule/queries";
import { workbookBuffer } from "@/features/schedule/workbook";

/** The Excel workbook (schedule, room loads, circuits, state points, design basis); the export is recorded. */
export const GET = route({
  params: facilityParams,
  action: "schedule.export",
  handler: async ({ access, user, params }) => {
    const p = await prepareExport({ workspaceId: access!.workspace.id, facilityId: params.id, user, kind: "schedule.xlsx" });
    const buf = await workbookBuffer(p.input);
    await p.record();
    return new Response(new Uint8Array(buf), {
      headers: {
        "content-type": "application/vnd.openxmlformats-officedocument.spreadsheetml.sheet",
        "content-disposition": `attachment; filename="${p.fileBase}.xlsx"`,
        "cache-control": "no-store",
      },
    });
  },
});
