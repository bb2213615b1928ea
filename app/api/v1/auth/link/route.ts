import { route } from "@/lib/api";
import { appLink, sendMail } from "@/lib/mail";
import { emailOnlySchema } from "@/features/auth/schema";
import { findUserByEmail, issueEmailToken, LINK_MINUTES } from "@/features/auth/queries";

/** Sends a one-time sign-in link. Answers the same whether or not the address has an account. */
export const POST = route({
  public: true,
  body: emailOnlySchema,
  handler: async ({ body }) => {
    const user = await findUserByEmail(body.email);
    if (user) {
      const token = await issueEmailToken(user.id, "signin_link");
      const link = appLink(`/signin/link?token=${encodeURIComponent(token)}`);
      await sendMail({
        to: user.email,
        subject: "Your Rimeplan sign-in link",
        text: `Sign in to Rimeplan: ${link}\n\nThe link works once and expires in ${LINK_MINUTES} minutes. If you did not ask for it, ignore this message.`,
      });
    }
    return { ok: true, message: "If that address has an account, a sign-in link is on its way." };
  },
});
