import { route } from "@/lib/api";
import { emailOnlySchema } from "@/features/auth/schema";
import { mailTokenLink } from "@/features/auth/queries";
import { clientAddress } from "@/lib/client-address";
import { takeLinkRequest } from "@/lib/throttle";

/** Sends a one-time sign-in link; answers the same whether or not the address has an account. */
export const POST = route({
  public: true,
  body: emailOnlySchema,
  handler: async ({ req, body }) => {
    // counted whether or not the address has an account, so a refusal reveals nothing either
    await takeLinkRequest(body.email, clientAddress(req.headers));
    return mailTokenLink(body.email, "signin_link");
  },
});
