import { pageAccess } from "@/lib/page-access";
import { can } from "@/lib/authz";
import { Forbidden } from "@/components/layout/forbidden";
import { TeamPanel } from "@/features/team/components/team-panel";

export const metadata = { title: "Team" };

export default async function TeamPage({ params }: PageProps<"/w/[ws]/team">) {
  const { ws } = await params;
  const a = await pageAccess(ws, "members.read");
  if (!a.ok) return <Forbidden message={a.message} />;
  return <TeamPanel ws={ws} canManage={can(a.access.role, "members.invite")} myId={a.user.id} />;
}
