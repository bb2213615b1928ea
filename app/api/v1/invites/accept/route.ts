import bcrypt from "bcryptjs";
import { route } from "@/lib/api";
import { AppError } from "@/lib/errors";
import { audit } from "@/lib/audit";
import { db } from "@/db/client";
import { users } from "@/db/schema";
import { acceptInviteSchema } from "@/features/team/schema";
import { acceptInvite, findOpenInvite } from "@/features/team/queries";
import { findUserByEmail, hashPassword } from "@/features/auth/queries";

/**
 * Accepts an invitation. A new person gives a name and password (an account is created for the
 * invited address); an existing account proves itself by being signed in as that address or by
 * its password.
 */
export const POST = route({
  public: true,
  body: acceptInviteSchema,
  handler: async ({ body, user }) => {
    const found = await findOpenInvite(body.token);
    if (!found) throw new AppError("invalid_token", "This invitation is invalid, used, revoked or expired.", "token");
    const { invite } = found;
    let account = await findUserByEmail(invite.email);
    if (account) {
      const signedInAsInvitee = user?.id === account.id;
      const passwordOk = !!body.password && !!account.passwordHash && (await bcrypt.compare(body.password, account.passwordHash));
      if (!signedInAsInvitee && !passwordOk) {
        throw new AppError("validation", `Enter the password of the existing account ${invite.email}.`, "password");
      }
    } else {
      if (!body.name) throw new AppError("validation", "Name is required (1 to 80 characters)", "name");
      if (!body.password) throw new AppError("validation", "Password must be at least 10 characters", "password");
      [account] = await db
        .insert(users)
        .values({ email: invite.email, name: body.name, passwordHash: await hashPassword(body.password) })
        .returning();
    }
    const ok = await acceptInvite(invite.id, invite.workspaceId, account.id, invite.role);
    if (!ok) throw new AppError("invalid_token", "This invitation was already used.", "token");
    await audit({ workspaceId: invite.workspaceId, actorId: account.id, actorEmail: account.email, action: "member.joined", targetType: "invite", targetId: invite.id, detail: { role: invite.role } });
    return { ok: true, workspace: found.workspaceSlug, email: account.email };
  },
});
