import { route } from "@/lib/api";
import { AppError } from "@/lib/errors";
import { audit } from "@/lib/audit";
import { consumeEmailToken } from "@/lib/email-tokens";
import { resetSchema } from "@/features/auth/schema";
import { setPassword } from "@/features/auth/queries";

export const POST = route({
  public: true,
  body: resetSchema,
  handler: async ({ body }) => {
    const userId = await consumeEmailToken(body.token, "password_reset");
    if (!userId) throw new AppError("invalid_token", "This reset link is invalid, used or expired. Ask for a new one.", "token");
    await setPassword(userId, body.password);
    await audit({ actorId: userId, action: "auth.password_reset" });
    return { ok: true };
  },
});
