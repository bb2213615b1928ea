import { route } from "@/lib/api";
import { facilityParams } from "@/features/facilities/schema";
import { computeFacilityResults, loadFacilityModel } from "@/features/facilities/model";

/** The server's results for the current version: ledger and plant, engine version, input hash. */
export const GET = route({
  params: facilityParams,
  action: "facility.read",
  handler: async ({ access, params }) => {
    const m = await loadFacilityModel(access!.workspace.id, params.id);
    const r = await computeFacilityResults(m.engineModel());
    return { version: m.version, ...r };
  },
});
