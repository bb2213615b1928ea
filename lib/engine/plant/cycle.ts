/**
 * Vapour-compression cycles on a real-fluid property model: single-stage, two-stage with an
 * open flash intercooler, and transcritical R744 with the gas-cooler pressure chosen for the
 * best COP. Energy and entropy bookkeeping per component follows the steady-flow first and
 * second laws (Çengel & Boles, "Thermodynamics: An Engineering Approach", chapters on
 * entropy and refrigeration cycles; DOMAIN.md §2). Every state comes from the `Fluid`
 * interface; nothing here knows which equation of state stands behind it.
 */
import { ThermoRangeError, type Fluid, type PhaseProps, type SaturationState, type TempConvention } from "../thermo/types";
import { isentropicEfficiency, volumetricEfficiency } from "./compressor";
import { PlantError } from "./errors";
import type { CompressorInput } from "./schema";

export interface StatePoint {
  /** "1" suction, "2" discharge, "3" condenser outlet, "4" evaporator inlet … (see `label`). */
  id: string;
  label: string;
  pPa: number;
  tK: number;
  hJkg: number;
  sJkgK: number;
}

export interface StageResult {
  name: "single" | "low" | "high";
  massFlowKgS: number;
  suctionPa: number;
  dischargePa: number;
  pressureRatio: number;
  isentropicEfficiency: number;
  volumetricEfficiency: number;
  suctionVolumeFlowM3s: number;
  sweptVolumeM3s: number;
  shaftPowerW: number;
  dischargeTempK: number;
  oilCoolerW: number;
}

/**
 * A heat source the evaporators draw from: a room's air, or (kind "cascade") a low stage's
 * desuperheating and condensing refrigerant, taken at that stream's thermodynamic mean
 * temperature Δh/Δs.
 */
export interface ColdReservoir {
  heatW: number;
  tK: number;
  kind?: "room" | "cascade";
}

export interface CycleSpec {
  fluid: Fluid;
  convention: TempConvention;
  /** Saturated suction temperature at the compressor, K (per `convention`). */
  evaporatingK: number;
  /** Condensing temperature, K (subcritical); for transcritical the gas-cooler outlet, K. */
  condensingK: number;
  superheatK: number;
  subcoolingK: number;
  compressor: CompressorInput;
  /** Heat taken up by the refrigerant at the low side, W (reservoirs + pump work). */
  loadW: number;
  coldReservoirs: ColdReservoir[];
  /** Temperature of the heat sink the condenser / gas cooler rejects to, K. */
  sinkK: number;
  /** Two-stage: intermediate saturation temperature, K; default the geometric-mean pressure. */
  intermediateK?: number;
  /**
   * Cascade low stage: the heat leaves through the desuperheating and condensing stream
   * itself, so the second-law bookkeeping takes that stream's thermodynamic mean
   * temperature Δh/Δs as the sink (reported as `sinkK`) instead of `sinkK` above.
   */
  sinkAtStreamMeanT?: boolean;
  /** R744: set point of the high-pressure control, Pa; undefined = optimise for the best COP. */
  highSidePa?: number;
  /** R744: gas-cooler outlet temperature at or below which the circuit condenses, K (default critical − 5 K). */
  switchOverK?: number;
}

export type EntropyComponent =
  | "compressor"
  | "lowStageCompressor"
  | "highStageCompressor"
  | "condenser"
  | "expansion"
  | "lowStageExpansion"
  | "highStageExpansion"
  | "intercooler"
  | "evaporator"
  /** A cascade exchanger, seen from the high stage evaporating in it (low stage's stream as the source). */
  | "cascadeExchanger";

export interface CycleResult {
  arrangement: "single-stage" | "two-stage" | "transcritical" | "subcritical-r744";
  statePoints: StatePoint[];
  /**
   * State-point ids in drawing order for the p–h chart: joined in this order the points trace
   * the cycle (isobars horizontal, valves vertical, compressions as chords).
   */
  chartPath: string[];
  stages: StageResult[];
  evaporatingPa: number;
  condensingPa: number;
  intermediatePa?: number;
  /** Low-side refrigerant mass flow (through the evaporators), kg/s. */
  massFlowKgS: number;
  loadW: number;
  shaftPowerW: number;
  /** Heat given up in the condenser / gas cooler, W. */
  condenserHeatW: number;
  oilCoolerHeatW: number;
  dischargeTempK: number;
  pressureRatio: number;
  /** Entropy generated per component, W/K (reservoir terms included). */
  entropyW_K: Partial<Record<EntropyComponent, number>>;
  /** Temperature the rejected heat leaves at in the entropy bookkeeping, K (spec.sinkK, or the stream mean). */
  sinkK: number;
  /** R744: how the high-side pressure was set, and the search bounds of the optimiser, Pa. */
  highSide?: { mode: "optimised" | "set"; searchFromPa?: number; searchToPa?: number };
}

