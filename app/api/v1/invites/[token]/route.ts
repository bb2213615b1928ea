import { z } from "zod";
import { route } from "@/lib/api";
import { AppError } from "@/lib/errors";
import { findOpenInvite } from "@/features/team/queries";
import { findUserByEmail } from "@/features/auth/queries";

export const GET = route({
  public: true,
  params: z.object({ token: z.string().min(20).max(200) }),
  handler: async ({ params }) => {
    const found = await findOpenInvite(params.token);
    if (!found) throw new AppError("invalid_token", "This invitation is invalid, used, revoked or expired.", "token");
    const existing = await findUserByEmail(found.invite.email);
    return {
      invite: { email: found.invite.email, role: found.invite.role, workspace: found.workspaceName, hasAccount: !!existing },
    };
  },
});
