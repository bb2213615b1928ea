import { route } from "@/lib/api";
import { audit } from "@/lib/audit";
import { facilityParams, updateFacilitySchema } from "@/features/facilities/schema";
import { getFacilityRow, toDto, updateFacility } from "@/features/facilities/queries";

export const GET = route({
  params: facilityParams,
  action: "facility.read",
  handler: async ({ access, params }) => ({ facility: toDto(await getFacilityRow(access!.workspace.id, params.id)) }),
});

export const PATCH = route({
  params: facilityParams,
  body: updateFacilitySchema,
  action: "facility.update",
  handler: async ({ access, user, params, body }) => {
    const f = await updateFacility(access!.workspace.id, params.id, body, user.id);
    await audit({ workspaceId: access!.workspace.id, actorId: user.id, actorEmail: user.email, action: "facility.updated", targetType: "facility", targetId: f.id, detail: { fields: Object.keys(body).filter((k) => k !== "baseVersion"), version: f.version } });
    return { facility: f };
  },
});