/** Which pressure a saturation state at a convention temperature stands for. */
export function conventionPressure(sat: SaturationState, convention: TempConvention): number {
  return convention === "bubble" ? sat.pBubblePa : sat.pDewPa;
}

function point(id: string, label: string, p: PhaseProps): StatePoint {
  return { id, label, pPa: p.pPa, tK: p.tK, hJkg: p.hJkg, sJkgK: p.sJkgK };
}

/** Suction vapour at pPa: the dew-point vapour plus superheat. */
function suctionState(fluid: Fluid, sat: SaturationState, pPa: number, superheatK: number): PhaseProps {
  // Below 0.01 K a (P,T) flash would sit on the dew line itself, where phase is ambiguous.
  if (superheatK < 0.01) return { ...sat.vapour, pPa };
  return fluid.statePT(pPa, sat.vapour.tK + superheatK);
}

/** Liquid leaving the condenser at pPa: the bubble-point liquid minus subcooling. */
function liquidState(fluid: Fluid, sat: SaturationState, pPa: number, subcoolingK: number): PhaseProps {
  if (subcoolingK < 0.01) return { ...sat.liquid, pPa };
  return fluid.statePT(pPa, sat.liquid.tK - subcoolingK);
}

/** Discharge temperature an oil-injected screw's oil cooler holds by default, °C (common practice 70–90 °C). */
export const DEFAULT_OIL_COOLED_DISCHARGE_C = 80;

interface Compression {
  out: PhaseProps;
  /** Shaft work per kg, J/kg. */
  wJkg: number;
  /** Oil-cooler heat per kg, J/kg. */
  qOilJkg: number;
  etaIs: number;
  etaV: number;
  ratio: number;
}

/**
 * One compression: h2 = h1 + (h2s − h1)/η_is with h2s at (p_out, s1) (DOMAIN.md §2). For an
 * oil-injected screw the oil takes the heat above the set discharge temperature, so the
 * refrigerant leaves at that temperature and the shaft work is unchanged.
 */
function compress(fluid: Fluid, inlet: PhaseProps, pOutPa: number, c: CompressorInput): Compression {
  const ratio = pOutPa / inlet.pPa;
  const etaIs = isentropicEfficiency(c, ratio);
  const etaV = volumetricEfficiency(c, ratio);
  const s2s = fluid.statePS(pOutPa, inlet.sJkgK);
  const wJkg = (s2s.hJkg - inlet.hJkg) / etaIs;
  const hAdiabatic = inlet.hJkg + wJkg;
  if (c.type === "screw") {
    const tSetK = (c.oilCooledDischargeC ?? DEFAULT_OIL_COOLED_DISCHARGE_C) + 273.15;
    // Oil cooling can take the discharge down to the set point but never into the dome.
    const dewK = pOutPa < 0.999 * fluid.meta.criticalPressurePa ? fluid.saturationAtP(pOutPa).vapour.tK : fluid.meta.criticalTempK;
    const cooled = fluid.statePT(pOutPa, Math.max(tSetK, dewK + 1));
    if (cooled.hJkg < hAdiabatic) return { out: cooled, wJkg, qOilJkg: hAdiabatic - cooled.hJkg, etaIs, etaV, ratio };
  }
  let out: PhaseProps;
  try {
    out = fluid.statePH(pOutPa, hAdiabatic);
  } catch (err) {
    if (err instanceof ThermoRangeError)
      throw new PlantError(
        "INPUT_OUT_OF_RANGE",
        `the discharge state (pressure ratio ${ratio.toFixed(1)}, h = ${(hAdiabatic / 1000).toFixed(0)} kJ/kg) lies beyond the refrigerant model's range: far too hot for one stage; use two-stage compression, a cascade or an oil-cooled screw`,
        "arrangement",
      );
    throw err;
  }
  return { out, wJkg, qOilJkg: 0, etaIs, etaV, ratio };
}

