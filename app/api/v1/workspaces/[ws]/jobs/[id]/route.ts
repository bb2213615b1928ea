import { route } from "@/lib/api";
import { jobParams } from "@/features/jobs/schema";
import { jobDto, jobFor } from "@/features/jobs/queries";

/** A job's status, progress, stage, error and result; seen by the roles that may do its work. */
export const GET = route({
  params: jobParams,
  action: "workspace.read",
  handler: async ({ access, params }) => ({ job: jobDto(access!.workspace.slug, await jobFor(access!, params.id, false)) }),
});
