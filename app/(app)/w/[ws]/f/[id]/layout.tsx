import { notFound } from "next/navigation";
import Link from "next/link";
import { pageAccess } from "@/lib/page-access";
import { AppError } from "@/lib/errors";
import { Forbidden } from "@/components/layout/forbidden";
import { NavTabs } from "@/components/layout/nav-tabs";
import { getFacilityRow } from "@/features/facilities/queries";
import { FACILITY_TABS } from "@/features/facilities/components/facility-tabs";
import { FacilityVersion } from "@/features/facilities/components/facility-version";

export default async function FacilityLayout({ children, params }: LayoutProps<"/w/[ws]/f/[id]">) {
  const { ws, id } = await params;
  const a = await pageAccess(ws, "facility.read");
  if (!a.ok) return <Forbidden message={a.message} />;
  if (!/^[0-9a-f-]{36}$/i.test(id)) notFound();
  const f = await getFacilityRow(a.access.workspace.id, id).catch((e) => {
    if (e instanceof AppError && e.code === "not_found") notFound();
    throw e;
  });
  const base = `/w/${ws}/f/${id}`;
  return (
    <div className="flex min-h-[calc(100vh-8rem)] flex-col">
      <div className="flex items-baseline gap-3 px-4 pt-3">
        <Link href={`/w/${ws}`} className="text-xs text-accent hover:underline">
          ← Facilities
        </Link>
        <h2 className="text-base font-semibold">{f.name}</h2>
        {f.archivedAt ? <span className="rounded bg-surface-3 px-1.5 text-xs text-muted">archived</span> : null}
        <FacilityVersion facilityId={f.id} initial={f.version} />
      </div>
      <NavTabs label="Facility views" tabs={FACILITY_TABS.map((t) => ({ href: `${base}/${t.slug}`, label: t.label }))} />
      <div className="flex flex-1 flex-col">{children}</div>
    </div>
  );
}
