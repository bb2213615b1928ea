import { redirect } from "next/navigation";
import { requireUser } from "@/lib/session";
import { myWorkspaces } from "@/features/team/queries";

export default async function Home() {
  const user = await requireUser();
  const ws = await myWorkspaces(user.id);
  if (ws.length > 0) redirect(`/w/${ws[0].slug}`);
  return (
    <main className="mx-auto max-w-xl p-8">
      <h1 className="text-lg font-semibold">No workspace yet</h1>
      <p className="mt-2 text-sm text-muted">
        You are not a member of any workspace. Ask a workspace owner to invite you; the invitation arrives by e-mail.
      </p>
    </main>
  );
}
