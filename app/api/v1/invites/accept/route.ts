import { route } from "@/lib/api";
import { acceptInviteSchema } from "@/features/team/schema";
import { acceptInvite } from "@/features/team/queries";

/**
 * Accepts an invitation. A new person gives a name and password (an account is created for the
 * invited address); an existing account proves itself by being signed in as that address or by
 * its password. Parallel accepts of one invitation: one wins, the others get 409.
 */
export const POST = route({
  public: true,
  body: acceptInviteSchema,
  handler: async ({ body, user }) => acceptInvite({ token: body.token, name: body.name, password: body.password, signedInUserId: user?.id ?? null }),
});