function stage(name: StageResult["name"], m: number, inlet: PhaseProps, c: Compression): StageResult {
  const v = m / inlet.densityKgM3;
  return {
    name,
    massFlowKgS: m,
    suctionPa: inlet.pPa,
    dischargePa: c.out.pPa,
    pressureRatio: c.ratio,
    isentropicEfficiency: c.etaIs,
    volumetricEfficiency: c.etaV,
    suctionVolumeFlowM3s: v,
    sweptVolumeM3s: v / c.etaV,
    shaftPowerW: m * c.wJkg,
    dischargeTempK: c.out.tK,
    oilCoolerW: m * c.qOilJkg,
  };
}

/**
 * Entropy generated where the refrigerant takes up heat, given its entropy gain there
 * ṁ·(s_out − s_in). Room evaporators and cascade exchangers share the same inlet and outlet
 * states, so the refrigerant's gain splits in proportion to the heat each takes up; each
 * part less the entropy its source gives up (Q/T of the room air, or of the low stage's
 * stream at its mean temperature) is that component's generation. Pump heat has no source
 * outside the circuit and stays with the evaporators.
 */
function coldSideEntropy(spec: CycleSpec, gainW_K: number): Partial<Record<EntropyComponent, number>> {
  let qCascade = 0;
  let sCascade = 0;
  let sRooms = 0;
  for (const r of spec.coldReservoirs) {
    if (r.kind === "cascade") {
      qCascade += r.heatW;
      sCascade += r.heatW / r.tK;
    } else sRooms += r.heatW / r.tK;
  }
  if (qCascade <= 0) return { evaporator: gainW_K - sRooms };
  const f = Math.min(1, qCascade / spec.loadW);
  const out: Partial<Record<EntropyComponent, number>> = { cascadeExchanger: f * gainW_K - sCascade };
  if (f < 1) out.evaporator = (1 - f) * gainW_K - sRooms;
  return out;
}

/** The sink temperature of the entropy bookkeeping: the set sink, or the rejecting stream's Δh/Δs. */
function sinkOf(spec: CycleSpec, rejectedW: number, streamDropW_K: number): number {
  if (!spec.sinkAtStreamMeanT) return spec.sinkK;
  if (!(streamDropW_K > 0 && rejectedW > 0))
    throw new PlantError("INPUT_OUT_OF_RANGE", "the cascade low stage rejects no heat: its condensing temperature is not above its suction", "condensingC");
  return rejectedW / streamDropW_K;
}

function requireLiftPositive(field: string, evapK: number, condK: number): void {
  if (!(condK > evapK))
    throw new PlantError(
      "INPUT_OUT_OF_RANGE",
      `condensing temperature ${(condK - 273.15).toFixed(1)} °C is not above the suction temperature ${(evapK - 273.15).toFixed(1)} °C`,
      field,
    );
}

/**
 * Single-stage cycle (DOMAIN.md §2): ṁ = Q/(h1 − h4), W = ṁ·(h2 − h1), Q_cond = ṁ·(h2 − h3);
 * 1 suction after superheat, 2 discharge, 3 condenser outlet after subcooling, 4 after the
 * isenthalpic expansion (h4 = h3).
 */
export function singleStageCycle(spec: CycleSpec): CycleResult {
  const { fluid } = spec;
  requireLiftPositive("condensingC", spec.evaporatingK, spec.condensingK);
  const satE = fluid.saturationAtT(spec.evaporatingK, spec.convention);
  const satC = fluid.saturationAtT(spec.condensingK, spec.convention);
  const pE = conventionPressure(satE, spec.convention);
  const pC = conventionPressure(satC, spec.convention);
  return cycleAtPressures(spec, pE, pC, satE, liquidState(fluid, satC, pC, spec.subcoolingK), "single-stage");
}

