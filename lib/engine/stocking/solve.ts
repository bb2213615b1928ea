/**
 * Solvers of the stocking check: the largest intake (t/day) and the shortest pull-down that
 * still fit the installed plant, by bisection. The load rises with the intake and falls as
 * the pull-down lengthens (the product heat m·Δh is spread over it), so "fits" (no item
 * short: required ≤ available everywhere) changes once along each axis and bisection finds
 * the boundary to the stated tolerance.
 */
import type { FacilityModel } from "../model";
import { applyStockingChanges } from "./apply";
import { evaluateChanged, type StockingContext } from "./check";
import type { RoomChange, ScenarioChanges } from "./schema";

/** Bisection stops when the bracket is this narrow: 0.01 t/day (10 kg/day). */
export const TONNES_TOLERANCE = 0.01;
/** Bisection stops when the bracket is this narrow: 0.05 h (3 minutes). */
export const PULLDOWN_TOLERANCE_H = 0.05;
/** Search bounds: the ledger's own limits (1e8 kg/day; pull-down ≤ 168 h). */
export const MAX_TONNES_PER_DAY = 100_000;
export const MIN_PULLDOWN_H = 0.5;
export const MAX_PULLDOWN_H = 168;

export interface SolvedValue {
  /** The solved value (fits), or null when no value in the search range fits. */
  value: number | null;
  /** "boundary": bisection bracketed the edge; "range-limit": the whole range fits, value is its end; "none": nothing fits. */
  status: "boundary" | "range-limit" | "none";
  tolerance: number;
  /** The searched range. */
  range: [number, number];
  iterations: number;
}

export interface RoomSolve {
  roomId: string;
  maxTonnesPerDay: SolvedValue;
  minPullDownHours: SolvedValue;
}

function fitsWith(ctx: StockingContext, changes: ScenarioChanges, roomId: string, patch: Partial<RoomChange>): boolean {
  const rooms = changes.rooms.map((r) => (r.roomId === roomId ? { ...r, ...patch } : r));
  const model: FacilityModel = applyStockingChanges(ctx.base, { rooms });
  const r = evaluateChanged(ctx, model, []);
  return r.checks.every((c) => c.headroomW >= 0);
}

/** Largest x in [lo, hi] with fits(x), for fits true below the edge and false above it. */
function bisectUp(fits: (x: number) => boolean, lo: number, hiLimit: number, start: number, tol: number): SolvedValue {
  let iterations = 1;
  if (!fits(lo)) return { value: null, status: "none", tolerance: tol, range: [lo, hiLimit], iterations };
  // Bracket by doubling from the current value (cheaper than starting at the range end).
  let good = lo;
  let bad = Math.min(hiLimit, Math.max(start * 2, 1));
  while (fits(bad)) {
    iterations++;
    good = bad;
    if (bad >= hiLimit) return { value: hiLimit, status: "range-limit", tolerance: tol, range: [lo, hiLimit], iterations };
    bad = Math.min(hiLimit, bad * 2);
  }
  iterations++;
  while (bad - good > tol) {
    const mid = (good + bad) / 2;
    iterations++;
    if (fits(mid)) good = mid;
    else bad = mid;
  }
  return { value: good, status: "boundary", tolerance: tol, range: [lo, hiLimit], iterations };
}

/** Smallest x in [lo, hi] with fits(x), for fits false below the edge and true above it. */
function bisectDown(fits: (x: number) => boolean, lo: number, hi: number, tol: number): SolvedValue {
  let iterations = 1;
  if (!fits(hi)) return { value: null, status: "none", tolerance: tol, range: [lo, hi], iterations };
  iterations++;
  if (fits(lo)) return { value: lo, status: "range-limit", tolerance: tol, range: [lo, hi], iterations };
  let bad = lo;
  let good = hi;
  while (good - bad > tol) {
    const mid = (good + bad) / 2;
    iterations++;
    if (fits(mid)) good = mid;
    else bad = mid;
  }
  return { value: good, status: "boundary", tolerance: tol, range: [lo, hi], iterations };
}

/**
 * For one changed room with a product intake: the largest t/day that fits (other inputs as in
 * the scenario) and the shortest pull-down that fits (at the scenario's t/day). Returns null
 * when the room has no product stream after the changes.
 */
export function solveRoom(ctx: StockingContext, changes: ScenarioChanges, changed: FacilityModel, roomId: string): RoomSolve | null {
  const room = changed.rooms.find((r) => r.id === roomId);
  const stream = room?.products[0];
  if (!room || !stream) return null;
  const tonnes = stream.massKgPerDay / 1000;
  const maxTonnesPerDay = bisectUp((t) => fitsWith(ctx, changes, roomId, { tonnesPerDay: t }), 0, MAX_TONNES_PER_DAY, tonnes, TONNES_TOLERANCE);
  const minPullDownHours = bisectDown((h) => fitsWith(ctx, changes, roomId, { pullDownHours: h }), MIN_PULLDOWN_H, MAX_PULLDOWN_H, PULLDOWN_TOLERANCE_H);
  return { roomId, maxTonnesPerDay, minPullDownHours };
}
