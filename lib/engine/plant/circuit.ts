/**
 * Circuits: suction and condensing temperatures from the evaporators and condenser a circuit
 * serves, its cycle, and the first- and second-law checks on the result (DOMAIN.md §2).
 */
import { ThermoRangeError, type Fluid, type FluidId } from "../thermo/types";
import { DISCHARGE_EXTREME_C, DISCHARGE_LIMIT_C, PRESSURE_RATIO_LIMIT } from "./compressor";
import {
  conventionPressure,
  SUBCRITICAL_MARGIN_K,
  singleStageCycle,
  transcriticalCycle,
  twoStageCycle,
  type ColdReservoir,
  type CycleResult,
  type CycleSpec,
  type EntropyComponent,
  type StatePoint,
  type StageResult,
} from "./cycle";
import { PlantError } from "./errors";
import type { EvaporatorSizing } from "./evaporator";
import type { CircuitInput, CondenserInput, PlantInput } from "./schema";

export const K0 = 273.15;
export const P_ATM = 101_325;
/** Relative closure demanded of Q_cond + Q_oil = Q_evap + W (issue: 0.1 %). */
export const ENERGY_CLOSURE = 1e-3;

export interface Ambient {
  dryBulbC: number;
  wetBulbC: number;
}

export type WarningCode =
  | "PRESSURE_RATIO_HIGH"
  | "DISCHARGE_TEMP_HIGH"
  /** Discharge far above what compressors and oil allow (the result is computed, but no machine runs there). */
  | "DISCHARGE_TEMP_EXTREME"
  | "TD_HIGH_FOR_HUMIDITY"
  | "EVAPORATING_NEAR_FLUID_LIMIT"
  | "SUCTION_BELOW_ATMOSPHERIC"
  | "TRANSCRITICAL_OPERATION"
  | "SUBCRITICAL_OPERATION"
  | "CO2_STANDSTILL_SUPERCRITICAL"
  | "ROOM_WITHOUT_EVAPORATOR"
  | "CIRCUIT_NO_LOAD"
  | "SUCTION_BELOW_EVAPORATOR"
  | "INSTALLED_SHORTFALL";

export interface PlantWarning {
  code: WarningCode;
  severity: "warning" | "info";
  message: string;
  ref: { kind: "room" | "evaporator" | "circuit" | "condenser"; id: string; tag?: string };
}

export interface DesignPressure {
  /** Absolute, Pa. */
  pPa: number;
  /** Gauge (above 1 atm), Pa. */
  gaugePa: number;
  /** Saturation temperature or condition the value stands for. */
  basis: string;
  /** true when the value is only a lower bound (R744 supercritical at standstill). */
  lowerBoundOnly?: boolean;
}

