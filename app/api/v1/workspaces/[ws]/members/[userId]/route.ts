import { route } from "@/lib/api";
import { audit } from "@/lib/audit";
import { changeRoleSchema, memberParams } from "@/features/team/schema";
import { changeRole, removeMember } from "@/features/team/queries";

export const PATCH = route({
  params: memberParams,
  body: changeRoleSchema,
  action: "members.changeRole",
  handler: async ({ access, user, params, body }) => {
    const r = await changeRole(access!.workspace.id, params.userId, body.role);
    await audit({ workspaceId: access!.workspace.id, actorId: user.id, actorEmail: user.email, action: "member.role_changed", targetType: "user", targetId: params.userId, detail: r });
    return { ok: true, role: r.to };
  },
});

export const DELETE = route({
  params: memberParams,
  action: "members.remove",
  handler: async ({ access, user, params }) => {
    const r = await removeMember(access!.workspace.id, params.userId);
    await audit({ workspaceId: access!.workspace.id, actorId: user.id, actorEmail: user.email, action: "member.removed", targetType: "user", targetId: params.userId, detail: r });
    return { ok: true };
  },
});
