import { route } from "@/lib/api";
import { facilityParams } from "@/features/facilities/schema";
import { importRooms, MAX_IMPORT_REQUEST_BYTES, readUpload } from "@/features/import/queries";
import { enqueueImport } from "@/features/import/job";
import { accepted } from "@/features/jobs/queries";

/**
 * Room list from .xlsx or .csv: mode=preview answers the checked rows now (nothing changes);
 * mode=commit queues the import as a job (202 with the job: all rows or none).
 */
export const POST = route({
  params: facilityParams,
  action: "model.edit",
  upload: { maxBytes: MAX_IMPORT_REQUEST_BYTES, what: "The upload" },
  handler: async ({ access, user, params, req, upload: raw }) => {
    const upload = await readUpload(req, raw!);
    if (upload.mode === "preview") return importRooms(access!.workspace.id, params.id, user, upload);
    return accepted(access!.workspace.slug, await enqueueImport({ kind: "rooms", workspaceId: access!.workspace.id, facilityId: params.id, userId: user.id, upload }));
  },
});
