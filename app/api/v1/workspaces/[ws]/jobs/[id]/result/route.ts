import { route } from "@/lib/api";
import { AppError } from "@/lib/errors";
import { jobParams } from "@/features/jobs/schema";
import { jobFor } from "@/features/jobs/queries";

/** The file a finished job made (an export), as a download. */
export const GET = route({
  params: jobParams,
  action: "workspace.read",
  handler: async ({ access, params }) => {
    const j = await jobFor(access!, params.id, true);
    if (j.status === "failed") throw new AppError("conflict", `This job failed, so there is nothing to download: ${j.error ?? "no reason was recorded"}`);
    if (j.status !== "done") throw new AppError("conflict", `This job is not finished yet (${j.status}); download it when it is done.`);
    if (!j.resultBytes || !j.resultName) throw new AppError("not_found", "This job made no file to download.");
    const name = j.resultName.replace(/["\\\r\n]/g, "_");
    return new Response(new Uint8Array(j.resultBytes), {
      headers: {
        "content-type": j.resultMime ?? "application/octet-stream",
        "content-disposition": `attachment; filename="${name}"`,
        "cache-control": "private, no-store",
      },
    });
  },
});
