import type { FacilityModel } from "../model";
import { evaluateChanged, prepareStocking, type StockingCheckResult, type StockingOptions } from "./check";
import type { ScenarioChanges } from "./schema";
import { solveRoom } from "./solve";

/**
 * Runs a stocking check: applies `changes` to `base` (a parsed facility model with its
 * installed plant), recomputes ledger and plant with `computeFacility`'s engine, re-rates the
 * installed plant at the new conditions and compares item by item. Fluids must be loaded first.
 */
export function runStockingCheck(base: FacilityModel, changes: ScenarioChanges, opts: StockingOptions = {}): StockingCheckResult {
  const { ctx, changed } = prepareStocking(base, changes, opts);
  const { result, ...rest } = evaluateChanged(ctx, changed, changes.rooms.map((r) => r.roomId));
  void result;
  const solves = opts.solve === false ? [] : changes.rooms.flatMap((r) => solveRoom(ctx, changes, changed, r.roomId) ?? []);
  return { ...rest, solves };
}
