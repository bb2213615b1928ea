/** The stocking check: a scenario's changes, its verdict against the installed plant, and the solvers. */
export { roomChangeSchema, scenarioChangesSchema, STOCK_FIELDS } from "./schema";
export type { RoomChange, ScenarioChanges, ScenarioChangesInput } from "./schema";
export { applyStockingChanges, StockingError } from "./apply";
export {
  prepareStocking,
  evaluateChanged,
  compareWithInstalled,
  limitingCheck,
  verdictOf,
  worstVerdict,
  TIGHT_HEADROOM_FRACTION,
} from "./check";
export type { CapacityCheck, StockingCheckResult, Verdict, LoadBasis, SafetyFactorPlacement, RoomLoadSummary, StockingOptions } from "./check";
export { runStockingCheck } from "./run";
export { solveRoom, TONNES_TOLERANCE, PULLDOWN_TOLERANCE_H, MAX_TONNES_PER_DAY, MIN_PULLDOWN_H, MAX_PULLDOWN_H } from "./solve";
export type { SolvedValue, RoomSolve } from "./solve";
