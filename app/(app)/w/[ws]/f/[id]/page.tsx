import { notFound } from "next/navigation";
import { pageAccess } from "@/lib/page-access";
import { can } from "@/lib/authz";
import { AppError } from "@/lib/errors";
import { Forbidden } from "@/components/layout/forbidden";
import { getFacilityRow, toDto } from "@/features/facilities/queries";
import { FacilitySettings } from "@/features/facilities/components/facility-settings";

export const metadata = { title: "Facility" };

export default async function FacilityPage({ params }: PageProps<"/w/[ws]/f/[id]">) {
  const { ws, id } = await params;
  const a = await pageAccess(ws, "facility.read");
  if (!a.ok) return <Forbidden message={a.message} />;
  if (!/^[0-9a-f-]{36}$/i.test(id)) notFound();
  const facility = await getFacilityRow(a.access.workspace.id, id).then(toDto, (e) => {
    if (e instanceof AppError && e.code === "not_found") notFound();
    throw e;
  });
  return <FacilitySettings ws={ws} facility={facility} canEdit={can(a.access.role, "facility.update")} unitSystem={a.user.unitSystem} />;
}
