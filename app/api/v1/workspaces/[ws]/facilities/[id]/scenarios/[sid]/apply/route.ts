import { route } from "@/lib/api";
import { scenarioParams } from "@/features/stocking-check/schema";
import { applyScenario } from "@/features/stocking-check/queries";

/** Applies an accepted stocking check to the model as a new version (designers and owners). */
export const POST = route({
  params: scenarioParams,
  action: "scenario.apply",
  handler: async ({ access, user, params }) =>
    applyScenario({ workspaceId: access!.workspace.id, facilityId: params.id, id: params.sid, userId: user.id, userEmail: user.email }),
});