/** The single-stage arithmetic once the high-side outlet state is known (shared with transcritical). */
function cycleAtPressures(
  spec: CycleSpec,
  pE: number,
  pHigh: number,
  satE: SaturationState,
  s3: PhaseProps,
  arrangement: CycleResult["arrangement"],
): CycleResult {
  const { fluid } = spec;
  const s1 = suctionState(fluid, satE, pE, spec.superheatK);
  const comp = compress(fluid, s1, pHigh, spec.compressor);
  const s4 = fluid.statePH(pE, s3.hJkg);
  const qJkg = s1.hJkg - s4.hJkg;
  if (!(qJkg > 0))
    throw new PlantError("INPUT_OUT_OF_RANGE", "no refrigerating effect: the liquid enters the evaporator hotter than it leaves", "condensingC");
  const m = spec.loadW / qJkg;
  const st = stage("single", m, s1, comp);
  const condenserHeatW = m * (comp.out.hJkg - s3.hJkg);
  const sinkK = sinkOf(spec, condenserHeatW, m * (comp.out.sJkgK - s3.sJkgK));
  const entropyW_K: CycleResult["entropyW_K"] = {
    // Compressor and its oil cooler together: the oil takes heat out at the sink.
    compressor: m * (comp.out.sJkgK - s1.sJkgK) + st.oilCoolerW / sinkK,
    condenser: m * (s3.sJkgK - comp.out.sJkgK) + condenserHeatW / sinkK,
    expansion: m * (s4.sJkgK - s3.sJkgK),
    ...coldSideEntropy(spec, m * (s1.sJkgK - s4.sJkgK)),
  };
  const highLabel = arrangement === "transcritical" ? "gas-cooler outlet" : "condenser outlet";
  return {
    arrangement,
    statePoints: [
      point("1", "compressor suction", s1),
      point("2", "compressor discharge", comp.out),
      point("3", highLabel, s3),
      point("4", "evaporator inlet", s4),
    ],
    chartPath: ["1", "2", "3", "4", "1"],
    stages: [st],
    evaporatingPa: pE,
    condensingPa: pHigh,
    massFlowKgS: m,
    loadW: spec.loadW,
    shaftPowerW: st.shaftPowerW,
    condenserHeatW,
    oilCoolerHeatW: st.oilCoolerW,
    dischargeTempK: comp.out.tK,
    pressureRatio: comp.ratio,
    entropyW_K,
    sinkK,
  };
}

/**
 * Two-stage compression with an open flash intercooler (Stoecker & Jones, "Refrigeration
 * and Air Conditioning", chapter on multipressure systems): the low stage discharges into
 * the intercooler, which desuperheats it to saturated vapour at the intermediate pressure
 * by evaporating liquid, and flashes the condensed liquid down to saturated liquid for the
 * low-stage expansion. Intercooler balance ṁ_H = ṁ_L·(h2 − h7)/(h3 − h6). Intermediate
 * pressure √(p_evap·p_cond) unless set (common practice for near-equal stage ratios).
 * States: 1 LP suction, 2 LP discharge, 3 HP suction (saturated vapour), 4 HP discharge,
 * 5 condenser outlet, 6 after the HP valve, 7 intercooler liquid, 8 evaporator inlet.
 */
