/**
 * A component of the multi-fluid mixture model: a pure fluid on its own reference Helmholtz
 * equation (the same evaluator and data layout as the pure refrigerants), plus the constants
 * the phase-equilibrium starting guesses need (critical pressure, acentric factor).
 */
import type { Ancillary } from "../helmholtz/ancillary";
import type { HelmholtzEosData } from "../helmholtz/eos";
import { createHelmholtzFluid, type HelmholtzFluid } from "../helmholtz/pure-fluid";
import type { FluidId, FluidMeta } from "../types";
import { pureFluidMeta } from "../meta";

export type ComponentId = "R32" | "R125" | "R134a" | "R143a" | "R1234yf" | "R1234zeE" | "R744";

export interface ComponentData {
  id: ComponentId;
  name: string;
  /** The reference equation, author(s) and year. */
  paper: string;
  /** Acentric factor (for Wilson K-value starting guesses only). */
  omega: number;
  criticalPressurePa: number;
  tTripleK: number;
  eos: HelmholtzEosData;
  ancillaries: { rhoL: Ancillary; rhoV: Ancillary };
}

/** The data of a component (imports the blend components' registry on first use). */
export async function loadComponent(id: ComponentId): Promise<ComponentData> {
  return (await import("./components")).COMPONENTS[id];
}

/**
 * The component as a pure fluid behind the `Fluid` contract (Maxwell saturation table, flashes,
 * IIR reference), for checks of the pure equation against its paper. Not in the fluid registry.
 */
export function componentAsPureFluid(c: ComponentData, tMaxK = 420, pMaxPa = 20e6): HelmholtzFluid {
  const e = c.eos;
  const meta: FluidMeta = {
    ...pureFluidMeta.R134a,
    id: c.id as FluidId,
    name: c.name,
    molarMassKgMol: e.molarMassKgMol,
    criticalTempK: e.tReducingK,
    criticalPressurePa: c.criticalPressurePa,
    criticalDensityKgM3: e.rhoReducingKgM3,
    model: `Helmholtz EOS, ${c.paper}`,
  };
  return createHelmholtzFluid({ meta, eos: e, range: { tMinK: c.tTripleK, tMaxK, pMaxPa }, ancillaries: c.ancillaries });
}
