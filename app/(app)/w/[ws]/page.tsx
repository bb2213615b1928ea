import { pageAccess } from "@/lib/page-access";
import { can } from "@/lib/authz";
import { Forbidden } from "@/components/layout/forbidden";
import { FacilityList } from "@/features/facilities/components/facility-list";

export const metadata = { title: "Facilities" };

export default async function FacilitiesPage({ params }: PageProps<"/w/[ws]">) {
  const { ws } = await params;
  const a = await pageAccess(ws, "facility.read");
  if (!a.ok) return <Forbidden message={a.message} />;
  return <FacilityList ws={ws} canEdit={can(a.access.role, "facility.create")} unitSystem={a.user.unitSystem} />;
}
