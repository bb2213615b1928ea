import { MODEL_MAX_BODY_BYTES, route } from "@/lib/api";
import { can } from "@/lib/authz";
import { audit } from "@/lib/audit";
import { facilityParams } from "@/features/facilities/schema";
import { saveModelSchema } from "@/features/facilities/model-schema";
import { loadFacilityModel, saveFacilityModel } from "@/features/facilities/model";
import type { ModelDoc } from "@/features/facilities/engine-model";
import { rerunAfterModelChange } from "@/features/energy/runs";

export const GET = route({
  params: facilityParams,
  action: "facility.read",
  handler: async ({ access, params }) => {
    const m = await loadFacilityModel(access!.workspace.id, params.id);
    return { version: m.version, doc: m.doc, site: m.site, canEdit: can(access!.role, "model.edit") };
  },
});

export const PUT = route({
  params: facilityParams,
  body: saveModelSchema,
  maxBodyBytes: MODEL_MAX_BODY_BYTES,
  action: "model.edit",
  handler: async ({ access, user, params, body }) => {
    const r = await saveFacilityModel({
      workspaceId: access!.workspace.id,
      facilityId: params.id,
      userId: user.id,
      baseVersion: body.baseVersion,
      doc: body.doc as ModelDoc,
      summary: body.summary,
    });
    await audit({
      workspaceId: access!.workspace.id,
      actorId: user.id,
      actorEmail: user.email,
      action: "model.edited",
      targetType: "facility",
      targetId: params.id,
      detail: { version: r.version, baseVersion: body.baseVersion, rebased: r.rebased, summary: body.summary ?? null },
    });
    // A new version re-runs the facility's year on the worker (when it has a weather year).
    if (r.version !== body.baseVersion || r.rebased) await rerunAfterModelChange(access!.workspace.id, params.id, user.id);
    return r;
  },
});
