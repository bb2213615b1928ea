import { z } from "zod";
import { route } from "@/lib/api";
import { audit } from "@/lib/audit";
import { revokeInvite } from "@/features/team/queries";

/** Revokes a pending invitation (owner): its link stops working at once. */
export const DELETE = route({
  params: z.object({ ws: z.string().min(1), inviteId: z.string().uuid("Invitation id must be a UUID") }),
  action: "members.invite",
  handler: async ({ access, user, params }) => {
    const inv = await revokeInvite(access!.workspace.id, params.inviteId);
    await audit({ workspaceId: access!.workspace.id, actorId: user.id, actorEmail: user.email, action: "member.invite_revoked", targetType: "invite", targetId: inv.id, detail: { email: inv.email, role: inv.role } });
    return { ok: true };
  },
});
