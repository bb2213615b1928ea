import { pageAccess } from "@/lib/page-access";
import { can } from "@/lib/authz";
import { Forbidden } from "@/components/layout/forbidden";
import { loadFacilityModel } from "@/features/facilities/model";
import { getLayout } from "@/features/layout-canvas/queries";
import { CanvasEditor } from "@/features/layout-canvas";
import type { CanvasDoc } from "@/features/layout-canvas";

export const metadata = { title: "Layout" };

export default async function LayoutPage({ params }: { params: Promise<{ ws: string; id: string }> }) {
  const { ws, id } = await params;
  const a = await pageAccess(ws, "facility.read");
  if (!a.ok) return <Forbidden message={a.message} />;
  const m = await loadFacilityModel(a.access.workspace.id, id);
  const layout = await getLayout(m.row.id);
  const doc = { ...m.doc, plant: m.doc.plant ?? {} } as unknown as CanvasDoc;
  return (
    <CanvasEditor
      ws={ws}
      facilityId={m.row.id}
      initial={{ version: m.version, doc, site: m.site }}
      layout={layout}
      canEdit={can(a.access.role, "model.edit")}
      role={a.access.role}
      unitSystem={a.user.unitSystem}
    />
  );
}
