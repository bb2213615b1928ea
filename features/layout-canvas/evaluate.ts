/**
 * One evaluation of the canvas document, as the browser worker runs it: leave out what is
 * not connected yet, validate with the engine's own schema, load the refrigerants the model
 * uses, compute ledger and plant. Every problem comes back tied to its node and field.
 */
import { facilityFluidsNeeded, facilityModelSchema, type FacilityEngine, type FacilityResult } from "@/lib/engine/model";
import type { Fluid, FluidId } from "@/lib/engine/thermo";
import { toEngineInput, type ModelDoc } from "@/features/facilities/engine-model";
import type { SiteConditions } from "@/features/facilities/schema";
import { nodeForPath, pruneIncomplete, type Skipped } from "./graph";
import type { CanvasDoc } from "./schema";

export interface Problem {
  /** The node it belongs to, or null for site conditions. */
  nid: string | null;
  /** Field inside the node's entity (dotted), or the full path for the site. */
  field: string;
  message: string;
}

export interface Evaluation {
  result: FacilityResult | null;
  /** Validation problems and calculation errors. */
  problems: Problem[];
  /** Items left out because they are not connected yet. */
  skipped: Skipped[];
  /** True when the whole document (nothing left out) is valid: only then is it saved. */
  saveable: boolean;
  ms: number;
}

/** `plant.circuits[2].heatRejection` / `rooms.0.setPointC` → path segments. */
export function splitField(field: string): string[] {
  return field.split(/[.[\]]+/).filter((s) => s.length > 0);
}

export async function evaluate(
  doc: CanvasDoc,
  site: SiteConditions,
  engine: FacilityEngine,
  loadFluid: (id: FluidId) => Promise<Fluid>,
): Promise<Evaluation> {
  const t0 = performance.now();
  const { doc: pruned, skipped } = pruneIncomplete(doc);
  const parsed = facilityModelSchema.safeParse(toEngineInput(pruned as unknown as ModelDoc, site));
  if (!parsed.success) {
    const problems = parsed.error.issues.map((i) => ({ ...nodeForPath(pruned, i.path), message: i.message }));
    return { result: null, problems, skipped, saveable: false, ms: performance.now() - t0 };
  }
  await Promise.all(facilityFluidsNeeded(parsed.data).map((id) => loadFluid(id)));
  try {
    const result = engine.compute(parsed.data);
    return { result, problems: [], skipped, saveable: skipped.length === 0, ms: performance.now() - t0 };
  } catch (e) {
    const err = e as Error & { field?: string };
    const at = err.field ? nodeForPath(pruned, splitField(err.field)) : { nid: null, field: "" };
    return { result: null, problems: [{ ...at, message: err.message }], skipped, saveable: false, ms: performance.now() - t0 };
  }
}
