/**
 * Compressor efficiency curves over pressure ratio. The default curve parameters are
 * "common practice" (DOMAIN.md §5: isentropic efficiency about 0.65–0.75 reciprocating and
 * 0.60–0.78 screw across their range, volumetric efficiency falling with pressure ratio);
 * they describe a generic machine of each type, not any maker's product.
 */
import type { CompressorInput, CompressorType, IsentropicCurve, VolumetricCurve } from "./schema";

export const DEFAULT_ISENTROPIC: Record<CompressorType, IsentropicCurve> = {
  reciprocating: { peak: 0.75, designRatio: 3, curvature: 0.06 },
  // Screws peak near their built-in volume ratio (Vi ≈ 3.6 → PR ≈ 4.5 for ammonia).
  screw: { peak: 0.78, designRatio: 4.5, curvature: 0.12 },
  scroll: { peak: 0.7, designRatio: 3, curvature: 0.08 },
};

export const DEFAULT_VOLUMETRIC: Record<CompressorType, VolumetricCurve> = {
  reciprocating: { clearance: 0.05, polytropicExponent: 1.3, leakage: 0.97 },
  screw: { clearance: 0.01, polytropicExponent: 1.3, leakage: 0.93 },
  scroll: { clearance: 0.015, polytropicExponent: 1.2, leakage: 0.95 },
};

/** Discharge temperature limits by compressor type, °C (common practice). */
export const DISCHARGE_LIMIT_C: Record<CompressorType, number> = {
  reciprocating: 130,
  screw: 100,
  scroll: 120,
};

/**
 * Discharge temperature above which no compressor and oil are fit to run, °C: ammonia
 * practice keeps the discharge to about 120–150 °C because the oil breaks down and cokes
 * on the valves above it (common practice, from memory). Above this the plant reports the
 * cycle with a prominent warning instead of sizing it quietly.
 */
export const DISCHARGE_EXTREME_C = 150;

/** Single-stage pressure ratio above which two stages or a cascade is the usual answer (common practice). */
export const PRESSURE_RATIO_LIMIT: Record<CompressorType, number> = {
  reciprocating: 8,
  screw: 12,
  scroll: 8,
};

/**
 * Isentropic efficiency η_is(PR) = peak − curvature·ln(PR/PR_design)², floored at 0.3
 * (a parabola in log pressure ratio: the under/over-compression loss shape of a fixed
 * built-in ratio; common-practice parameters).
 */
export function isentropicEfficiency(c: Pick<CompressorInput, "type" | "isentropic">, pressureRatio: number): number {
  if (typeof c.isentropic === "number") return c.isentropic;
  const k = c.isentropic ?? DEFAULT_ISENTROPIC[c.type];
  const l = Math.log(pressureRatio / k.designRatio);
  return Math.max(0.3, k.peak - k.curvature * l * l);
}

/**
 * Volumetric efficiency η_v(PR) = leakage·(1 − C·(PR^(1/n) − 1)) — the clearance
 * re-expansion model of the ideal reciprocating compressor (any applied-thermodynamics
 * textbook) with a leakage factor; floored at 0.05 so a machine past its ratio limit shows
 * a tiny capacity rather than a negative one.
 */
export function volumetricEfficiency(c: Pick<CompressorInput, "type" | "volumetric">, pressureRatio: number): number {
  if (typeof c.volumetric === "number") return c.volumetric;
  const k = c.volumetric ?? DEFAULT_VOLUMETRIC[c.type];
  return Math.max(0.05, k.leakage * (1 - k.clearance * (Math.pow(pressureRatio, 1 / k.polytropicExponent) - 1)));
}
