import { route } from "@/lib/api";
import { audit } from "@/lib/audit";
import { revisionParams } from "@/features/facilities/model-schema";
import { getFacilityRow } from "@/features/facilities/queries";
import { restoreRevision } from "@/features/facilities/model";
import { rerunAfterModelChange } from "@/features/energy/runs";

export const POST = route({
  params: revisionParams,
  action: "model.edit",
  handler: async ({ access, user, params }) => {
    const f = await getFacilityRow(access!.workspace.id, params.id);
    const r = await restoreRevision(access!.workspace.id, f.id, params.n, user.id);
    await audit({ workspaceId: access!.workspace.id, actorId: user.id, actorEmail: user.email, action: "model.edited", targetType: "facility", targetId: f.id, detail: { restoredRevision: params.n, version: r.version } });
    await rerunAfterModelChange(access!.workspace.id, f.id, user.id);
    return r;
  },
});
