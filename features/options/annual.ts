import "server-only";
import type { FacilityModel } from "@/lib/engine/model";
import type { AnnualSummary } from "@/lib/engine/compare-options";

/**
 * The year of each plant (design and options) on the facility's weather year. Until the
 * facility has a weather year there are no annual figures; the note says so.
 */
export async function annualForPlants(
  workspaceId: string,
  facilityId: string,
  model: FacilityModel,
): Promise<{ byPlant: Map<string, AnnualSummary>; weather: { label: string; kind: string; year: number } | null; note: string | null; currency: string }> {
  void workspaceId;
  void facilityId;
  void model;
  return { byPlant: new Map(), weather: null, note: "No weather year for this facility yet: annual energy, cost, seasonal COP and the indirect part of TEWI need one.", currency: "EUR" };
}
