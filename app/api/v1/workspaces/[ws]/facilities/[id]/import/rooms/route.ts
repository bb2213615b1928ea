import { route } from "@/lib/api";
import { facilityParams } from "@/features/facilities/schema";
import { importRooms, MAX_IMPORT_REQUEST_BYTES, readUpload } from "@/features/import/queries";

/** Room list from .xlsx or .csv: mode=preview (nothing changes) or mode=commit (all rows or none). */
export const POST = route({
  params: facilityParams,
  action: "model.edit",
  upload: { maxBytes: MAX_IMPORT_REQUEST_BYTES, what: "The upload" },
  handler: async ({ access, user, params, req, upload }) => importRooms(access!.workspace.id, params.id, user, await readUpload(req, upload!)),
});
