import { route, created } from "@/lib/api";
import { audit } from "@/lib/audit";
import { appLink, sendMail } from "@/lib/mail";
import { takeMail } from "@/lib/throttle";
import { wsParams } from "@/features/facilities/schema";
import { inviteSchema } from "@/features/team/schema";
import { createInvite, INVITE_DAYS } from "@/features/team/queries";
import { ROLE_SUMMARY } from "@/features/team/roles";

export const POST = route({
  params: wsParams,
  body: inviteSchema,
  action: "members.invite",
  handler: async ({ access, user, body }) => {
    await takeMail(user.id, access!.workspace.id, 1);
    const { invite, token } = await createInvite(access!.workspace.id, user.id, body.email, body.role);
    const link = appLink(`/invite?token=${encodeURIComponent(token)}`);
    await sendMail({
      to: body.email,
      subject: `${user.name} invited you to ${access!.workspace.name} on Rimeplan`,
      text:
        `${user.name} (${user.email}) invited you to the workspace "${access!.workspace.name}" as ${body.role}: ` +
        `${ROLE_SUMMARY[body.role]}.\n\nAccept the invitation: ${link}\n\nThe link works once and expires in ${INVITE_DAYS} days.`,
    }, { workspaceId: access!.workspace.id, userId: user.id });
    await audit({ workspaceId: access!.workspace.id, actorId: user.id, actorEmail: user.email, action: "member.invited", targetType: "invite", targetId: invite.id, detail: { email: body.email, role: body.role } });
    return created({ invite: { id: invite.id, email: invite.email, role: invite.role, expiresAt: invite.expiresAt.toISOString() } });
  },
});