export function twoStageCycle(spec: CycleSpec): CycleResult {
  const { fluid } = spec;
  requireLiftPositive("condensingC", spec.evaporatingK, spec.condensingK);
  const satE = fluid.saturationAtT(spec.evaporatingK, spec.convention);
  const satC = fluid.saturationAtT(spec.condensingK, spec.convention);
  const pE = conventionPressure(satE, spec.convention);
  const pC = conventionPressure(satC, spec.convention);
  let pI: number;
  let satI: SaturationState;
  if (spec.intermediateK !== undefined) {
    if (!(spec.intermediateK > spec.evaporatingK && spec.intermediateK < spec.condensingK))
      throw new PlantError(
        "INPUT_OUT_OF_RANGE",
        "intermediate temperature must lie between the suction and condensing temperatures",
        "intermediateC",
      );
    satI = fluid.saturationAtT(spec.intermediateK, spec.convention);
    pI = conventionPressure(satI, spec.convention);
  } else {
    pI = Math.sqrt(pE * pC);
    satI = fluid.saturationAtP(pI);
  }
  const s1 = suctionState(fluid, satE, pE, spec.superheatK);
  const lp = compress(fluid, s1, pI, spec.compressor);
  const s3: PhaseProps = { ...satI.vapour, pPa: pI };
  const hp = compress(fluid, s3, pC, spec.compressor);
  const s5 = liquidState(fluid, satC, pC, spec.subcoolingK);
  const s6 = fluid.statePH(pI, s5.hJkg);
  const s7: PhaseProps = { ...satI.liquid, pPa: pI };
  const s8 = fluid.statePH(pE, s7.hJkg);
  const mL = spec.loadW / (s1.hJkg - s8.hJkg);
  const mH = (mL * (lp.out.hJkg - s7.hJkg)) / (s3.hJkg - s6.hJkg);
  const low = stage("low", mL, s1, lp);
  const high = stage("high", mH, s3, hp);
  const condenserHeatW = mH * (hp.out.hJkg - s5.hJkg);
  const sinkK = sinkOf(spec, condenserHeatW, mH * (hp.out.sJkgK - s5.sJkgK));
  const entropyW_K: CycleResult["entropyW_K"] = {
    lowStageCompressor: mL * (lp.out.sJkgK - s1.sJkgK) + low.oilCoolerW / sinkK,
    highStageCompressor: mH * (hp.out.sJkgK - s3.sJkgK) + high.oilCoolerW / sinkK,
    intercooler: mH * s3.sJkgK + mL * s7.sJkgK - mL * lp.out.sJkgK - mH * s6.sJkgK,
    condenser: mH * (s5.sJkgK - hp.out.sJkgK) + condenserHeatW / sinkK,
    highStageExpansion: mH * (s6.sJkgK - s5.sJkgK),
    lowStageExpansion: mL * (s8.sJkgK - s7.sJkgK),
    ...coldSideEntropy(spec, mL * (s1.sJkgK - s8.sJkgK)),
  };
  const oil = low.oilCoolerW + high.oilCoolerW;
  return {
    arrangement: "two-stage",
    statePoints: [
      point("1", "low-stage suction", s1),
      point("2", "low-stage discharge", lp.out),
      point("3", "high-stage suction", s3),
      point("4", "high-stage discharge", hp.out),
      point("5", "condenser outlet", s5),
      point("6", "intercooler inlet (after high-stage valve)", s6),
      point("7", "intercooler liquid outlet", s7),
      point("8", "evaporator inlet", s8),
    ],
    chartPath: ["1", "2", "3", "4", "5", "6", "7", "8", "1"],
    stages: [low, high],
    evaporatingPa: pE,
    condensingPa: pC,
    intermediatePa: pI,
    massFlowKgS: mL,
    loadW: spec.loadW,
    shaftPowerW: low.shaftPowerW + high.shaftPowerW,
    condenserHeatW,
    oilCoolerHeatW: oil,
    dischargeTempK: Math.max(lp.out.tK, hp.out.tK),
    pressureRatio: pC / pE,
    entropyW_K,
    sinkK,
  };
}

/**
 * Margin below the critical temperature at or under which an R744 circuit condenses by
 * default, K: a gas-cooler outlet of about 26 °C and below (common practice for the
 * switch-over of CO2 plant between condensing and gas-cooler mode, from memory; settable per
 * circuit as `switchOverC`).
 */
export const SUBCRITICAL_MARGIN_K = 5;

/** Highest high-side pressure the optimiser searches and a set point may take, Pa (common HP-side design limit). */
export const R744_HIGH_SIDE_MAX_PA = 14e6;

/**
 * The lowest high-side pressure that makes sense for a gas-cooler outlet temperature: below
 * the critical temperature, just above the saturation pressure there (the outlet is then
 * liquid, as when condensing); at or above it, the critical pressure (below it the outlet
 * would be gas and the valve would expand gas).
 */
export function lowestHighSidePa(fluid: Fluid, outK: number): number {
  if (outK < fluid.meta.criticalTempK - 0.2) return fluid.saturationAtT(outK, "dew").pDewPa * 1.0005;
  return fluid.meta.criticalPressurePa;
}

/**
 * R744 with a gas cooler. When the gas-cooler outlet temperature is at or below the
 * switch-over (default critical − 5 K) the cycle condenses (subcritical, condensing at that
 * temperature into a liquid receiver). Otherwise it runs transcritical at the set point of
 * the high-pressure control when one is given, else at the pressure p that maximises
 * COP(p) = (h1 − h3(p, T_gco)) / (h2(p) − h1) (the optimum of Kauf 1999 / Liao, Zhao &
 * Jakobsen 2000, found numerically): a scan of 24 pressures from the lowest sensible one
 * (`lowestHighSidePa`: just above the saturation pressure when the outlet is below the
 * critical temperature) to 14 MPa, then golden-section search to 1 kPa in the bracket of
 * the best scan point.
 */
