import { pageAccess } from "@/lib/page-access";
import { can } from "@/lib/authz";
import { Forbidden } from "@/components/layout/forbidden";
import { getWorkspaceSettings } from "@/features/team/settings";
import { WorkspaceSettingsForm } from "@/features/team/components/workspace-settings";

export const metadata = { title: "Workspace settings" };

export default async function WorkspaceSettingsPage({ params }: PageProps<"/w/[ws]/settings">) {
  const { ws } = await params;
  const a = await pageAccess(ws, "workspace.read");
  if (!a.ok) return <Forbidden message={a.message} />;
  const settings = await getWorkspaceSettings(a.access.workspace.id);
  return (
    <main className="p-4">
      <WorkspaceSettingsForm ws={ws} initial={settings} canEdit={can(a.access.role, "workspace.settings")} />
    </main>
  );
}
