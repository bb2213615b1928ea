/**
 * Public surface of the refrigerant property engine.
 *
 * All states use SI units and the IIR reference state (h = 200 kJ/kg and s = 1 kJ/(kg·K)
 * for saturated liquid at 0 °C). Pure fluids run on their reference multiparameter
 * Helmholtz equations of state (see README.md); each fluid's coefficients live in its own
 * module and are imported only by `loadFluid`, so a browser bundle carries one fluid at a time.
 *
 * ```ts
 * const nh3 = await loadFluid("R717");
 * nh3.saturationAtT(243.15).pDewPa;
 * getFluid("R717").statePH(1.35e6, 1.6e6);
 * ```
 */
import { pureFluidMeta, type PureFluidId } from "./meta";
import type { Fluid, FluidId, FluidMeta } from "./types";

export * from "./types";
export { GWP_SOURCE } from "./meta";

const PURE_IDS = Object.keys(pureFluidMeta) as PureFluidId[];

/** Every fluid id the engine knows, pure fluids first. */
export const FLUID_IDS: readonly FluidId[] = [
  "R717",
  "R744",
  "R134a",
  "R290",
  "R1234zeE",
  "R404A",
  "R507A",
  "R448A",
  "R449A",
  "R513A",
];

const BLEND_IDS: readonly FluidId[] = ["R404A", "R507A", "R448A", "R449A", "R513A"];

function isPure(id: FluidId): id is PureFluidId {
  return (PURE_IDS as FluidId[]).includes(id);
}

const loaders: Record<PureFluidId, () => Promise<{ data: import("./helmholtz/pure-fluid").PureFluidData }>> = {
  R717: () => import("./fluids/r717"),
  R744: () => import("./fluids/r744"),
  R134a: () => import("./fluids/r134a"),
  R290: () => import("./fluids/r290"),
  R1234zeE: () => import("./fluids/r1234zeE"),
};

const loaded = new Map<FluidId, Fluid>();
const pending = new Map<FluidId, Promise<Fluid>>();

/** Metadata of the fluids (no coefficient data is loaded). */
export function listFluids(): FluidMeta[] {
  return PURE_IDS.map((id) => ({ ...pureFluidMeta[id] }));
}

function unknownId(id: string): Error {
  return new Error(`Unknown fluid id "${id}"; known: ${FLUID_IDS.join(", ")}`);
}

/**
 * Loads one fluid: imports its data module, builds the model (for a Helmholtz fluid this
 * tabulates its saturation curve, a few milliseconds) and caches it for `getFluid`.
 */
export function loadFluid(id: FluidId): Promise<Fluid> {
  const done = loaded.get(id);
  if (done) return Promise.resolve(done);
  const inFlight = pending.get(id);
  if (inFlight) return inFlight;
  let p: Promise<Fluid>;
  if (isPure(id)) {
    p = Promise.all([loaders[id](), import("./helmholtz/pure-fluid")]).then(([mod, pf]) => pf.createHelmholtzFluid(mod.data));
  } else if (BLEND_IDS.includes(id)) {
    p = Promise.reject(new Error(`Fluid ${id} is not available: the blend models are not part of this build`));
  } else {
    p = Promise.reject(unknownId(id));
  }
  const tracked = p.then(
    (f) => {
      loaded.set(id, f);
      pending.delete(id);
      return f;
    },
    (e: unknown) => {
      pending.delete(id);
      throw e;
    },
  );
  pending.set(id, tracked);
  return tracked;
}

/** The fluid, if `loadFluid(id)` has completed; throws a clear error otherwise. */
export function getFluid(id: FluidId): Fluid {
  const f = loaded.get(id);
  if (f) return f;
  if (!FLUID_IDS.includes(id)) throw unknownId(id);
  throw new Error(`Fluid ${id} is not loaded yet: await loadFluid("${id}") first`);
}

/** Loads every available fluid (those whose model is part of this build). */
export async function loadAllFluids(): Promise<Fluid[]> {
  return Promise.all(listFluids().map((m) => loadFluid(m.id)));
}
