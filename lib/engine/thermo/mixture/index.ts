/**
 * Refrigerant blends on the multi-fluid Helmholtz mixture model (Kunz–Wagner form): R404A,
 * R507A, R448A, R449A, R513A, R454C, R455A at their ASHRAE 34 / ISO 817 nominal mass fractions. The registry (../index.ts) imports this
 * module lazily; see README.md of the thermo module for the model and its measured accuracy.
 *
 * All states: SI units, IIR reference state (h = 200 kJ/kg, s = 1 kJ/(kg·K) for the saturated
 * liquid, i.e. the bubble point, at 0 °C). `saturationAtT` takes the dew temperature unless
 * told otherwise ("bubble" or "mean").
 */
import type { Fluid, FluidId, FluidMeta } from "../types";
import { blendMetaOf, getBlend } from "./blend";
import { BLEND_DEFS, type BlendId } from "./blend-defs";

export const BLEND_IDS = Object.keys(BLEND_DEFS) as BlendId[];

function isBlend(id: FluidId): id is BlendId {
  return (BLEND_IDS as FluidId[]).includes(id);
}

/**
 * The blend model for `id` (built on first call: its saturation and two-phase tables take a
 * few tens of milliseconds, then it is cached). Throws for an id that is not a blend.
 */
export function createBlend(id: FluidId): Fluid {
  if (!isBlend(id)) throw new Error(`"${id}" is not a blend; blends: ${BLEND_IDS.join(", ")}`);
  return getBlend(id);
}

/** Metadata of every blend (cheap: no tables are built for it). */
export const blendMeta: FluidMeta[] = BLEND_IDS.map((id) => blendMetaOf(BLEND_DEFS[id]));
