import { route } from "@/lib/api";
import { audit } from "@/lib/audit";
import { archiveFacilitySchema, facilityParams } from "@/features/facilities/schema";
import { setArchived } from "@/features/facilities/queries";

export const POST = route({
  params: facilityParams,
  body: archiveFacilitySchema,
  action: "facility.archive",
  handler: async ({ access, user, params, body }) => {
    const f = await setArchived(access!.workspace.id, params.id, body.archived);
    await audit({ workspaceId: access!.workspace.id, actorId: user.id, actorEmail: user.email, action: body.archived ? "facility.archived" : "facility.restored", targetType: "facility", targetId: f.id, detail: { name: f.name } });
    return { facility: f };
  },
});
