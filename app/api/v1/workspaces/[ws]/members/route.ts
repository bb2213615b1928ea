import { route } from "@/lib/api";
import { can } from "@/lib/authz";
import { wsParams } from "@/features/facilities/schema";
import { listMembers, listOpenInvites } from "@/features/team/queries";

export const GET = route({
  params: wsParams,
  action: "members.read",
  handler: async ({ access }) => ({
    members: await listMembers(access!.workspace.id),
    // Pending invites (and their addresses) are for owners only.
    invites: can(access!.role, "members.invite") ? await listOpenInvites(access!.workspace.id) : [],
  }),
});
