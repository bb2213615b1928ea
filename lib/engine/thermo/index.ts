/**
 * Public surface of the refrigerant property engine.
 *
 * All states use SI units and the IIR reference state (h = 200 kJ/kg and s = 1 kJ/(kg·K)
 * for saturated liquid at 0 °C; for blends, the bubble-point liquid). Pure fluids run on their
 * reference multiparameter Helmholtz equations of state; the blends (R404A, R507A, R448A,
 * R449A, R513A, R454C, R455A) on the multi-fluid Helmholtz mixture model in ./mixture, where
 * `saturationAtT` takes the dew-point temperature unless told otherwise (see README.md). Each pure fluid's
 * coefficients live in its own module and are imported only by `loadFluid`, so a browser
 * bundle carries one fluid at a time; the blends share one module.
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
export { phChart, type PhChart, type PhChartOptions, type PhPoint } from "./chart";
export { evaluateQuery, FLUID_IDS, fluidIdSchema, stateQuerySchema, type StateAnswer, type StateQuery } from "./schema";
import { FLUID_IDS } from "./schema";

const PURE_IDS = Object.keys(pureFluidMeta) as PureFluidId[];


const BLEND_IDS: readonly FluidId[] = ["R404A", "R507A", "R448A", "R449A", "R513A", "R454C", "R455A"];

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

type BlendModule = typeof import("./mixture/index");
let blendModule: BlendModule | undefined;

/** The blends' mixture-model module (./mixture), imported on first need. */
async function blends(): Promise<BlendModule> {
  blendModule ??= await import("./mixture/index");
  return blendModule;
}

/**
 * Metadata of the fluids, without loading any equation-of-state data: the pure fluids
 * always; the blends once their module has been imported (by `loadFluid` of a blend,
 * `loadAllFluids` or `listAllFluids`), because a blend's molar mass, boiling point and GWP
 * are computed by its model.
 */
export function listFluids(): FluidMeta[] {
  const pure = PURE_IDS.map((id): FluidMeta => ({ ...pureFluidMeta[id] }));
  return blendModule ? [...pure, ...blendModule.blendMeta.map((m) => ({ ...m }))] : pure;
}

/** Metadata of every fluid, pure and blends (imports the blend module if needed). */
export async function listAllFluids(): Promise<FluidMeta[]> {
  await blends();
  return listFluids();
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
    p = blends().then((m) => m.createBlend(id));
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

/** Loads every fluid, pure and blends. */
export async function loadAllFluids(): Promise<Fluid[]> {
  return Promise.all(FLUID_IDS.map((id) => loadFluid(id)));
}
