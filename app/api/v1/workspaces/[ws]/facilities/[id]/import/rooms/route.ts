import { route } from "@/lib/api";
import { facilityParams } from "@/features/facilities/schema";
import { importRooms, readUpload } from "@/features/import/queries";
import { enqueueImport } from "@/features/import/job";
import { accepted } from "@/features/jobs/queries";

/**
 * Room list from .xlsx or .csv: mode=preview answers the checked rows now (nothing changes);
 * mode=commit queues the import as a job (202 with the job: all rows or none).
 */
export const POST = route({
  params: facilityParams,
  action: "model.edit",
  handler: async ({ access, user, params, req }) => {
    const upload = await readUpload(req);
    if (upload.mode === "preview") return importRooms(access!.workspace.id, params.id, user, upload);
    return accepted(access!.workspace.slug, await enqueueImport({ kind: "rooms", workspaceId: access!.workspace.id, facilityId: params.id, userId: user.id, upload }));
  },
});
