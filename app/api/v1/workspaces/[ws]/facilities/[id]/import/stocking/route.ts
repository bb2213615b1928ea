import { route } from "@/lib/api";
import { facilityParams } from "@/features/facilities/schema";
import { importStocking, MAX_IMPORT_REQUEST_BYTES, readUpload } from "@/features/import/queries";

/** Stocking plan from .xlsx or .csv: mode=preview, or mode=commit to save it as one stocking check. */
export const POST = route({
  params: facilityParams,
  action: "scenario.create",
  upload: { maxBytes: MAX_IMPORT_REQUEST_BYTES, what: "The upload" },
  handler: async ({ access, user, params, req, upload }) => importStocking(access!.workspace.id, params.id, user, await readUpload(req, upload!)),
});
