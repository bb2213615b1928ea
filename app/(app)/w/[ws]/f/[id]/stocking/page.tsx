import { pageAccess } from "@/lib/page-access";
import { can } from "@/lib/authz";
import { Forbidden } from "@/components/layout/forbidden";
import { stockingPageData } from "@/features/stocking-check/page-data";
import { StockingChecks } from "@/features/stocking-check/components/stocking-checks";

export const metadata = { title: "Stocking checks" };

export default async function StockingPage({ params, searchParams }: PageProps<"/w/[ws]/f/[id]/stocking">) {
  const { ws, id } = await params;
  const sp = await searchParams;
  const a = await pageAccess(ws, "facility.read");
  if (!a.ok) return <Forbidden message={a.message} />;
  const d = await stockingPageData(a.access.workspace.id, id);
  if (d.modelError)
    return (
      <main className="p-4">
        <p role="alert" className="text-sm text-danger">
          ⚠ The model cannot be computed, so no stocking check can run: {d.modelError}
        </p>
      </main>
    );
  if (d.rooms.length === 0)
    return (
      <main className="p-4">
        <p className="text-sm text-muted">This facility has no rooms yet. Stocking checks test stock changes in its rooms against the installed plant; add rooms in the model first.</p>
      </main>
    );
  const selected = typeof sp.s === "string" && /^[0-9a-f-]{36}$/i.test(sp.s) ? sp.s : null;
  return (
    <StockingChecks
        ws={ws}
        facilityId={id}
        unitSystem={a.user.unitSystem}
        rooms={d.rooms}
        commodities={d.commodities}
        initial={d.scenarios}
        initialSelected={selected}
        canCreate={can(a.access.role, "scenario.create")}
        canApply={can(a.access.role, "scenario.apply")}
        installedRecorded={d.installedRecorded}
        currentVersion={d.version}
        canEditModel={can(a.access.role, "model.edit")}
    />
  );
}
