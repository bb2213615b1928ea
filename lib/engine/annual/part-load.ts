/**
 * Compressor part load: the electrical input at a part-load ratio PLR (load ÷ capacity at the
 * hour's temperatures) as a fraction of the full-load input at the same temperatures.
 */
import type { CapacityControl, LeadControl } from "./schema";
import type { CompressorType } from "../plant/schema";

/**
 * Cycling loss: part-load factor PLF = 1 − C_d·(1 − PLR), power fraction = PLR / PLF — the
 * degradation-coefficient form of AHRI Standard 210/240 (unitary equipment; default
 * C_d = 0.25 as that standard's default, from memory). Stated, not measured for any machine.
 */
export const CYCLING_SOURCE = "cycling degradation PLF = 1 − C_d·(1 − PLR), AHRI Standard 210/240 form (default C_d 0.25, from memory)";

/**
 * Generic oil-injected screw with slide-valve unloading: (capacity fraction, power fraction).
 * Shape after the part-load figure for screw compressors in W. F. Stoecker, "Industrial
 * Refrigeration Handbook" (McGraw-Hill, 1998), chapter on screw compressors — read from
 * memory, not a maker's data: the input falls much more slowly than the capacity, about 2/3
 * of full power at half capacity. Give `curve` for a real machine.
 */
export const SLIDE_VALVE_CURVE: ReadonlyArray<readonly [number, number]> = [
  [0.1, 0.33],
  [0.25, 0.45],
  [0.5, 0.66],
  [0.75, 0.84],
  [1, 1],
];
export const SLIDE_VALVE_SOURCE =
  "slide-valve part-load curve shape after Stoecker, Industrial Refrigeration Handbook (1998), screw-compressor chapter (from memory; generic, not maker data)";

/**
 * Variable speed: compressor efficiency relative to full speed, (speed fraction, ratio) —
 * leakage grows at low speed, friction and port losses fall at middle speeds; generic shape
 * from memory of published screw / scroll inverter data, marked as such. Capacity is taken
 * proportional to speed.
 */
export const VSD_EFFICIENCY_CURVE: ReadonlyArray<readonly [number, number]> = [
  [0.2, 0.8],
  [0.3, 0.88],
  [0.5, 0.97],
  [0.75, 1.0],
  [1, 1],
];
export const VSD_SOURCE =
  "variable speed: capacity ∝ speed; power = PLR/(η_rel(speed)·η_drive); η_rel curve generic, from memory (not maker data); drive efficiency as given";

function interp(curve: ReadonlyArray<readonly [number, number]>, x: number): number {
  if (x <= curve[0][0]) return curve[0][1];
  for (let i = 1; i < curve.length; i++) {
    if (x <= curve[i][0]) {
      const [x0, y0] = curve[i - 1];
      const [x1, y1] = curve[i];
      return y0 + ((y1 - y0) * (x - x0)) / (x1 - x0);
    }
  }
  return curve[curve.length - 1][1];
}

/** Power fraction of a machine cycling on/off at a step of capacity `stepFrac` with power `stepPower`. */
function cycling(plr: number, stepFrac: number, stepPower: number, cd: number): number {
  const x = plr / stepFrac;
  return (stepPower * x) / (1 - cd * (1 - x));
}

/** Power fraction of one compressor under its own control at PLR in [0, 1]. */
export function leadPowerFraction(plr: number, c: LeadControl): number {
  if (plr <= 0) return 0;
  if (plr >= 1) return c.type === "variable-speed" ? 1 / (interp(c.efficiencyCurve ?? VSD_EFFICIENCY_CURVE, 1) * c.driveEfficiency) : 1;
  switch (c.type) {
    case "onoff":
      return cycling(plr, 1, 1, c.cyclingLossCd);
    case "slide-valve": {
      const curve = c.curve ?? SLIDE_VALVE_CURVE;
      const min = curve[0][0];
      if (plr >= min) return interp(curve, plr);
      return cycling(plr, min, curve[0][1], c.cyclingLossCd);
    }
    case "variable-speed": {
      const curve = c.efficiencyCurve ?? VSD_EFFICIENCY_CURVE;
      const at = (s: number) => s / (interp(curve, s) * c.driveEfficiency);
      if (plr >= c.minSpeed) return at(plr);
      return cycling(plr, c.minSpeed, at(c.minSpeed), c.cyclingLossCd);
    }
  }
}

/**
 * Power fraction of the compressor set at PLR in [0, 1]. Staged: n = ⌈PLR·N⌉ machines run,
 * n − 1 at full load and the lead one trimming at PLR·N − (n − 1) under its own control.
 */
export function powerFraction(plr: number, c: CapacityControl, units: number): number {
  if (plr <= 0) return 0;
  if (c.type !== "staged") return leadPowerFraction(plr, c);
  const n = c.compressors ?? units;
  const x = Math.min(1, plr) * n;
  const on = Math.max(1, Math.ceil(x - 1e-12));
  return (on - 1 + leadPowerFraction(x - (on - 1), c.lead)) / n;
}

/** The default control for a compressor type and set size (stated in the README). */
export function defaultCapacityControl(type: CompressorType, runningUnits: number): CapacityControl {
  const lead: LeadControl = type === "screw" ? { type: "slide-valve", cyclingLossCd: 0.25 } : { type: "onoff", cyclingLossCd: 0.25 };
  if (runningUnits >= 2) return { type: "staged", compressors: runningUnits, lead };
  return lead;
}

export function controlSource(c: CapacityControl): string {
  const one = (l: LeadControl) =>
    l.type === "onoff" ? CYCLING_SOURCE : l.type === "slide-valve" ? (l.curve ? "slide-valve curve given by the user" : SLIDE_VALVE_SOURCE) : l.efficiencyCurve ? "variable speed, efficiency curve given by the user" : VSD_SOURCE;
  return c.type === "staged" ? `${c.compressors ?? "all running"} compressors staged, lead trimming: ${one(c.lead)}` : one(c);
}
