import { route } from "@/lib/api";
import { scenarioParams } from "@/features/stocking-check/schema";
import { getScenario } from "@/features/stocking-check/queries";

export const GET = route({
  params: scenarioParams,
  action: "facility.read",
  handler: async ({ access, params }) => getScenario(access!.workspace.id, params.id, params.sid),
});