export function transcriticalCycle(spec: CycleSpec): CycleResult {
  const { fluid } = spec;
  const tcK = fluid.meta.criticalTempK;
  const outK = spec.condensingK;
  const switchK = Math.min(spec.switchOverK ?? tcK - SUBCRITICAL_MARGIN_K, tcK - 1);
  if (outK <= switchK) {
    return { ...singleStageCycle(spec), arrangement: "subcritical-r744" };
  }
  requireLiftPositive("approachK", spec.evaporatingK, outK);
  const satE = fluid.saturationAtT(spec.evaporatingK, spec.convention);
  const pE = conventionPressure(satE, spec.convention);
  const lowest = lowestHighSidePa(fluid, outK);
  const highest = Math.min(R744_HIGH_SIDE_MAX_PA, fluid.range.pMaxPa);
  if (spec.highSidePa !== undefined) {
    if (!(spec.highSidePa >= lowest && spec.highSidePa <= highest))
      throw new PlantError(
        "INPUT_OUT_OF_RANGE",
        `the high-side set point ${(spec.highSidePa / 1e5).toFixed(1)} bar(a) is outside ${(lowest / 1e5).toFixed(1)}…${(highest / 1e5).toFixed(0)} bar(a) for a gas-cooler outlet of ${(outK - 273.15).toFixed(1)} °C` +
          (outK < tcK ? " (the lower end is the saturation pressure there: below it the CO2 cannot leave the gas cooler as liquid)" : " (below the critical pressure the outlet would be gas)"),
        "highSidePa",
        { min: lowest, max: highest, unit: "Pa" },
      );
    const s3 = fluid.statePT(spec.highSidePa, outK);
    if (!(s3.hJkg < suctionState(fluid, satE, pE, spec.superheatK).hJkg))
      throw new PlantError(
        "INPUT_OUT_OF_RANGE",
        `at the high-side set point ${(spec.highSidePa / 1e5).toFixed(1)} bar(a) the CO2 leaves the gas cooler at ${(outK - 273.15).toFixed(1)} °C with more enthalpy than the suction vapour: no refrigerating effect; raise the set point or leave it to the optimiser`,
        "highSidePa",
        { min: lowest, max: highest, unit: "Pa" },
      );
    return { ...cycleAtPressures(spec, pE, spec.highSidePa, satE, s3, "transcritical"), highSide: { mode: "set" } };
  }
  const s1 = suctionState(fluid, satE, pE, spec.superheatK);
  const cop = (p: number) => {
    const c = compress(fluid, s1, p, spec.compressor);
    const h3 = fluid.statePT(p, outK).hJkg;
    return (s1.hJkg - h3) / c.wJkg;
  };
  // Coarse scan first: near the critical point COP(p) rises steeply and a golden section
  // alone could settle on the wrong side of a kink; the scan brackets the maximum.
  const n = 24;
  const ps: number[] = [];
  const fs: number[] = [];
  for (let i = 0; i < n; i++) {
    const p = lowest + ((highest - lowest) * i) / (n - 1);
    ps.push(p);
    fs.push(cop(p));
  }
  let best = 0;
  for (let i = 1; i < n; i++) if (fs[i] > fs[best]) best = i;
  let a = ps[Math.max(0, best - 1)];
  let b = ps[Math.min(n - 1, best + 1)];
  const phi = (Math.sqrt(5) - 1) / 2;
  let x1 = b - phi * (b - a);
  let x2 = a + phi * (b - a);
  let f1 = cop(x1);
  let f2 = cop(x2);
  while (b - a > 1e3) {
    if (f1 < f2) {
      a = x1;
      x1 = x2;
      f1 = f2;
      x2 = a + phi * (b - a);
      f2 = cop(x2);
    } else {
      b = x2;
      x2 = x1;
      f2 = f1;
      x1 = b - phi * (b - a);
      f1 = cop(x1);
    }
  }
  // The bracket's ends are candidates too (the optimum may sit at the lowest sensible pressure).
  let pGc = (a + b) / 2;
  let fBest = cop(pGc);
  for (const p of [ps[Math.max(0, best - 1)], ps[Math.min(n - 1, best + 1)], ps[best]]) {
    const f = cop(p);
    if (f > fBest) {
      fBest = f;
      pGc = p;
    }
  }
  const s3 = fluid.statePT(pGc, outK);
  return { ...cycleAtPressures(spec, pE, pGc, satE, s3, "transcritical"), highSide: { mode: "optimised", searchFromPa: lowest, searchToPa: highest } };
}
