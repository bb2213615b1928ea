import { route } from "@/lib/api";
import { appLink, sendMail } from "@/lib/mail";
import { emailOnlySchema } from "@/features/auth/schema";
import { findUserByEmail, issueEmailToken, RESET_MINUTES } from "@/features/auth/queries";

/** Sends a password-reset link. Answers the same whether or not the address has an account. */
export const POST = route({
  public: true,
  body: emailOnlySchema,
  handler: async ({ body }) => {
    const user = await findUserByEmail(body.email);
    if (user) {
      const token = await issueEmailToken(user.id, "password_reset");
      const link = appLink(`/reset?token=${encodeURIComponent(token)}`);
      await sendMail({
        to: user.email,
        subject: "Reset your Rimeplan password",
        text: `Choose a new password: ${link}\n\nThe link works once and expires in ${RESET_MINUTES} minutes. Resetting signs you out everywhere. If you did not ask for it, ignore this message.`,
      });
    }
    return { ok: true, message: "If that address has an account, a reset link is on its way." };
  },
});
