import { route } from "@/lib/api";
import { scenarioParams } from "@/features/stocking-check/schema";
import { acceptScenario } from "@/features/stocking-check/queries";

export const POST = route({
  params: scenarioParams,
  action: "scenario.create",
  handler: async ({ access, params }) => acceptScenario(access!.workspace.id, params.id, params.sid),
});
