import { created, route } from "@/lib/api";
import { facilityParams } from "@/features/facilities/schema";
import { getFacilityRow } from "@/features/facilities/queries";
import { createScenarioSchema } from "@/features/stocking-check/schema";
import { createScenario, listScenarios } from "@/features/stocking-check/queries";

/** Stocking checks of a facility, newest first; 404 for a facility not in this workspace (not an empty list). */
export const GET = route({
  params: facilityParams,
  action: "facility.read",
  handler: async ({ access, params }) => {
    const f = await getFacilityRow(access!.workspace.id, params.id);
    return { scenarios: await listScenarios(access!.workspace.id, f.id) };
  },
});

/** Runs a stocking check against the current model and saves it with its verdict. */
export const POST = route({
  params: facilityParams,
  action: "scenario.create",
  body: createScenarioSchema,
  handler: async ({ access, user, params, body }) => created(await createScenario(access!.workspace.id, params.id, user.id, body)),
});
