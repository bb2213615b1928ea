/**
 * The options comparison: for the design plant and every option of a facility (the same rooms),
 * the design-hour plant, the charge estimate, GWP and safety group, TEWI split direct /
 * indirect, the code aid per circuit and — when an annual run is given — the year's energy,
 * peak and cost. Pure: the caller supplies the fluids and, per plant, the annual summary
 * (from `runAnnual` on the plant with the facility's weather year).
 */
import type { Fluid, FluidId, SafetyGroup } from "./thermo/types";
import { computeFacility, withPlant, type FacilityModel } from "./model";
import { alternativesOf, type PlantAlternative } from "./options";
import { estimateCharge, type ChargeEstimate } from "./plant/charge";
import { codeAid, PRACTICAL_LIMITS, tewi, TEWI_FORMULA, type CodeAid, type TewiResult } from "./plant/tewi";
import { fluidsNeeded } from "./plant/plant";
import { runAnnual, type WeatherYear } from "./annual";

/** What the comparison needs of a plant's year (a subset of the annual engine's result). */
export interface AnnualSummary {
  kWh: number;
  monthly: { kWh: number; loadKWh?: number; meanCOP?: number }[];
  peakKWe: number;
  /** Undefined when the year has no load. */
  seasonalCOP?: number;
  seasonalCarnotCOP?: number;
  cost?: { energy: number; demand: number; total: number };
  /** The weather year's label, shown with the figures. */
  weatherLabel?: string;
}

export interface RefrigerantFacts {
  id: FluidId;
  gwp100: number;
  gwpSource: string;
  safetyGroup: SafetyGroup;
  chargeKg: number;
}

export interface OptionFigures {
  id: string;
  name: string;
  isDesign: boolean;
  /** Set when this plant cannot be computed (the others still are). */
  error?: { message: string; field?: string };
  /** Room refrigeration × installed ÷ running compressor units, summed over circuits, W. */
  installedRefrigerationW?: number;
  /** Design-hour electrical input: compressors, pumps, condenser and evaporator fans, W. */
  designElectricalW?: number;
  designCop?: number;
  circuits?: { id: string; tag: string; refrigerant: FluidId; arrangement: string; refrigerationW: number; electricalW: number }[];
  charge?: ChargeEstimate;
  refrigerants?: RefrigerantFacts[];
  /** Charge-weighted GWP of the plant's refrigerants (Σ GWP·m / Σ m). */
  gwpWeighted?: number;
  tewi?: TewiResult & { indirectKnown: boolean };
  codeAid?: CodeAid[];
  annual?: AnnualSummary;
  /** Why the year of this plant could not be computed (the other figures stand). */
  annualError?: string;
  /** Running cost after 0…n years (undiscounted), in the workspace currency; needs the annual cost. */
  costOverYears?: number[];
  assumptions: { leakPctPerYear: number; recoveryPct: number; practicalLimitKgM3?: number; practicalLimitSource?: string };
}

export interface OptionsComparison {
  years: number;
  gridKgCo2PerKWh: number;
  tewiFormula: string;
  options: OptionFigures[];
}

export interface CompareArgs {
  getFluid: (id: FluidId) => Fluid;
  /** Per plant id ("design" or an option id): its annual summary, when a weather year exists. */
  annual?: ReadonlyMap<string, AnnualSummary>;
  /** Per plant id: why its year could not be computed. */
  annualErrors?: ReadonlyMap<string, string>;
}

/** Every refrigerant the design and the options need loaded. */
export function optionFluidsNeeded(model: FacilityModel): FluidId[] {
  return [...new Set(alternativesOf(model).flatMap((a) => fluidsNeeded(a.plant)))];
}

function roomVolumes(model: FacilityModel) {
  return new Map(
    model.rooms.map((r) => [
      r.id,
      { id: r.id, name: r.name, volumeM3: r.lengthM * r.widthM * r.heightM, occupied: (r.people?.count ?? 0) > 0 },
    ]),
  );
}

