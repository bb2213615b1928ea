import { route, created } from "@/lib/api";
import { audit } from "@/lib/audit";
import { duplicateFacilitySchema, facilityParams } from "@/features/facilities/schema";
import { duplicateFacility } from "@/features/facilities/queries";

export const POST = route({
  params: facilityParams,
  body: duplicateFacilitySchema,
  action: "facility.duplicate",
  handler: async ({ access, user, params, body }) => {
    const f = await duplicateFacility(access!.workspace.id, user.id, params.id, body.name);
    await audit({ workspaceId: access!.workspace.id, actorId: user.id, actorEmail: user.email, action: "facility.duplicated", targetType: "facility", targetId: f.id, detail: { from: params.id, name: f.name } });
    return created({ facility: f });
  },
});
