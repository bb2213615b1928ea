import { route } from "@/lib/api";
import { facilityParams } from "@/features/facilities/schema";
import { accepted } from "@/features/jobs/queries";
import { energyView } from "@/features/energy/queries";
import { requestAnnualRun } from "@/features/energy/runs";

/** The facility's year: weather source, the newest stored result with its stamps, whether it is stale, a run in progress. */
export const GET = route({
  params: facilityParams,
  action: "facility.read",
  handler: async ({ access, params }) => energyView(access!, params.id),
});

/** Runs the year again on the worker (202 with the job); a run already queued for this model and weather is returned instead. */
export const POST = route({
  params: facilityParams,
  action: "model.edit",
  handler: async ({ access, user, params }) => {
    const job = await requestAnnualRun({ workspaceId: access!.workspace.id, facilityId: params.id, userId: user.id, reason: "asked by a designer", required: true });
    return accepted(access!.workspace.slug, job!);
  },
});
