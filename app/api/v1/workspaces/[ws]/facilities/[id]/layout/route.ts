import { route } from "@/lib/api";
import { facilityParams } from "@/features/facilities/schema";
import { getFacilityRow } from "@/features/facilities/queries";
import { layoutPutSchema } from "@/features/layout-canvas/schema";
import { getLayout, putLayout } from "@/features/layout-canvas/queries";

/** Canvas node positions and viewport: kept apart from the engineering revisions. */
export const GET = route({
  params: facilityParams,
  action: "facility.read",
  handler: async ({ access, params }) => {
    const f = await getFacilityRow(access!.workspace.id, params.id);
    return { layout: await getLayout(f.id) };
  },
});

export const PUT = route({
  params: facilityParams,
  body: layoutPutSchema,
  action: "model.edit",
  handler: async ({ access, params, body }) => {
    const f = await getFacilityRow(access!.workspace.id, params.id);
    return { layout: await putLayout(f.id, body) };
  },
});