export interface CircuitResult {
  id: string;
  tag: string;
  refrigerant: FluidId;
  arrangement: CircuitInput["arrangement"];
  cycle: CycleResult["arrangement"];
  tempConvention: CircuitInput["tempConvention"];
  evaporatorIds: string[];
  /** Low-stage circuits whose heat this circuit takes through a cascade exchanger. */
  cascadeFromCircuitIds: string[];
  rejectsTo: { kind: "condenser" | "circuit"; id: string };
  compressor: { type: CircuitInput["compressor"]["type"]; units: number; standbyUnits: number; motorEfficiency: number };
  /** Stable schedule tags of the circuit's own items. */
  scheduleTags: { compressor: string; intercooler: string; separator: string; cascadeHx: string };
  /** Pumped-feed evaporators on this circuit (their separator / low-pressure receiver). */
  pumpedEvaporatorIds: string[];
  suctionC: number;
  /** Condensing temperature, or the gas-cooler outlet temperature when transcritical, °C. */
  condensingC: number;
  intermediateC?: number;
  gasCoolerPa?: number;
  superheatK: number;
  subcoolingK: number;
  /** Heat sink the condenser rejects to, and its temperature (ambient, or the high stage). */
  sinkKind: "dry-bulb" | "wet-bulb" | "water" | "cascade";
  sinkC: number;
  /**
   * Temperature at which the rejected heat leaves in the entropy bookkeeping, °C: sinkC,
   * except for a cascade low stage, whose heat leaves through its own desuperheating and
   * condensing stream, taken at that stream's thermodynamic mean temperature Δh/Δs (the
   * high stage counts the cascade exchanger's entropy generation against it).
   */
  entropySinkC: number;
  /** R744 on a gas cooler: the mode at design, the switch-over and how the high side was set. */
  r744?: {
    mode: "transcritical" | "subcritical";
    /** Gas-cooler outlet temperature at or below which the circuit condenses, °C. */
    switchOverC: number;
    /** The sink temperature (ambient dry bulb for an air-cooled gas cooler) of that switch-over, °C. */
    switchOverSinkC: number;
    highSide: "optimised" | "set" | "condensing";
    /** Optimiser bounds, Pa (when optimised). */
    searchFromPa?: number;
    searchToPa?: number;
  };
  /** Refrigeration duty from the rooms and cascade exchangers, W (refrigeration, not electrical). */
  refrigerationW: number;
  /** The rooms' part of refrigerationW (cascade exchangers excluded), W. */
  evaporatorRoomDutyW: number;
  /** Σ Q_room / T_room over the rooms served, W/K (the Clausius term of the cold side). */
  roomEntropyW_K: number;
  /** Liquid-pump input taken up by the refrigerant (pumped feed), W electrical. */
  pumpPowerW: number;
  /**
   * Hot-gas defrost supplied by this circuit's compressors: the 24-h mean of the heat its
   * evaporators' hot-gas defrosts draw, carried as a load at the suction (the gas condensed in
   * the coil returns to the low side and is pumped again), with its entropy term and, per
   * evaporator, where it comes from. Not refrigeration: COP excludes it.
   */
  hotGasDefrost: {
    heatW: number;
    entropyW_K: number;
    byEvaporator: Array<{ id: string; tag: string; roomId: string; heaterW: number; minutesPerDefrost: number; defrostsPerDay: number; meanW: number }>;
    formula: string;
  };
  massFlowKgS: number;
  suctionVolumeFlowM3s: number;
  sweptVolumeM3s: number;
  stages: StageResult[];
  /** Compressor shaft power, W (mechanical). */
  shaftPowerW: number;
  /** Compressor motor input, W (electrical) = shaft / motor efficiency. */
  compressorElectricalW: number;
  /** Compressors + pumps + condenser fans, W (electrical). */
  electricalW: number;
  condenserFanW: number;
  /** COP = refrigeration / (shaft + pump input). */
  cop: number;
  /** Carnot COP between the entropy-mean cold reservoir and the sink; null if the sink is not warmer. */
  copCarnot: number | null;
  secondLawEfficiency: number | null;
  condenserHeatW: number;
  oilCoolerHeatW: number;
  /** Everything rejected at the sink: condenser + oil cooler, W. */
  heatRejectedW: number;
  dischargeTempC: number;
  pressureRatio: number;
  entropyGeneration: {
    byComponentW_K: Partial<Record<EntropyComponent, number>>;
    totalW_K: number;
    /** The same total by the Clausius inequality from the reservoir exchanges. */
    clausiusW_K: number;
  };
  energyBalance: { inW: number; outW: number; relativeError: number };
  statePoints: StatePoint[];
  /** State-point ids in p–h drawing order (see CycleResult.chartPath). */
  chartPath: string[];
  designPressures: { lowSide: DesignPressure; highSide: DesignPressure; standstill: DesignPressure };
}

export interface CircuitsOutput {
  circuits: CircuitResult[];
  warnings: PlantWarning[];
}

export interface CircuitContext {
  plant: PlantInput;
  ambient: Ambient;
  rooms: ReadonlyMap<string, { setPointC: number; rhPct: number }>;
  getFluid: (id: FluidId) => Fluid;
}

interface Sink {
  condensingC: number;
  sinkC: number;
  sinkKind: CircuitResult["sinkKind"];
  /** The input to blame for second-law trouble at the sink (the approach, or a set temperature). */
  field: string;
  /** The input that sets the condensing temperature (for range and lift errors); default `field`. */
  condensingField?: string;
  highSideDesignC: number;
}

/** Condenser default approach by type, K (DOMAIN.md §5, common practice). */
export function defaultApproachK(type: CondenserInput["type"], transcritical: boolean): number {
  if (transcritical) return 3;
  return { "air-cooled": 12, evaporative: 10, "water-cooled": 8, "user-set": 0 }[type];
}

/**
 * Condensing temperature from the condenser: air-cooled = dry bulb + approach, evaporative
 * = wet bulb + approach, water-cooled = entering water + approach, or user-set (DOMAIN.md §5).
 * The sink the approach is measured from is the reservoir for the Carnot and Clausius terms.
 */
