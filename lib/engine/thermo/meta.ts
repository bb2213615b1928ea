/**
 * Metadata of the pure fluids (no equation-of-state coefficients, so listing fluids costs
 * nothing in a browser bundle).
 *
 * GWP100: IPCC Fourth Assessment Report (AR4), the values adopted by Regulation (EU)
 * No 517/2014 (Annexes I and IV). ODP: Montreal Protocol (0 for all of these).
 * Safety groups: ISO 817 / ASHRAE 34. Critical constants: those of each fluid's reference
 * equation of state (papers cited in the fluid's data module).
 */
import type { FluidMeta } from "./types";

export const GWP_SOURCE = "IPCC AR4 (100-year), as adopted in Regulation (EU) No 517/2014";

export const pureFluidMeta = {
  R717: {
    id: "R717",
    name: "R717 (ammonia)",
    molarMassKgMol: 0.01703026,
    criticalTempK: 405.4,
    criticalPressurePa: 11.333e6,
    criticalDensityKgM3: 225,
    normalBoilingPointK: 239.823,
    safetyGroup: "B2L",
    gwp100: 0,
    gwpSource: GWP_SOURCE,
    odp: 0,
    zeotropic: false,
    model: "Helmholtz EOS, Tillner-Roth, Harms-Watzenberg & Baehr (1993)",
  },
  R744: {
    id: "R744",
    name: "R744 (carbon dioxide)",
    molarMassKgMol: 0.0440098,
    criticalTempK: 304.1282,
    criticalPressurePa: 7.3773e6,
    criticalDensityKgM3: 467.6,
    // CO2 has no liquid at 1 atm: this is the normal sublimation temperature (Span & Wagner 1996).
    normalBoilingPointK: 194.686,
    safetyGroup: "A1",
    gwp100: 1,
    gwpSource: GWP_SOURCE,
    odp: 0,
    zeotropic: false,
    model: "Helmholtz EOS, Span & Wagner (1996)",
  },
  R134a: {
    id: "R134a",
    name: "R134a (1,1,1,2-tetrafluoroethane)",
    molarMassKgMol: 0.102032,
    criticalTempK: 374.18,
    criticalPressurePa: 4.05629e6,
    criticalDensityKgM3: 508,
    normalBoilingPointK: 247.076,
    safetyGroup: "A1",
    gwp100: 1430,
    gwpSource: GWP_SOURCE,
    odp: 0,
    zeotropic: false,
    model: "Helmholtz EOS, Tillner-Roth & Baehr (1994)",
  },
  R290: {
    id: "R290",
    name: "R290 (propane)",
    molarMassKgMol: 0.04409562,
    criticalTempK: 369.89,
    criticalPressurePa: 4.2512e6,
    criticalDensityKgM3: 220.4781,
    normalBoilingPointK: 231.036,
    safetyGroup: "A3",
    gwp100: 3,
    gwpSource: GWP_SOURCE,
    odp: 0,
    zeotropic: false,
    model: "Helmholtz EOS, Lemmon, McLinden & Wagner (2009)",
  },
  R1234zeE: {
    id: "R1234zeE",
    name: "R1234ze(E) (trans-1,3,3,3-tetrafluoropropene)",
    molarMassKgMol: 0.1140415928,
    criticalTempK: 382.513,
    criticalPressurePa: 3.6349e6,
    criticalDensityKgM3: 489.2384,
    normalBoilingPointK: 254.177,
    safetyGroup: "A2L",
    gwp100: 7,
    gwpSource: GWP_SOURCE,
    odp: 0,
    zeotropic: false,
    model: "Helmholtz EOS, Thol & Lemmon (2016)",
  },
} as const satisfies Record<string, FluidMeta>;

export type PureFluidId = keyof typeof pureFluidMeta;