function figuresOf(model: FacilityModel, alt: PlantAlternative, study: FacilityModel["plantStudy"], args: CompareArgs): OptionFigures {
  const a = alt.assessment;
  const base: OptionFigures = {
    id: alt.id,
    name: alt.name,
    isDesign: alt.isDesign,
    assumptions: { leakPctPerYear: a.leakPctPerYear, recoveryPct: a.recoveryPct, practicalLimitKgM3: a.practicalLimitKgM3, practicalLimitSource: a.practicalLimitSource },
  };
  if (alt.plant.circuits.length === 0) return { ...base, error: { message: "This plant has no circuits yet." } };
  let r: ReturnType<typeof computeFacility>;
  try {
    r = computeFacility(withPlant(model, alt.plant), { getFluid: args.getFluid });
  } catch (e) {
    const err = e as Error & { field?: string };
    return { ...base, error: { message: err.message, field: err.field } };
  }
  const p = r.plant;
  const installedRefrigerationW = p.circuits.reduce((s, c) => {
    const running = Math.max(1, c.compressor.units - c.compressor.standbyUnits);
    return s + (c.evaporatorRoomDutyW * c.compressor.units) / running;
  }, 0);
  const designElectricalW = p.totals.electricalW + p.totals.evaporatorFanW;
  const condenserTags = new Map(alt.plant.condensers.map((c) => [c.id, c.tag]));
  const charge = estimateCharge(p.circuits, p.evaporators, {
    getFluid: args.getFluid,
    overrides: a.chargeOverrides,
    condenserTag: (id) => condenserTags.get(id) ?? id,
  });
  const refrigerants: RefrigerantFacts[] = Object.entries(charge.byRefrigerant).map(([id, kg]) => {
    const meta = args.getFluid(id as FluidId).meta;
    return { id: id as FluidId, gwp100: meta.gwp100, gwpSource: meta.gwpSource, safetyGroup: meta.safetyGroup, chargeKg: kg ?? 0 };
  });
  const totalKg = charge.totalKg;
  const gwpWeighted = totalKg > 0 ? refrigerants.reduce((s, f) => s + f.gwp100 * f.chargeKg, 0) / totalKg : 0;
  const annual = args.annual?.get(alt.id);
  const annualError = args.annualErrors?.get(alt.id);
  // Direct TEWI summed refrigerant by refrigerant (each with its own GWP); indirect once, from the year's kWh.
  const direct = refrigerants.map((f) =>
    tewi({ gwp: f.gwp100, chargeKg: f.chargeKg, leakFractionPerYear: a.leakPctPerYear / 100, years: study.years, recoveryFraction: a.recoveryPct / 100, annualKWh: 0, gridKgCo2PerKWh: study.gridKgCo2PerKWh }),
  );
  const indirect = tewi({ gwp: 0, chargeKg: 0, leakFractionPerYear: 0, years: study.years, recoveryFraction: 1, annualKWh: annual?.kWh ?? 0, gridKgCo2PerKWh: study.gridKgCo2PerKWh });
  const leakageKg = direct.reduce((s, t) => s + t.leakageKg, 0);
  const endOfLifeKg = direct.reduce((s, t) => s + t.endOfLifeKg, 0);
  const directKg = leakageKg + endOfLifeKg;
  const tewiResult = {
    leakageKg,
    endOfLifeKg,
    directKg,
    indirectKg: indirect.indirectKg,
    totalKg: directKg + indirect.indirectKg,
    formula: TEWI_FORMULA,
    indirectKnown: annual !== undefined,
  };
  const rooms = roomVolumes(model);
  const aids = charge.circuits.map((cc) => {
    const served = [...new Set(p.evaporators.filter((e) => e.circuitId === cc.circuitId).map((e) => e.roomId))].flatMap((id) => {
      const room = rooms.get(id);
      return room ? [room] : [];
    });
    const limit = a.practicalLimitKgM3 !== undefined ? { kgPerM3: a.practicalLimitKgM3, source: a.practicalLimitSource || "entered by the user" } : PRACTICAL_LIMITS[cc.refrigerant];
    return codeAid({ circuitId: cc.circuitId, refrigerant: cc.refrigerant, chargeKg: cc.chargeKg, servedRooms: served, limit });
  });
  const costPerYear = annual?.cost?.total;
  return {
    ...base,
    installedRefrigerationW,
    designElectricalW,
    designCop: p.totals.refrigerationW > 0 && p.totals.electricalW > 0 ? p.systems.reduce((s, x) => s + x.refrigerationW, 0) / p.totals.electricalW : undefined,
    circuits: p.circuits.map((c) => ({ id: c.id, tag: c.tag, refrigerant: c.refrigerant, arrangement: c.arrangement, refrigerationW: c.refrigerationW, electricalW: c.electricalW })),
    charge,
    refrigerants,
    gwpWeighted,
    tewi: tewiResult,
    codeAid: aids,
    annual,
    annualError,
    costOverYears: costPerYear === undefined ? undefined : Array.from({ length: study.years + 1 }, (_, y) => y * costPerYear),
  };
}