export function condenserSink(cd: CondenserInput, index: number, ambient: Ambient, transcritical: boolean, highSideDesignC?: number): Sink {
  const base = `plant.condensers.${index}`;
  const approach = cd.approachK ?? defaultApproachK(cd.type, transcritical);
  const hsd = (t: number) => highSideDesignC ?? t;
  switch (cd.type) {
    case "air-cooled":
      return { condensingC: ambient.dryBulbC + approach, sinkC: ambient.dryBulbC, sinkKind: "dry-bulb", field: `${base}.approachK`, highSideDesignC: hsd(55) };
    case "evaporative":
      return { condensingC: ambient.wetBulbC + approach, sinkC: ambient.wetBulbC, sinkKind: "wet-bulb", field: `${base}.approachK`, highSideDesignC: hsd(43) };
    case "water-cooled": {
      const w = cd.waterInC ?? ambient.wetBulbC + 5;
      return { condensingC: w + approach, sinkC: w, sinkKind: "water", field: `${base}.approachK`, highSideDesignC: hsd(43) };
    }
    case "user-set":
      if (cd.condensingC === undefined)
        throw new PlantError("INPUT_OUT_OF_RANGE", "a user-set condenser needs condensingC (−10…70 °C)", `${base}.condensingC`, {
          min: -10,
          max: 70,
          unit: "°C",
        });
      return { condensingC: cd.condensingC, sinkC: ambient.dryBulbC, sinkKind: "dry-bulb", field: `${base}.condensingC`, highSideDesignC: hsd(55) };
  }
}

/** Circuits ordered so that every low stage comes before the circuit it rejects into. */
export function cascadeOrder(circuits: CircuitInput[]): CircuitInput[] {
  const byId = new Map(circuits.map((c) => [c.id, c]));
  const depth = (c: CircuitInput): number => {
    let d = 0;
    let cur: CircuitInput | undefined = c;
    while (cur && cur.heatRejection.to === "circuit" && d <= circuits.length) {
      cur = byId.get(cur.heatRejection.circuitId);
      d++;
    }
    return d;
  };
  return [...circuits].map((c) => ({ c, d: depth(c) })).sort((a, b) => b.d - a.d).map((x) => x.c);
}

function pressureAt(fluid: Fluid, tC: number, basis: string): DesignPressure {
  const tK = tC + K0;
  if (tK >= fluid.meta.criticalTempK - 0.5) {
    const p = fluid.meta.criticalPressurePa;
    return { pPa: p, gaugePa: p - P_ATM, basis: `${basis} (${tC.toFixed(0)} °C is above the critical temperature: critical pressure shown as a lower bound)`, lowerBoundOnly: true };
  }
  const sat = fluid.saturationAtT(tK, "bubble");
  // The bubble pressure is the higher one for a zeotropic blend: the safe side for design.
  const p = Math.max(sat.pBubblePa, sat.pDewPa);
  return { pPa: p, gaugePa: p - P_ATM, basis: `saturation at ${tC.toFixed(0)} °C` };
}

const maxP = (a: DesignPressure, b: DesignPressure) => (b.pPa > a.pPa ? b : a);

/** Entropy components → the input to blame when one comes out negative. */
function blame(component: EntropyComponent, circuitPath: string, sinkField: string, evapField: string): string {
  if (component === "condenser") return sinkField;
  if (component === "evaporator") return evapField;
  if (component.endsWith("ompressor")) return `${circuitPath}.compressor.isentropic`;
  return `${circuitPath}.refrigerant`;
}

/** Warnings on the evaporators themselves (TD against room humidity). */
export function evaporatorWarnings(sized: EvaporatorSizing[], rooms: CircuitContext["rooms"]): PlantWarning[] {
  const warnings: PlantWarning[] = [];
  for (const s of sized) {
    const room = rooms.get(s.roomId);
    if (room && room.rhPct >= 85 && s.tdK > 6)
      warnings.push({
        code: "TD_HIGH_FOR_HUMIDITY",
        severity: "warning",
        message: `TD ${s.tdK} K dries a ${room.rhPct} % RH room; about 4–6 K is usual for high-humidity produce`,
        ref: { kind: "evaporator", id: s.id, tag: s.tag },
      });
  }
  return warnings;
}

/** Lookups shared by every circuit of one plant (built once per compute). */
export interface PreparedPlant {
  circuitIndex: ReadonlyMap<string, number>;
  condenserIndex: ReadonlyMap<string, number>;
  evapIndex: ReadonlyMap<string, number>;
  /** Low-stage circuits by the circuit they reject into. */
  lowStages: ReadonlyMap<string, CircuitInput[]>;
}

export function preparePlant(plant: PlantInput): PreparedPlant {
  const lowStages = new Map<string, CircuitInput[]>();
  for (const c of plant.circuits)
    if (c.heatRejection.to === "circuit") lowStages.set(c.heatRejection.circuitId, [...(lowStages.get(c.heatRejection.circuitId) ?? []), c]);
  return {
    circuitIndex: new Map(plant.circuits.map((c, i) => [c.id, i])),
    condenserIndex: new Map(plant.condensers.map((c, i) => [c.id, i])),
    evapIndex: new Map(plant.evaporators.map((e, i) => [e.id, i])),
    lowStages,
  };
}

