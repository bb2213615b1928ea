import { route } from "@/lib/api";
import { emailOnlySchema } from "@/features/auth/schema";
import { mailTokenLink } from "@/features/auth/queries";

/** Sends a one-time password-reset link; answers the same whether or not the address has an account. */
export const POST = route({
  public: true,
  body: emailOnlySchema,
  handler: async ({ body }) => mailTokenLink(body.email, "password_reset"),
});
