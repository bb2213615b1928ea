import { route } from "@/lib/api";
import { facilityParams } from "@/features/facilities/schema";
import { importStocking, MAX_IMPORT_REQUEST_BYTES, readUpload } from "@/features/import/queries";
import { enqueueImport } from "@/features/import/job";
import { accepted } from "@/features/jobs/queries";

/**
 * Stocking plan from .xlsx or .csv: mode=preview answers the checked rows now; mode=commit
 * queues saving it as one stocking check (202 with the job).
 */
export const POST = route({
  params: facilityParams,
  action: "scenario.create",
  upload: { maxBytes: MAX_IMPORT_REQUEST_BYTES, what: "The upload" },
  handler: async ({ access, user, params, req, upload: raw }) => {
    const upload = await readUpload(req, raw!);
    if (upload.mode === "preview") return importStocking(access!.workspace.id, params.id, user, upload);
    return accepted(access!.workspace.slug, await enqueueImport({ kind: "stocking", workspaceId: access!.workspace.id, facilityId: params.id, userId: user.id, upload }));
  },
});
