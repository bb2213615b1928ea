import { route } from "@/lib/api";
import { facilityParams } from "@/features/facilities/schema";
import { importRooms, readUpload } from "@/features/import/queries";

/** Room list from .xlsx or .csv: mode=preview (nothing changes) or mode=commit (all rows or none). */
export const POST = route({
  params: facilityParams,
  action: "model.edit",
  handler: async ({ access, user, params, req }) => importRooms(access!.workspace.id, params.id, user, await readUpload(req)),
});