/**
 * Computes every circuit of the plant for the sized evaporators: the cycle, energy closure
 * to 0.1 %, entropy generation per component ≥ 0 and COP ≤ Carnot, and the designer's
 * warnings. Cascade high stages take their low stages' rejected heat as a load at the
 * cascade exchanger's evaporating temperature.
 */
export function computeCircuits(sized: EvaporatorSizing[], ctx: CircuitContext): CircuitsOutput {
  const warnings = evaporatorWarnings(sized, ctx.rooms);
  const prep = preparePlant(ctx.plant);
  const results = new Map<string, CircuitResult>();
  for (const c of cascadeOrder(ctx.plant.circuits)) {
    const r = computeCircuit(c, sized.filter((s) => s.circuitId === c.id), results, ctx, prep, warnings);
    if (r) results.set(c.id, r);
  }
  return { circuits: ctx.plant.circuits.map((c) => results.get(c.id)).filter((r): r is CircuitResult => r !== undefined), warnings };
}

/**
 * One circuit, given the evaporators on it and the results of its low stages (`done`);
 * appends its warnings. Returns undefined (with a CIRCUIT_NO_LOAD note) for a circuit
 * with no load.
 */
export function computeCircuit(
  c: CircuitInput,
  evaporators: EvaporatorSizing[],
  done: ReadonlyMap<string, CircuitResult>,
  ctx: CircuitContext,
  prep: PreparedPlant,
  warnings: PlantWarning[],
): CircuitResult | undefined {
  return computeOneCircuit(c, evaporators, done, ctx, prep.circuitIndex.get(c.id)!, prep.condenserIndex, prep.evapIndex, prep.lowStages.get(c.id) ?? [], warnings);
}

