/**
 * Refrigerant charge estimate of each circuit: the sum over its parts (evaporators, condenser
 * or cascade exchanger, receivers and vessels, pipework) of
 *
 *   m = V · ρ̄,   ρ̄ = φ · ρ_liquid + (1 − φ) · ρ_vapour
 *
 * with V the part's internal volume and φ the liquid fraction of that volume (the "fill"),
 * both densities at the saturation state the part works at (evaporating, condensing,
 * intermediate or suction temperature) from the property engine. A part above the critical
 * point (a transcritical gas cooler) holds one phase: ρ̄ = ρ(p, T) at its mean state.
 *
 * Default volumes are per kW of the part's duty and default fill fractions are rules of the
 * trade (common practice, listed in CHARGE_DEFAULTS with their basis): they give an order of
 * magnitude for comparing options, not a charge to fill a plant with. Every volume and
 * fraction can be overridden per part by the user (the manufacturer's internal volumes, the
 * measured pipe runs).
 */
import { z } from "zod";
import type { Fluid, FluidId, State } from "../thermo/types";
import type { CircuitResult } from "./circuit";
import type { EvaporatorSizing } from "./evaporator";

const K0 = 273.15;

export type ChargePartKind =
  | "evaporator"
  | "condenser"
  | "gas-cooler"
  | "cascade-hx"
  | "receiver"
  | "separator"
  | "intercooler"
  | "liquid-line"
  | "suction-line"
  | "wet-return"
  | "discharge-line";

interface PartDefault {
  /** Internal volume per kW of the part's duty, dm³/kW. */
  dm3PerKw: number;
  /** Liquid fraction of the internal volume in operation. */
  liquidFraction: number;
  /** Which duty the volume scales with. */
  per: "duty" | "refrigeration" | "heat rejected";
  basis: string;
}

/**
 * Default internal volumes and fill fractions (common practice: typical catalogue internal
 * volumes and operating levels, rounded; they are estimates for comparing options).
 */
export const CHARGE_DEFAULTS: Record<ChargePartKind | "evaporator-dx" | "evaporator-pumped", PartDefault> = {
  evaporator: { dm3PerKw: 0.5, liquidFraction: 0.25, per: "duty", basis: "common practice: DX unit cooler about 0.5 dm³/kW, about 25 % liquid" },
  "evaporator-dx": { dm3PerKw: 0.5, liquidFraction: 0.25, per: "duty", basis: "common practice: DX unit cooler about 0.5 dm³/kW, about 25 % liquid" },
  "evaporator-pumped": { dm3PerKw: 1.0, liquidFraction: 0.4, per: "duty", basis: "common practice: overfed (pumped) coil about 1 dm³/kW, about 40 % liquid" },
  condenser: { dm3PerKw: 0.4, liquidFraction: 0.2, per: "heat rejected", basis: "common practice: condenser coil about 0.4 dm³/kW rejected, about 20 % liquid (drain and subcooling)" },
  "gas-cooler": { dm3PerKw: 0.3, liquidFraction: 1, per: "heat rejected", basis: "common practice: gas cooler about 0.3 dm³/kW rejected, one phase above the critical point" },
  "cascade-hx": { dm3PerKw: 0.2, liquidFraction: 0.3, per: "heat rejected", basis: "common practice: plate cascade exchanger about 0.2 dm³/kW, about 30 % liquid" },
  receiver: { dm3PerKw: 1.0, liquidFraction: 0.3, per: "refrigeration", basis: "common practice: high-pressure receiver about 1 dm³/kW, 20–40 % full in operation" },
  separator: { dm3PerKw: 1.5, liquidFraction: 0.3, per: "refrigeration", basis: "common practice: pumped low-pressure receiver about 1.5 dm³/kW, about 30 % full" },
  intercooler: { dm3PerKw: 0.3, liquidFraction: 0.3, per: "refrigeration", basis: "common practice: flash intercooler about 0.3 dm³/kW, about 30 % full" },
  "liquid-line": { dm3PerKw: 0.2, liquidFraction: 1, per: "refrigeration", basis: "common practice: liquid line about 0.2 dm³/kW, full of liquid" },
  "suction-line": { dm3PerKw: 1.0, liquidFraction: 0, per: "refrigeration", basis: "common practice: dry suction line about 1 dm³/kW, vapour only" },
  "wet-return": { dm3PerKw: 1.0, liquidFraction: 0.25, per: "refrigeration", basis: "common practice: wet return about 1 dm³/kW, about 25 % liquid" },
  "discharge-line": { dm3PerKw: 0.3, liquidFraction: 0, per: "heat rejected", basis: "common practice: discharge line about 0.3 dm³/kW, vapour (saturated density: an upper bound)" },
};

