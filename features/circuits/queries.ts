import "server-only";
import { getFluid, loadFluid } from "@/lib/engine/thermo";
import type { FacilityResult } from "@/lib/engine/model";
import { circuitChart } from "./chart-data";
import type { CircuitCardData } from "./components/circuits-view";

/** One card per circuit: its result, the p–h chart data, its warnings and its refrigerant's cautions. */
export async function circuitCards(result: FacilityResult): Promise<CircuitCardData[]> {
  const fluids = [...new Set(result.plant.circuits.map((c) => c.refrigerant))];
  await Promise.all(fluids.map((id) => loadFluid(id)));
  return result.plant.circuits.map((c) => {
    let chart: CircuitCardData["chart"] = null;
    try {
      chart = circuitChart(getFluid(c.refrigerant), c);
    } catch {
      chart = null; // the card says the chart could not be drawn
    }
    return {
      circuit: c,
      chart,
      warnings: result.plant.warnings.filter((w) => (w.ref.kind === "circuit" && w.ref.id === c.id) || (w.ref.kind === "evaporator" && c.evaporatorIds.includes(w.ref.id))),
      caution: result.plant.cautions.find((k) => k.refrigerant === c.refrigerant),
    };
  });
}