/** The comparison of the design and every option (design first). */
export function compareOptions(model: FacilityModel, args: CompareArgs): OptionsComparison {
  const study = model.plantStudy;
  return {
    years: study.years,
    gridKgCo2PerKWh: study.gridKgCo2PerKWh,
    tewiFormula: TEWI_FORMULA,
    options: alternativesOf(model).map((alt) => figuresOf(model, alt, study, args)),
  };
}

export { BETTER, bestOf } from "./compare-best";

/**
 * The year of every plant (design and options) on one weather year, by the annual engine.
 * The operation section (schedules, tariff) is shared; its per-circuit entries apply to the
 * plants that have a circuit of that id and are left out for the others. A plant the engine
 * refuses gets its error instead of figures, and the others are still computed.
 */
export function runOptionsAnnual(
  model: FacilityModel,
  weather: WeatherYear,
  opts: { getFluid: (id: FluidId) => Fluid; method?: "fast" | "direct" },
): { byPlant: Map<string, AnnualSummary>; errors: Map<string, string>; ms: Map<string, number> } {
  const byPlant = new Map<string, AnnualSummary>();
  const errors = new Map<string, string>();
  const ms = new Map<string, number>();
  const op = (model as { operation?: { circuits?: Record<string, unknown> } }).operation;
  for (const alt of alternativesOf(model)) {
    if (alt.plant.circuits.length === 0) continue;
    const ids = new Set(alt.plant.circuits.map((c) => c.id));
    const operation = op?.circuits ? { ...op, circuits: Object.fromEntries(Object.entries(op.circuits).filter(([id]) => ids.has(id))) } : op;
    const m = { ...withPlant(model, alt.plant), ...(operation ? { operation } : {}) } as FacilityModel;
    const t0 = Date.now();
    try {
      const r = runAnnual(m, weather, { getFluid: opts.getFluid, method: opts.method });
      const f = r.facility;
      byPlant.set(alt.id, {
        kWh: f.kWh,
        monthly: f.monthly.map((x) => ({ kWh: x.kWh, loadKWh: x.loadKWh, meanCOP: x.meanCOP ?? undefined })),
        peakKWe: f.peakKWe,
        seasonalCOP: f.seasonalCOP ?? undefined,
        seasonalCarnotCOP: f.seasonalCarnotCOP ?? undefined,
        cost: f.cost,
        weatherLabel: r.weather.label,
      });
    } catch (e) {
      errors.set(alt.id, e instanceof Error ? e.message : String(e));
    }
    ms.set(alt.id, Date.now() - t0);
  }
  return { byPlant, errors, ms };
}
