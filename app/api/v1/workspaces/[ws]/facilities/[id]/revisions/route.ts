import { route } from "@/lib/api";
import { facilityParams } from "@/features/facilities/schema";
import { getFacilityRow } from "@/features/facilities/queries";
import { listRevisions } from "@/features/facilities/model";

export const GET = route({
  params: facilityParams,
  action: "facility.read",
  handler: async ({ access, params }) => {
    const f = await getFacilityRow(access!.workspace.id, params.id);
    const revs = await listRevisions(f.id);
    return {
      current: f.version,
      revisions: revs.map((r) => ({ ...r, createdAt: r.createdAt.toISOString(), issuedAt: r.issuedAt?.toISOString() ?? null, locked: r.issuedAt !== null })),
    };
  },
});
