import { findOpenInvite } from "@/features/team/queries";
import { findUserByEmail } from "@/features/auth/queries";
import { AcceptInviteForm } from "@/features/team/components/accept-invite-form";

export const metadata = { title: "Join a workspace" };

export default async function InvitePage({ searchParams }: PageProps<"/invite">) {
  const sp = await searchParams;
  const token = typeof sp.token === "string" ? sp.token : "";
  const found = token ? await findOpenInvite(token) : null;
  if (!found)
    return (
      <div className="flex flex-col gap-3">
        <h1 className="text-lg font-semibold">Invitation not valid</h1>
        <p role="alert" className="text-sm text-danger">
          ⚠ This invitation is invalid, already used, revoked or expired. Ask the workspace owner for a new one.
        </p>
      </div>
    );
  const hasAccount = !!(await findUserByEmail(found.invite.email));
  return (
    <AcceptInviteForm
      token={token}
      email={found.invite.email}
      role={found.invite.role}
      workspace={found.workspaceName}
      hasAccount={hasAccount}
    />
  );
}
