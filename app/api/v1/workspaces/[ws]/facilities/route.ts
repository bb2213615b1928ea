import { route, created } from "@/lib/api";
import { audit } from "@/lib/audit";
import { createFacilitySchema, listFacilitiesQuery, wsParams } from "@/features/facilities/schema";
import { createFacility, listFacilities } from "@/features/facilities/queries";

export const GET = route({
  params: wsParams,
  query: listFacilitiesQuery,
  action: "facility.read",
  handler: async ({ access, query }) => ({ facilities: await listFacilities(access!.workspace.id, query.archived === "1") }),
});

export const POST = route({
  params: wsParams,
  body: createFacilitySchema,
  action: "facility.create",
  handler: async ({ access, user, body }) => {
    const f = await createFacility(access!.workspace.id, user.id, body);
    await audit({ workspaceId: access!.workspace.id, actorId: user.id, actorEmail: user.email, action: "facility.created", targetType: "facility", targetId: f.id, detail: { name: f.name } });
    return created({ facility: f });
  },
});
