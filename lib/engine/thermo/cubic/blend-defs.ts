import type { FluidId, FluidMeta, SafetyGroup } from "../types";
import type { ComponentId } from "./components";

/**
 * Binary interaction parameters k_ij of the PR model, fitted with scripts/fit-cubic-kij.ts to
 * binary bubble pressures of CoolProp 8.0.0's multi-fluid mixture model (which carries the
 * published binary parameters of Lemmon & Jacobsen 2004 for the HFC pairs and of Bell et al.,
 * J. Phys. Chem. Ref. Data 2022/2023 and J. Chem. Eng. Data 2016/2025, for the HFO pairs),
 * at 230…330 K and x1 = 0.2/0.5/0.8, as k_ij(T) = k + slope·(T − 280 K)/100 K (a value per
 * temperature, then a straight line). Each entry is [k, slope].
 */
export const KIJ: Record<string, readonly [number, number]> = {
  "R125/R143a": [-0.01140, 0.00359],
  "R125/R134a": [0.00153, 0.00394],
  "R143a/R134a": [-0.00287, 0.00112],
  "R32/R125": [0.00074, 0.01466],
  "R32/R1234yf": [0.03919, 0.00957],
  "R32/R134a": [-0.00002, 0.00145],
  "R32/R1234zeE": [0.01960, 0.00649],
  "R125/R1234yf": [0.00196, 0.00057],
  "R125/R1234zeE": [0.00281, 0.00070],
  "R1234yf/R134a": [0.01824, 0.00187],
  "R1234yf/R1234zeE": [0.00279, 0.00120],
  "R134a/R1234zeE": [0.01561, 0.00009],
};

/** [k_ij at 280 K, dk_ij/dT per 100 K] of a pair; [0, 0] for pairs no blend here uses. */
export function kij(a: ComponentId, b: ComponentId): readonly [number, number] {
  return KIJ[`${a}/${b}`] ?? KIJ[`${b}/${a}`] ?? [0, 0];
}

/**
 * 100-year GWP of the components from the IPCC Fourth Assessment Report (AR4, WG1 ch. 2,
 * Table 2.14), the values the EU F-gas Regulation (EU) No 517/2014 Annex I uses; a blend's
 * GWP is the mass-weighted sum (Regulation 517/2014 Annex IV).
 */
export const GWP_AR4: Record<ComponentId, number> = {
  R32: 675,
  R125: 3500,
  R134a: 1430,
  R143a: 4470,
  R1234yf: 4,
  R1234zeE: 7,
};

export interface BlendDef {
  id: FluidId;
  name: string;
  /** Nominal mass fractions (ASHRAE 34 / ISO 817). */
  massFractions: Partial<Record<ComponentId, number>>;
  safetyGroup: SafetyGroup;
  zeotropic: boolean;
  /** Critical point of the real blend at nominal composition (source in `criticalSource`). */
  criticalTempK: number;
  criticalPressurePa: number;
  criticalDensityKgM3: number;
  /** Highest saturation pressure the model serves (below the blend's critical region). */
  pMaxPa: number;
  /**
   * k_ij (at 280 K) that replace the binary-fitted value for this blend, fitted to the blend's
   * own bubble and dew pressures (CoolProp fixture, −50…+50 °C) where the binary value leaves
   * a systematic offset in a five- or four-component blend.
   */
  kijOverride?: Record<string, number>;
}

/**
 * Critical points: CoolProp 8.0.0 multi-fluid mixture model at the nominal composition
 * (critical-point tracing, `all_critical_points`), fixtures/coolprop-8.0.0.json.
 */
export const BLEND_DEFS: Record<"R404A" | "R507A" | "R448A" | "R449A" | "R513A", BlendDef> = {
  R404A: {
    id: "R404A",
    name: "R404A (R125/R143a/R134a 44/52/4)",
    massFractions: { R125: 0.44, R143a: 0.52, R134a: 0.04 },
    safetyGroup: "A1",
    zeotropic: true,
    criticalTempK: 345.27,
    criticalPressurePa: 3.7349e6,
    criticalDensityKgM3: 486.7,
    pMaxPa: 28e5,
  },
  R507A: {
    id: "R507A",
    name: "R507A (R125/R143a 50/50, azeotropic)",
    massFractions: { R125: 0.5, R143a: 0.5 },
    safetyGroup: "A1",
    zeotropic: false,
    criticalTempK: 343.77,
    criticalPressurePa: 3.7049e6,
    criticalDensityKgM3: 490.8,
    pMaxPa: 29e5,
  },
  R448A: {
    id: "R448A",
    name: "R448A (R32/R125/R1234yf/R134a/R1234ze(E) 26/26/20/21/7)",
    massFractions: { R32: 0.26, R125: 0.26, R1234yf: 0.2, R134a: 0.21, R1234zeE: 0.07 },
    safetyGroup: "A1",
    zeotropic: true,
    criticalTempK: 355.94,
    criticalPressurePa: 4.6052e6,
    criticalDensityKgM3: 483.3,
    pMaxPa: 28e5,
    kijOverride: { "R32/R1234yf": 0.04917 },
  },
  R449A: {
    id: "R449A",
    name: "R449A (R32/R125/R1234yf/R134a 24.3/24.7/25.3/25.7)",
    massFractions: { R32: 0.243, R125: 0.247, R1234yf: 0.253, R134a: 0.257 },
    safetyGroup: "A1",
    zeotropic: true,
    criticalTempK: 355.64,
    criticalPressurePa: 4.5165e6,
    criticalDensityKgM3: 468.3,
    pMaxPa: 28e5,
    kijOverride: { "R32/R1234yf": 0.04638 },
  },
  R513A: {
    id: "R513A",
    name: "R513A (R1234yf/R134a 56/44, azeotropic)",
    massFractions: { R1234yf: 0.56, R134a: 0.44 },
    safetyGroup: "A1",
    zeotropic: false,
    criticalTempK: 368.56,
    criticalPressurePa: 3.6551e6,
    criticalDensityKgM3: 483.6,
    pMaxPa: 25e5,
  },
};

export type BlendId = keyof typeof BLEND_DEFS;
export type { FluidMeta };
