import { pageAccess } from "@/lib/page-access";
import { can } from "@/lib/authz";
import { Forbidden } from "@/components/layout/forbidden";
import { getFacilityRow, toDto } from "@/features/facilities/queries";
import { FacilitySettings } from "@/features/facilities/components/facility-settings";

export const metadata = { title: "Site & settings" };

export default async function SettingsPage({ params }: PageProps<"/w/[ws]/f/[id]/settings">) {
  const { ws, id } = await params;
  const a = await pageAccess(ws, "facility.read");
  if (!a.ok) return <Forbidden message={a.message} />;
  const facility = toDto(await getFacilityRow(a.access.workspace.id, id));
  return <FacilitySettings ws={ws} facility={facility} canEdit={can(a.access.role, "facility.update")} unitSystem={a.user.unitSystem} />;
}
