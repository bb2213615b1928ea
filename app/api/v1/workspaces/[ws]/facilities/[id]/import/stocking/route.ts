import { route } from "@/lib/api";
import { facilityParams } from "@/features/facilities/schema";
import { importStocking, readUpload } from "@/features/import/queries";

/** Stocking plan from .xlsx or .csv: mode=preview, or mode=commit to save it as one stocking check. */
export const POST = route({
  params: facilityParams,
  action: "scenario.create",
  handler: async ({ access, user, params, req }) => importStocking(access!.workspace.id, params.id, user, await readUpload(req)),
});