const msgRange = (lo: number, hi: number, unit: string) => `must be between ${lo} and ${hi} ${unit}`.trim();

/** A user's value for one part, by the part's key (e.g. "evaporator:ev-frozen", "receiver:lt"). */
export const chargeOverrideSchema = z.object({
  id: z.string().min(1, "must not be empty").max(200),
  /** Internal volume of the part, m³. */
  volumeM3: z.number(msgRange(0, 1000, "m³")).min(0, msgRange(0, 1000, "m³")).max(1000, msgRange(0, 1000, "m³")).optional(),
  /** Liquid fraction of the volume, 0…1. */
  liquidFraction: z.number(msgRange(0, 1, "")).min(0, msgRange(0, 1, "")).max(1, msgRange(0, 1, "")).optional(),
});
export type ChargeOverride = z.output<typeof chargeOverrideSchema>;

export interface ChargePart {
  key: string;
  kind: ChargePartKind;
  label: string;
  volumeM3: number;
  volumeSource: "default" | "user";
  liquidFraction: number;
  fractionSource: "default" | "user";
  basis: string;
  /** The state the densities are taken at. */
  tempC: number;
  pPa: number;
  /** true above the critical point (one phase; ρ̄ = ρ(p, T)). */
  supercritical: boolean;
  liquidDensityKgM3: number;
  vapourDensityKgM3: number;
  meanDensityKgM3: number;
  massKg: number;
}

export interface CircuitCharge {
  circuitId: string;
  tag: string;
  refrigerant: FluidId;
  parts: ChargePart[];
  chargeKg: number;
}

export interface ChargeEstimate {
  circuits: CircuitCharge[];
  totalKg: number;
  /** Charge per refrigerant, kg. */
  byRefrigerant: Partial<Record<FluidId, number>>;
}

interface PartSpec {
  key: string;
  kind: ChargePartKind;
  label: string;
  defaultKey: keyof typeof CHARGE_DEFAULTS;
  dutyW: number;
  /** Saturation temperature of the part, °C (or the mean temperature above the critical point). */
  tempC: number;
  /** Above the critical point: the pressure, Pa. */
  supercriticalPa?: number;
}

/** Mean density of a part at a saturation temperature: φ·ρ_L + (1 − φ)·ρ_V. */
export function twoPhaseMeanDensity(fluid: Fluid, tempC: number, liquidFraction: number, convention: "dew" | "bubble" | "mean" = "dew") {
  const sat = fluid.saturationAtT(tempC + K0, convention);
  const rhoL = sat.liquid.densityKgM3;
  const rhoV = sat.vapour.densityKgM3;
  return { rhoL, rhoV, mean: liquidFraction * rhoL + (1 - liquidFraction) * rhoV, pPa: sat.pDewPa };
}

function partsOf(c: CircuitResult, evs: EvaporatorSizing[], condenserTag: (id: string) => string): PartSpec[] {
  const out: PartSpec[] = [];
  const pumped = c.pumpedEvaporatorIds.length > 0;
  for (const e of evs)
    out.push({
      key: `evaporator:${e.id}`,
      kind: "evaporator",
      label: `Evaporator ${e.tag}`,
      defaultKey: e.feed.type === "pumped" ? "evaporator-pumped" : "evaporator-dx",
      dutyW: e.dutyW,
      tempC: e.evaporatingC,
    });
  const refr = c.refrigerationW;
  const rej = c.heatRejectedW;
  if (c.gasCoolerPa !== undefined) {
    out.push({
      key: `gas-cooler:${c.id}`,
      kind: "gas-cooler",
      label: `Gas cooler (${condenserTag(c.rejectsTo.id)})`,
      defaultKey: "gas-cooler",
      dutyW: rej,
      tempC: (c.condensingC + c.dischargeTempC) / 2,
      supercriticalPa: c.gasCoolerPa,
    });
  } else if (c.rejectsTo.kind === "circuit") {
    out.push({ key: `cascade-hx:${c.id}`, kind: "cascade-hx", label: `Cascade exchanger ${c.scheduleTags.cascadeHx}`, defaultKey: "cascade-hx", dutyW: rej, tempC: c.condensingC });
  } else {
    out.push({ key: `condenser:${c.id}`, kind: "condenser", label: `Condenser ${condenserTag(c.rejectsTo.id)} (this circuit's share)`, defaultKey: "condenser", dutyW: rej, tempC: c.condensingC });
  }
  // Above the critical point a receiver would sit at a flash-tank pressure this model does not
  // have; the liquid side is then taken at the gas-cooler outlet (one phase).
  const liquidSide = c.gasCoolerPa !== undefined ? { tempC: c.condensingC, supercriticalPa: c.gasCoolerPa } : { tempC: c.condensingC };
  out.push({ key: `receiver:${c.id}`, kind: "receiver", label: "High-pressure receiver", defaultKey: "receiver", dutyW: refr, ...liquidSide });
  if (c.intermediateC !== undefined)
    out.push({ key: `intercooler:${c.id}`, kind: "intercooler", label: `Intercooler ${c.scheduleTags.intercooler}`, defaultKey: "intercooler", dutyW: refr, tempC: c.intermediateC });
  if (pumped)
    out.push({ key: `separator:${c.id}`, kind: "separator", label: `Pumped separator ${c.scheduleTags.separator}`, defaultKey: "separator", dutyW: refr, tempC: c.suctionC });
  out.push({ key: `liquid-line:${c.id}`, kind: "liquid-line", label: "Liquid line", defaultKey: "liquid-line", dutyW: refr, ...liquidSide });
  if (pumped)
    out.push({ key: `wet-return:${c.id}`, kind: "wet-return", label: "Wet return", defaultKey: "wet-return", dutyW: refr, tempC: c.suctionC });
  else out.push({ key: `suction-line:${c.id}`, kind: "suction-line", label: "Suction line", defaultKey: "suction-line", dutyW: refr, tempC: c.suctionC });
  if (c.gasCoolerPa === undefined)
    out.push({ key: `discharge-line:${c.id}`, kind: "discharge-line", label: "Discharge line", defaultKey: "discharge-line", dutyW: rej, tempC: c.condensingC });
  return out;
}

