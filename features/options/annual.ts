import "server-only";
import { createHash } from "node:crypto";
import { canonicalJson } from "@/lib/merge";
import type { FacilityModel } from "@/lib/engine/model";
import { ANNUAL_ENGINE_VERSION } from "@/lib/engine/annual";
import { getFluid } from "@/lib/engine/thermo";
import { runOptionsAnnual, type AnnualSummary } from "@/lib/engine/compare-options";
import { currentWeather } from "@/features/energy/weather";
import { toWeatherYear } from "@/features/energy/job";
import { getWorkspaceSettings } from "@/features/team/settings";

export interface PlantsYear {
  byPlant: Map<string, AnnualSummary>;
  errors: Map<string, string>;
  weather: { label: string; kind: string; year: number } | null;
  note: string | null;
  currency: string;
}

/**
 * Results by (engine input, weather year, engine version): the year of every plant is computed
 * on the server on first view (the annual engine runs a facility year in about a second) and
 * kept here, so later views, the export and the report reuse it until the model or the weather
 * changes. Bounded; the oldest entry goes first.
 */
const CACHE_MAX = 16;
const cache = new Map<string, { byPlant: Map<string, AnnualSummary>; errors: Map<string, string> }>();

function keyOf(model: FacilityModel, weatherId: string): string {
  const h = createHash("sha256").update(canonicalJson(model)).digest("hex").slice(0, 24);
  return `${h}|${weatherId}|${ANNUAL_ENGINE_VERSION}`;
}

/** The year of each plant (design and options) on the facility's current weather year; none without one. */
export async function annualForPlants(workspaceId: string, facilityId: string, model: FacilityModel): Promise<PlantsYear> {
  const [weather, settings] = await Promise.all([currentWeather(workspaceId, facilityId), getWorkspaceSettings(workspaceId)]);
  const currency = settings.currency;
  if (!weather)
    return {
      byPlant: new Map(),
      errors: new Map(),
      weather: null,
      note: "No weather year for this facility yet: annual energy, cost, seasonal COP and the indirect part of TEWI need one (Energy tab: upload a file or enter monthly means).",
      currency,
    };
  const key = keyOf(model, weather.id);
  let r = cache.get(key);
  if (!r) {
    r = runOptionsAnnual(model, toWeatherYear(weather), { getFluid });
    cache.set(key, r);
    while (cache.size > CACHE_MAX) cache.delete(cache.keys().next().value as string);
  }
  return { byPlant: r.byPlant, errors: r.errors, weather: { label: weather.label, kind: weather.kind, year: weather.year }, note: null, currency };
}
