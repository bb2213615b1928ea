import type { FluidId, FluidMeta, SafetyGroup } from "../types";
import type { ComponentId } from "./component";

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
  R744: 1,
};

export interface BlendDef {
  id: FluidId;
  name: string;
  /** Nominal mass fractions (ASHRAE 34 / ISO 817). */
  massFractions: Partial<Record<ComponentId, number>>;
  safetyGroup: SafetyGroup;
  zeotropic: boolean;
  /**
   * Critical point of the real blend at nominal composition, from the manufacturers' data
   * sheets and the ASHRAE Handbook—Fundamentals refrigerant tables (from memory; the density
   * is approximate). The model's tables stop well below it (`pMaxPa`).
   */
  criticalTempK: number;
  criticalPressurePa: number;
  criticalDensityKgM3: number;
  /** Highest saturation pressure the model serves (below the blend's critical region). */
  pMaxPa: number;
}

/**
 * Blends at their ASHRAE 34 / ISO 817 nominal compositions. Safety groups: ASHRAE 34 /
 * ISO 817 (R454C and R455A are A2L, the rest A1).
 */
export const BLEND_DEFS: Record<"R404A" | "R507A" | "R448A" | "R449A" | "R513A" | "R454C" | "R455A", BlendDef> = {
  R404A: {
    id: "R404A",
    name: "R404A (R125/R143a/R134a 44/52/4)",
    massFractions: { R125: 0.44, R143a: 0.52, R134a: 0.04 },
    safetyGroup: "A1",
    zeotropic: true,
    criticalTempK: 345.25,
    criticalPressurePa: 3.73e6,
    criticalDensityKgM3: 485,
    pMaxPa: 28e5,
  },
  R507A: {
    id: "R507A",
    name: "R507A (R125/R143a 50/50, azeotropic)",
    massFractions: { R125: 0.5, R143a: 0.5 },
    safetyGroup: "A1",
    zeotropic: false,
    criticalTempK: 343.75,
    criticalPressurePa: 3.7e6,
    criticalDensityKgM3: 490,
    pMaxPa: 29e5,
  },
  R448A: {
    id: "R448A",
    name: "R448A (R32/R125/R1234yf/R134a/R1234ze(E) 26/26/20/21/7)",
    massFractions: { R32: 0.26, R125: 0.26, R1234yf: 0.2, R134a: 0.21, R1234zeE: 0.07 },
    safetyGroup: "A1",
    zeotropic: true,
    criticalTempK: 356.85,
    criticalPressurePa: 4.66e6,
    criticalDensityKgM3: 480,
    pMaxPa: 28e5,
  },
  R449A: {
    id: "R449A",
    name: "R449A (R32/R125/R1234yf/R134a 24.3/24.7/25.3/25.7)",
    massFractions: { R32: 0.243, R125: 0.247, R1234yf: 0.253, R134a: 0.257 },
    safetyGroup: "A1",
    zeotropic: true,
    criticalTempK: 355.05,
    criticalPressurePa: 4.47e6,
    criticalDensityKgM3: 470,
    pMaxPa: 28e5,
  },
  R513A: {
    id: "R513A",
    name: "R513A (R1234yf/R134a 56/44, azeotropic)",
    massFractions: { R1234yf: 0.56, R134a: 0.44 },
    safetyGroup: "A1",
    zeotropic: false,
    criticalTempK: 368.05,
    criticalPressurePa: 3.77e6,
    criticalDensityKgM3: 485,
    pMaxPa: 25e5,
  },
  R454C: {
    id: "R454C",
    name: "R454C (R32/R1234yf 21.5/78.5)",
    massFractions: { R32: 0.215, R1234yf: 0.785 },
    safetyGroup: "A2L",
    zeotropic: true,
    criticalTempK: 358.85,
    criticalPressurePa: 4.32e6,
    criticalDensityKgM3: 470,
    pMaxPa: 28e5,
  },
  R455A: {
    id: "R455A",
    name: "R455A (R744/R32/R1234yf 3/21.5/75.5)",
    massFractions: { R744: 0.03, R32: 0.215, R1234yf: 0.755 },
    safetyGroup: "A2L",
    zeotropic: true,
    criticalTempK: 358.75,
    criticalPressurePa: 4.66e6,
    criticalDensityKgM3: 470,
    pMaxPa: 28e5,
  },
};

export type BlendId = keyof typeof BLEND_DEFS;
export type { FluidMeta };