function computeOneCircuit(
  c: CircuitInput,
  sized: EvaporatorSizing[],
  done: ReadonlyMap<string, CircuitResult>,
  ctx: CircuitContext,
  index: number,
  condenserIndex: ReadonlyMap<string, number>,
  evapIndex: ReadonlyMap<string, number>,
  cascades: CircuitInput[],
  warnings: PlantWarning[],
): CircuitResult | undefined {
  const path = `plant.circuits.${index}`;
  const ref = { kind: "circuit" as const, id: c.id, tag: c.tag };
  let fluid: Fluid;
  try {
    fluid = ctx.getFluid(c.refrigerant);
  } catch (err) {
    throw new PlantError("FLUID_NOT_LOADED", err instanceof Error ? err.message : String(err), `${path}.refrigerant`);
  }
  const evaps = sized.filter((s) => s.dutyW > 0);
  const reservoirs: ColdReservoir[] = [];
  const evapTemps: { tC: number; field: string }[] = [];
  let evaporatorRoomDutyW = 0;
  let roomEntropyW_K = 0;
  for (const e of evaps) {
    const room = ctx.rooms.get(e.roomId);
    if (!room) continue;
    reservoirs.push({ heatW: e.dutyW, tK: room.setPointC + K0 });
    evaporatorRoomDutyW += e.dutyW;
    roomEntropyW_K += e.dutyW / (room.setPointC + K0);
    evapTemps.push({ tC: e.evaporatingC, field: `plant.evaporators.${evapIndex.get(e.id)}.tdK` });
  }
  let cascadeField: string | undefined;
  for (const lo of cascades) {
    const hr = lo.heatRejection;
    const low = done.get(lo.id);
    if (!low || hr.to !== "circuit") continue;
    const tC = hr.condensingC - hr.approachK;
    // The source is the low stage's desuperheating and condensing refrigerant, at that
    // stream's own mean temperature (not a reservoir at this stage's evaporating temperature).
    reservoirs.push({ heatW: low.heatRejectedW, tK: low.entropySinkC + K0, kind: "cascade" });
    const field = `plant.circuits.${ctx.plant.circuits.indexOf(lo)}.heatRejection.approachK`;
    cascadeField ??= field;
    evapTemps.push({ tC, field });
  }
  const refrigerationW = reservoirs.reduce((a, r) => a + r.heatW, 0);
  // Hot-gas defrosts of this circuit's evaporators: the compressors supply the gas (the
  // heat-equivalent × minutes × defrosts, as a 24-h mean), taken up at the room the coil sits in.
  const hotGas: CircuitResult["hotGasDefrost"] = {
    heatW: 0,
    entropyW_K: 0,
    byEvaporator: [],
    formula: "q_hg = Σ P_defrost·(min/60)·n_defrosts / 24 h, carried by the circuit's compressors",
  };
  for (const e of evaps) {
    const d = e.defrost;
    if (d.type !== "hot-gas" || !(d.heaterW > 0)) continue;
    const room = ctx.rooms.get(e.roomId);
    if (!room) continue;
    const meanW = (d.heaterW * (d.minutesPerDefrost / 60) * d.defrostsPerDay) / 24;
    if (!(meanW > 0)) continue;
    hotGas.heatW += meanW;
    hotGas.entropyW_K += meanW / (room.setPointC + K0);
    hotGas.byEvaporator.push({ id: e.id, tag: e.tag, roomId: e.roomId, heaterW: d.heaterW, minutesPerDefrost: d.minutesPerDefrost, defrostsPerDay: d.defrostsPerDay, meanW });
    reservoirs.push({ heatW: meanW, tK: room.setPointC + K0 });
  }
  if (refrigerationW <= 0) {
    warnings.push({ code: "CIRCUIT_NO_LOAD", severity: "info", message: "no evaporator or cascade load on this circuit: nothing computed", ref });
    return undefined;
  }
  const coldest = evapTemps.reduce((a, b) => (b.tC < a.tC ? b : a));
  const suctionC = coldest.tC - c.suctionLineAllowanceK;
  const suctionK = suctionC + K0;
  if (suctionK < fluid.range.tMinK)
    throw new PlantError(
      "INPUT_OUT_OF_RANGE",
      `suction temperature ${suctionC.toFixed(1)} °C is below the range of ${c.refrigerant} (from ${(fluid.range.tMinK - K0).toFixed(1)} °C)`,
      coldest.field,
      { min: fluid.range.tMinK - K0, unit: "°C" },
    );
  if (suctionK < fluid.range.tMinK + 5)
    warnings.push({
      code: "EVAPORATING_NEAR_FLUID_LIMIT",
      severity: "warning",
      message: `suction ${suctionC.toFixed(1)} °C is within 5 K of the lowest temperature ${c.refrigerant} is modelled for`,
      ref,
    });

  const transcritical = c.arrangement === "transcritical";
  let sink: Sink;
  const hr = c.heatRejection;
  if (hr.to === "condenser") {
    const ci = condenserIndex.get(hr.condenserId)!;
    sink = condenserSink(ctx.plant.condensers[ci], ci, ctx.ambient, transcritical, ctx.plant.options.highSideDesignC);
  } else {
    sink = {
      condensingC: hr.condensingC,
      sinkC: hr.condensingC - hr.approachK,
      sinkKind: "cascade",
      field: `${path}.heatRejection.approachK`,
      condensingField: `${path}.heatRejection.condensingC`,
      highSideDesignC: hr.condensingC + 10,
    };
  }
  const condensingField = sink.condensingField ?? sink.field;
  if (!transcritical && sink.condensingC + K0 >= fluid.meta.criticalTempK - 1)
    throw new PlantError(
      "INPUT_OUT_OF_RANGE",
      `condensing temperature ${sink.condensingC.toFixed(1)} °C is at or above the critical temperature of ${c.refrigerant}; use a transcritical R744 circuit or another refrigerant`,
      condensingField,
      { max: fluid.meta.criticalTempK - K0 - 1, unit: "°C" },
    );

  const anyDx = evaps.some((e) => e.feed.type === "dx");
  const superheatK = c.superheatK ?? (anyDx ? Math.max(...evaps.map((e) => (e.feed.type === "dx" ? e.feed.superheatK : 0))) : 0);

  // Pump input: circulated liquid ṁ·CR lifted by the pump head, all of it ending in the refrigerant.
  let pumpPowerW = 0;
  const pumped = evaps.filter((e) => e.feed.type === "pumped");
  if (pumped.length > 0) {
    const satS = fluid.saturationAtT(suctionK, c.tempConvention);
    const latent = satS.vapour.hJkg - satS.liquid.hJkg;
    for (const e of pumped) {
      if (e.feed.type !== "pumped") continue;
      const mLiquid = (e.feed.circulationRatio * e.dutyW) / latent;
      pumpPowerW += (mLiquid * e.feed.pumpHeadPa) / (satS.liquid.densityKgM3 * e.feed.pumpEfficiency);
    }
  }

  const spec: CycleSpec = {
    fluid,
    convention: c.tempConvention,
    evaporatingK: suctionK,
    condensingK: sink.condensingC + K0,
    superheatK,
    subcoolingK: c.subcoolingK,
    compressor: c.compressor,
    loadW: refrigerationW + hotGas.heatW + pumpPowerW,
    coldReservoirs: reservoirs,
    sinkK: sink.sinkC + K0,
    intermediateK: c.intermediateC === undefined ? undefined : c.intermediateC + K0,
    sinkAtStreamMeanT: hr.to === "circuit",
    highSidePa: typeof c.highSidePa === "number" ? c.highSidePa : undefined,
    switchOverK: c.switchOverC === undefined ? undefined : c.switchOverC + K0,
  };
  let cycle: CycleResult;
  try {
    cycle = c.arrangement === "two-stage" ? twoStageCycle(spec) : transcritical ? transcriticalCycle(spec) : singleStageCycle(spec);
  } catch (err) {
    if (err instanceof PlantError) {
      const field = err.field === "intermediateC" || err.field === "arrangement" || err.field === "highSidePa" ? `${path}.${err.field}` : err.field.startsWith("plant.") ? err.field : condensingField;
      throw new PlantError(err.code, `${c.tag}: ${err.message}`, field, err.allowed);
    }
    // Suction was checked above, so a property-range error here comes from the high side.
    if (err instanceof ThermoRangeError)
      throw new PlantError("INPUT_OUT_OF_RANGE", `${c.tag}: ${err.message}`, condensingField, err.allowed);
    throw err;
  }

  const heatRejectedW = cycle.condenserHeatW + cycle.oilCoolerHeatW;
  const inW = spec.loadW + cycle.shaftPowerW;
  const relativeError = Math.abs(heatRejectedW - inW) / inW;
  if (!(relativeError <= ENERGY_CLOSURE))
    throw new PlantError(
      "ENERGY_BALANCE",
      `${c.tag}: heat rejected ${heatRejectedW.toFixed(0)} W ≠ load + work ${inW.toFixed(0)} W (${(relativeError * 100).toFixed(3)} %)`,
      `${path}.refrigerant`,
    );

  const byComponentW_K = cycle.entropyW_K;
  const sRes = reservoirs.reduce((a, r) => a + r.heatW / r.tK, 0);
  // The heat leaves at the bookkeeping sink (a cascade low stage: its stream's Δh/Δs).
  const entropySinkK = cycle.sinkK;
  const clausiusW_K = heatRejectedW / entropySinkK - sRes;
  let totalW_K = 0;
  const scale = heatRejectedW / entropySinkK;
  for (const [k, v] of Object.entries(byComponentW_K) as [EntropyComponent, number][]) {
    totalW_K += v;
    if (!(v >= -1e-6 * scale))
      throw new PlantError(
        "SECOND_LAW_VIOLATION",
        `${c.tag}: negative entropy generation in the ${k} (${v.toExponential(3)} W/K): the temperatures given make heat flow from cold to hot`,
        k === "cascadeExchanger" && cascadeField ? cascadeField : blame(k, path, sink.field, coldest.field),
      );
  }
  const workW = cycle.shaftPowerW + pumpPowerW;
  const cop = refrigerationW / workW;
  // The Carnot bound applies to all the heat taken up, hot-gas defrost included.
  const takenUpW = refrigerationW + hotGas.heatW;
  const tLeffK = takenUpW / sRes;
  const copCarnot = spec.sinkK > tLeffK ? tLeffK / (spec.sinkK - tLeffK) : null;
  if (!(clausiusW_K >= -1e-6 * scale) || (copCarnot !== null && takenUpW / workW > copCarnot * (1 + 1e-6)))
    throw new PlantError(
      "SECOND_LAW_VIOLATION",
      `${c.tag}: COP ${cop.toFixed(3)} exceeds the Carnot COP ${copCarnot?.toFixed(3)} (S_gen ${clausiusW_K.toExponential(3)} W/K)`,
      sink.field,
    );

  // Warnings a designer expects.
  const ratioLimit = PRESSURE_RATIO_LIMIT[c.compressor.type];
  if (c.arrangement !== "two-stage" && cycle.pressureRatio > ratioLimit)
    warnings.push({
      code: "PRESSURE_RATIO_HIGH",
      severity: "warning",
      message: `pressure ratio ${cycle.pressureRatio.toFixed(1)} is above about ${ratioLimit} for a single ${c.compressor.type} stage: consider two-stage compression or a cascade`,
      ref,
    });
  if (c.arrangement === "two-stage")
    for (const st of cycle.stages)
      if (st.pressureRatio > ratioLimit)
        warnings.push({
          code: "PRESSURE_RATIO_HIGH",
          severity: "warning",
          message: `${st.name}-stage pressure ratio ${st.pressureRatio.toFixed(1)} is above about ${ratioLimit} even with two stages: consider a cascade`,
          ref,
        });
  const dischargeLimit = DISCHARGE_LIMIT_C[c.compressor.type];
  const dischargeC = cycle.dischargeTempK - K0;
  if (dischargeC > DISCHARGE_EXTREME_C)
    warnings.push({
      code: "DISCHARGE_TEMP_EXTREME",
      severity: "warning",
      message: `discharge ${dischargeC.toFixed(0)} °C is far above what any compressor and its oil allow (about ${DISCHARGE_EXTREME_C} °C at most; ${dischargeLimit} °C for a ${c.compressor.type}): the figures are computed, but no machine runs there. ${c.arrangement === "two-stage" ? "Lower the stage ratios (intermediate pressure) or use a cascade" : "Use two-stage compression with an intercooler (or a cascade)"}`,
      ref,
    });
  else if (dischargeC > dischargeLimit)
    warnings.push({
      code: "DISCHARGE_TEMP_HIGH",
      severity: "warning",
      message: `discharge ${(cycle.dischargeTempK - K0).toFixed(0)} °C is above about ${dischargeLimit} °C for a ${c.compressor.type} compressor${c.arrangement === "single-stage" ? ": consider two-stage compression or a cascade" : ""}`,
      ref,
    });
  if (cycle.evaporatingPa < P_ATM)
    warnings.push({
      code: "SUCTION_BELOW_ATMOSPHERIC",
      severity: "warning",
      message: `suction pressure ${(cycle.evaporatingPa / 1000).toFixed(0)} kPa(a) is below atmospheric: air and moisture can leak in; plan purging`,
      ref,
    });
  let r744: CircuitResult["r744"];
  if (transcritical) {
    const switchOverC = Math.min(c.switchOverC ?? fluid.meta.criticalTempK - K0 - SUBCRITICAL_MARGIN_K, fluid.meta.criticalTempK - K0 - 1);
    const switchOverSinkC = switchOverC - (sink.condensingC - sink.sinkC);
    const sinkWord = sink.sinkKind === "dry-bulb" ? "ambient" : sink.sinkKind === "wet-bulb" ? "wet bulb" : sink.sinkKind === "water" ? "water" : "sink";
    r744 = {
      mode: cycle.arrangement === "transcritical" ? "transcritical" : "subcritical",
      switchOverC,
      switchOverSinkC,
      highSide: cycle.arrangement !== "transcritical" ? "condensing" : cycle.highSide?.mode === "set" ? "set" : "optimised",
      searchFromPa: cycle.highSide?.searchFromPa,
      searchToPa: cycle.highSide?.searchToPa,
    };
    if (cycle.arrangement === "transcritical")
      warnings.push({
        code: "TRANSCRITICAL_OPERATION",
        severity: "info",
        message: `transcritical operation at design: gas cooler at ${(cycle.condensingPa / 1e5).toFixed(1)} bar(a) (${r744.highSide === "set" ? "high-pressure control set point" : "optimised for the best COP"}), outlet ${sink.condensingC.toFixed(1)} °C; it condenses (subcritical) when the outlet is at or below ${switchOverC.toFixed(1)} °C, i.e. ${sinkWord} at or below ${switchOverSinkC.toFixed(1)} °C`,
        ref,
      });
    else
      warnings.push({
        code: "SUBCRITICAL_OPERATION",
        severity: "info",
        message: `subcritical at design: condensing at ${sink.condensingC.toFixed(1)} °C into a liquid receiver, since the ${sinkWord} ${sink.sinkC.toFixed(1)} °C is at or below the switch-over ${switchOverSinkC.toFixed(1)} °C (gas-cooler outlet ${switchOverC.toFixed(1)} °C)${typeof c.highSidePa === "number" ? "; the high-pressure set point applies only in transcritical operation" : ""}`,
        ref,
      });
  }
  for (const e of evaps)
    if (e.evaporatingC - suctionC > c.suctionLineAllowanceK + 3)
      warnings.push({
        code: "SUCTION_BELOW_EVAPORATOR",
        severity: "info",
        message: `${e.tag} evaporates at ${e.evaporatingC.toFixed(1)} °C but the circuit suction is ${suctionC.toFixed(1)} °C: it needs an evaporator pressure regulator, or a circuit of its own`,
        ref: { kind: "evaporator", id: e.id, tag: e.tag },
      });

  // Design pressures: the low side for standstill at the low-side design temperature, the
  // high side for its design temperature (transcritical: 10 % over the gas-cooler pressure).
  const standstill = pressureAt(fluid, ctx.plant.options.lowSideStandstillC, "low side at standstill");
  if (standstill.lowerBoundOnly)
    warnings.push({
      code: "CO2_STANDSTILL_SUPERCRITICAL",
      severity: "warning",
      message: `at a standstill temperature of ${ctx.plant.options.lowSideStandstillC} °C the ${c.refrigerant} charge is supercritical: provide a standby cooling unit or design for the full standstill pressure`,
      ref,
    });
  let highSide: DesignPressure;
  if (cycle.arrangement === "transcritical") {
    const p = 1.1 * cycle.condensingPa;
    highSide = { pPa: p, gaugePa: p - P_ATM, basis: "gas-cooler pressure at design + 10 % (common practice margin)" };
  } else {
    highSide = maxP(pressureAt(fluid, Math.max(sink.highSideDesignC, sink.condensingC + 5), "high side"), standstill);
  }
  const lowSide = standstill;

  const st0 = cycle.stages[0];
  const compressorElectricalW = cycle.shaftPowerW / c.compressor.motorEfficiency;
  let condenserFanW = 0;
  if (hr.to === "condenser") {
    const cd = ctx.plant.condensers[condenserIndex.get(hr.condenserId)!];
    const perKw = cd.fanPowerWPerKw ?? { "air-cooled": 20, evaporative: 12, "water-cooled": 0, "user-set": 0 }[cd.type];
    condenserFanW = (perKw * heatRejectedW) / 1000;
  }
  const intermediateC = cycle.intermediatePa !== undefined ? fluid.saturationAtP(cycle.intermediatePa).vapour.tK - K0 : undefined;
  return {
    id: c.id,
    tag: c.tag,
    refrigerant: c.refrigerant,
    arrangement: c.arrangement,
    cycle: cycle.arrangement,
    tempConvention: c.tempConvention,
    evaporatorIds: evaps.map((e) => e.id),
    cascadeFromCircuitIds: cascades.map((x) => x.id),
    rejectsTo: hr.to === "condenser" ? { kind: "condenser", id: hr.condenserId } : { kind: "circuit", id: hr.circuitId },
    compressor: {
      type: c.compressor.type,
      units: c.compressor.units,
      standbyUnits: c.compressor.standbyUnits,
      motorEfficiency: c.compressor.motorEfficiency,
    },
    scheduleTags: {
      compressor: c.tags?.compressor ?? `CP-${c.tag}`,
      intercooler: c.tags?.intercooler ?? `IC-${c.tag}`,
      separator: c.tags?.separator ?? `LPR-${c.tag}`,
      cascadeHx: c.tags?.cascadeHx ?? `CHX-${c.tag}`,
    },
    pumpedEvaporatorIds: pumped.map((e) => e.id),
    suctionC,
    condensingC: sink.condensingC,
    intermediateC,
    gasCoolerPa: cycle.arrangement === "transcritical" ? cycle.condensingPa : undefined,
    superheatK,
    subcoolingK: c.subcoolingK,
    sinkKind: sink.sinkKind,
    sinkC: sink.sinkC,
    entropySinkC: entropySinkK - K0,
    r744,
    refrigerationW,
    evaporatorRoomDutyW,
    roomEntropyW_K,
    pumpPowerW,
    hotGasDefrost: hotGas,
    massFlowKgS: cycle.massFlowKgS,
    suctionVolumeFlowM3s: st0.suctionVolumeFlowM3s,
    sweptVolumeM3s: cycle.stages.reduce((a, s) => a + s.sweptVolumeM3s, 0),
    stages: cycle.stages,
    shaftPowerW: cycle.shaftPowerW,
    compressorElectricalW,
    electricalW: compressorElectricalW + pumpPowerW + condenserFanW,
    condenserFanW,
    cop,
    copCarnot,
    secondLawEfficiency: copCarnot === null ? null : cop / copCarnot,
    condenserHeatW: cycle.condenserHeatW,
    oilCoolerHeatW: cycle.oilCoolerHeatW,
    heatRejectedW,
    dischargeTempC: cycle.dischargeTempK - K0,
    pressureRatio: cycle.pressureRatio,
    entropyGeneration: { byComponentW_K, totalW_K, clausiusW_K },
    energyBalance: { inW, outW: heatRejectedW, relativeError },
    statePoints: cycle.statePoints,
    chartPath: cycle.chartPath,
    designPressures: { lowSide, highSide, standstill },
  };
}

/** Saturation pressure at a convention temperature (exported for re-rating). */
export function satPressurePa(fluid: Fluid, tK: number, convention: CircuitInput["tempConvention"]): number {
  return conventionPressure(fluid.saturationAtT(tK, convention), convention);
}
