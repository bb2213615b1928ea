import { pageAccess } from "@/lib/page-access";
import { can } from "@/lib/authz";
import { Forbidden } from "@/components/layout/forbidden";
import { loadFacilityModel } from "@/features/facilities/model";
import { energyView } from "@/features/energy/queries";
import { requestAnnualRun } from "@/features/energy/runs";
import { EnergyView } from "@/features/energy/components/energy-view";
import { WeatherPanel } from "@/features/energy/components/weather-panel";
import { OperationForm, type OperationDoc } from "@/features/energy/components/operation-form";

export const metadata = { title: "Energy" };

export default async function EnergyPage({ params }: PageProps<"/w/[ws]/f/[id]/energy">) {
  const { ws, id } = await params;
  const a = await pageAccess(ws, "facility.read");
  if (!a.ok) return <Forbidden message={a.message} />;
  let view = await energyView(a.access, id);
  // Stored figures that no longer match the model or the weather are recomputed on the worker
  // (like the other results, which are computed for whoever reads them); the page never waits.
  if (view.weather && !view.job && !view.failed && !view.current.modelError && (!view.result || view.stale.length)) {
    await requestAnnualRun({ workspaceId: a.access.workspace.id, facilityId: id, userId: a.user.id, reason: view.result ? "figures out of date" : "first run" });
    view = await energyView(a.access, id);
  }
  const m = await loadFacilityModel(a.access.workspace.id, id);
  const circuits = ((m.doc.plant?.circuits as { id: string; tag?: string; name?: string }[] | undefined) ?? []).map((c) => ({ id: c.id, name: c.name ?? c.tag ?? c.id }));
  const canEdit = can(a.access.role, "model.edit");
  return (
    <main className="flex flex-col gap-6 p-4">
      <EnergyView ws={ws} facilityId={id} initial={view} s={a.user.unitSystem} />
      <WeatherPanel ws={ws} facilityId={id} weather={view.weather} canEdit={canEdit} s={a.user.unitSystem} />
      <OperationForm
        key={m.version}
        ws={ws}
        facilityId={id}
        initial={(m.doc.operation as OperationDoc | undefined) ?? null}
        circuits={circuits}
        currency={view.currency}
        canEdit={canEdit}
        s={a.user.unitSystem}
      />
    </main>
  );
}
