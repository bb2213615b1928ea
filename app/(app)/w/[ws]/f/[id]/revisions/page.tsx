import { pageAccess } from "@/lib/page-access";
import { can } from "@/lib/authz";
import { Forbidden } from "@/components/layout/forbidden";
import { getFacilityRow } from "@/features/facilities/queries";
import { revisionHistory } from "@/features/revisions/queries";
import { RevisionsPanel } from "@/features/revisions";

export const metadata = { title: "Revisions" };

export default async function RevisionsPage({ params }: { params: Promise<{ ws: string; id: string }> }) {
  const { ws, id } = await params;
  const a = await pageAccess(ws, "facility.read");
  if (!a.ok) return <Forbidden message={a.message} />;
  const f = await getFacilityRow(a.access.workspace.id, id);
  const rows = await revisionHistory(f.id);
  return <RevisionsPanel ws={ws} facilityId={f.id} current={f.version} rows={rows} canRestore={can(a.access.role, "model.edit")} canIssue={can(a.access.role, "revision.issue")} />;
}
