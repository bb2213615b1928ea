import { pageAccess } from "@/lib/page-access";
import { can } from "@/lib/authz";
import { Forbidden } from "@/components/layout/forbidden";
import { ImportPanel } from "@/features/import/components/import-panel";

export const metadata = { title: "Import from a spreadsheet" };

export default async function ImportPage({ params }: PageProps<"/w/[ws]/f/[id]/import">) {
  const { ws, id } = await params;
  const a = await pageAccess(ws, "facility.read");
  if (!a.ok) return <Forbidden message={a.message} />;
  const rooms = can(a.access.role, "model.edit");
  const stocking = can(a.access.role, "scenario.create");
  if (!rooms && !stocking) return <Forbidden message={`Your role (${a.access.role}) may not import room lists or stocking plans. Allowed roles: owner, designer (rooms); owner, designer, operations (stocking plans).`} />;
  return <ImportPanel ws={ws} facilityId={id} canImportRooms={rooms} canImportStocking={stocking} />;
}