export interface ChargeOptions {
  overrides?: readonly ChargeOverride[];
  getFluid: (id: FluidId) => Fluid;
  /** Tag of a condenser by id (for labels); default the id. */
  condenserTag?: (id: string) => string;
}

/**
 * Charge estimate of every circuit of a computed plant (the circuits and sized evaporators of
 * `computeFacility`), with the user's overrides applied by part key.
 */
export function estimateCharge(circuits: readonly CircuitResult[], evaporators: readonly EvaporatorSizing[], opts: ChargeOptions): ChargeEstimate {
  const over = new Map((opts.overrides ?? []).map((o) => [o.id, o]));
  const tagOf = opts.condenserTag ?? ((id: string) => id);
  const result: CircuitCharge[] = circuits.map((c) => {
    const fluid = opts.getFluid(c.refrigerant);
    const evs = evaporators.filter((e) => e.circuitId === c.id);
    const parts = partsOf(c, evs, tagOf).map((p): ChargePart => {
      const d = CHARGE_DEFAULTS[p.defaultKey];
      const o = over.get(p.key);
      const volumeM3 = o?.volumeM3 ?? (d.dm3PerKw * p.dutyW) / 1000 / 1000;
      const liquidFraction = o?.liquidFraction ?? d.liquidFraction;
      let rhoL: number, rhoV: number, mean: number, pPa: number;
      if (p.supercriticalPa !== undefined) {
        const s: State = fluid.statePT(p.supercriticalPa, p.tempC + K0);
        rhoL = rhoV = mean = s.densityKgM3;
        pPa = p.supercriticalPa;
      } else {
        ({ rhoL, rhoV, mean, pPa } = twoPhaseMeanDensity(fluid, p.tempC, liquidFraction, c.tempConvention));
      }
      return {
        key: p.key,
        kind: p.kind,
        label: p.label,
        volumeM3,
        volumeSource: o?.volumeM3 !== undefined ? "user" : "default",
        liquidFraction: p.supercriticalPa !== undefined ? 1 : liquidFraction,
        fractionSource: o?.liquidFraction !== undefined ? "user" : "default",
        basis: o?.volumeM3 !== undefined ? "volume entered by the user" : d.basis,
        tempC: p.tempC,
        pPa,
        supercritical: p.supercriticalPa !== undefined,
        liquidDensityKgM3: rhoL,
        vapourDensityKgM3: rhoV,
        meanDensityKgM3: mean,
        massKg: volumeM3 * mean,
      };
    });
    return { circuitId: c.id, tag: c.tag, refrigerant: c.refrigerant, parts, chargeKg: parts.reduce((s, p) => s + p.massKg, 0) };
  });
  const byRefrigerant: Partial<Record<FluidId, number>> = {};
  for (const c of result) byRefrigerant[c.refrigerant] = (byRefrigerant[c.refrigerant] ?? 0) + c.chargeKg;
  return { circuits: result, totalKg: result.reduce((s, c) => s + c.chargeKg, 0), byRefrigerant };
}
