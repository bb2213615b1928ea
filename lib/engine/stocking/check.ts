/**
 * The stocking check: a scenario's new design load against the installed plant re-rated at
 * the scenario's conditions (`rerateInstalled`: standby units excluded), item by item —
 * each room's evaporators, each circuit's compressors, each condenser — for the daily load
 * (24-h energy over the run time) and the peak hour, as the heat ledger states them
 * (DOMAIN.md §1 "Design load", §5 "Duty vs. design").
 *
 * Verdict per item: shortfall when the required capacity exceeds what is available; tight when
 * the headroom is under 10 % of the required capacity; fits otherwise. The facility's verdict
 * is its worst item, and the limiting item is the one with the smallest relative headroom.
 */
import {
  computeFacility,
  createFacilityEngine,
  rerateInstalled,
  type FacilityModel,
  type FacilityResult,
  type FacilityEngine,
} from "../model";
import type { RerateResult } from "../plant/rerate";
import type { Fluid, FluidId } from "../thermo/types";
import { applyStockingChanges, StockingError } from "./apply";
import type { ScenarioChanges } from "./schema";
import type { RoomSolve } from "./solve";

export type Verdict = "fits" | "tight" | "shortfall";
export type LoadBasis = "daily" | "peak";
export type SafetyFactorPlacement = "load" | "headroom";

/** Headroom below this fraction of the required capacity makes an item "tight". */
export const TIGHT_HEADROOM_FRACTION = 0.1;

export interface CapacityCheck {
  item: { kind: "room-evaporators" | "compressors" | "condenser"; id: string; label: string; tags: string[] };
  basis: LoadBasis;
  /** "refrigeration" (rooms, compressors) or "heat" (condenser heat rejection). */
  quantity: "refrigeration" | "heat";
  requiredW: number;
  availableW: number;
  /** available − required, W (negative: a shortfall). */
  headroomW: number;
  /** headroomW / requiredW (Infinity when nothing is required). */
  headroomFraction: number;
  verdict: Verdict;
}

export interface RoomLoadSummary {
  roomId: string;
  roomName: string;
  setPointC: number;
  dailyW: number;
  peakW: number;
  energyKWhPerDay: number;
}

export interface StockingCheckResult {
  verdict: Verdict;
  /** The item with the smallest relative headroom (null only when nothing was checked). */
  limiting: CapacityCheck | null;
  checks: CapacityCheck[];
  safetyFactor: { placement: SafetyFactorPlacement; statement: string };
  tightHeadroomFraction: number;
  /** Loads of the changed rooms before and after. */
  rooms: { roomId: string; before: RoomLoadSummary; after: RoomLoadSummary }[];
  notes: string[];
  /** Per changed room with a product intake: the largest t/day and shortest pull-down that fit. */
  solves: RoomSolve[];
}

export interface StockingOptions {
  getFluid?: (id: FluidId) => Fluid;
  /** Also solve for the largest t/day and shortest pull-down per changed room (default true). */
  solve?: boolean;
}

export function verdictOf(requiredW: number, availableW: number): Verdict {
  if (requiredW > availableW) return "shortfall";
  if (availableW - requiredW < TIGHT_HEADROOM_FRACTION * requiredW) return "tight";
  return "fits";
}

const RANK: Record<Verdict, number> = { fits: 0, tight: 1, shortfall: 2 };

export function worstVerdict(vs: Verdict[]): Verdict {
  return vs.reduce<Verdict>((w, v) => (RANK[v] > RANK[w] ? v : w), "fits");
}

function check(item: CapacityCheck["item"], basis: LoadBasis, quantity: CapacityCheck["quantity"], requiredW: number, availableW: number): CapacityCheck {
  const headroomW = availableW - requiredW;
  return {
    item,
    basis,
    quantity,
    requiredW,
    availableW,
    headroomW,
    headroomFraction: requiredW > 0 ? headroomW / requiredW : Number.POSITIVE_INFINITY,
    verdict: verdictOf(requiredW, availableW),
  };
}

function sfStatement(p: SafetyFactorPlacement): string {
  return p === "load"
    ? "The safety factor is inside the required load (24-h energy × (1 + safety factor) / run hours, and the peak hour × (1 + safety factor)); the headroom is on top of it."
    : "The safety factor is left out of the required load (24-h energy / run hours, and the bare peak hour); it is part of the headroom shown.";
}

/** Room loads on the chosen safety-factor basis, W. */
function roomBasis(r: FacilityResult["ledger"]["rooms"][number], p: SafetyFactorPlacement): { daily: number; peak: number; hourly: number[] } {
  const k = p === "load" ? 1 + r.safetyFactor : 1;
  return {
    daily: p === "load" ? r.requiredCapacityW : r.requiredCapacityW / (1 + r.safetyFactor),
    peak: p === "load" ? r.requiredPeakCapacityW : r.peakHourW,
    hourly: r.hourly.map((h) => h * k),
  };
}

function summary(model: FacilityModel, res: FacilityResult, roomId: string, p: SafetyFactorPlacement): RoomLoadSummary {
  const r = res.ledger.rooms.find((x) => x.roomId === roomId)!;
  const b = roomBasis(r, p);
  return {
    roomId,
    roomName: r.roomName,
    setPointC: model.rooms.find((x) => x.id === roomId)!.setPointC,
    dailyW: b.daily,
    peakW: b.peak,
    energyKWhPerDay: r.totalEnergyKWhPerDay,
  };
}

/**
 * Compares a computed facility with the re-rated installed plant, item by item.
 *
 * - Room evaporators: the room's daily and peak requirement against its installed
 *   evaporators at the new TD.
 * - Compressors: per circuit, Σ over its rooms (each room's share in proportion to the design
 *   duty of its evaporators on that circuit) of the daily requirement, and the coincident peak
 *   max_h Σ share · q_h, plus heat taken from cascade low stages at design; against the running
 *   compressors (standby excluded).
 * - Condenser: the heat the circuits on it reject at the daily / peak requirement (the
 *   circuit's design heat rejected scaled by requirement / design refrigeration) against its
 *   installed units at the new approach.
 */
export function compareWithInstalled(model: FacilityModel, res: FacilityResult, rr: RerateResult, placement: SafetyFactorPlacement): CapacityCheck[] {
  const out: CapacityCheck[] = [];
  const installed = model.plant.installed!;
  const rooms = new Map(res.ledger.rooms.map((r) => [r.roomId, roomBasis(r, placement)]));
  const rerRooms = new Map(rr.rooms.map((r) => [r.roomId, r]));
  const roomIdsChecked = new Set([...installed.evaporators.map((e) => e.roomId), ...model.plant.evaporators.map((e) => e.roomId)]);
  for (const room of model.rooms) {
    if (!roomIdsChecked.has(room.id)) continue;
    const b = rooms.get(room.id)!;
    const tags = installed.evaporators.filter((e) => e.roomId === room.id).map((e) => e.tag);
    const item = { kind: "room-evaporators" as const, id: room.id, label: `${room.name} evaporators`, tags };
    const avail = rerRooms.get(room.id)?.evaporatorCapacityW ?? 0;
    out.push(check(item, "daily", "refrigeration", b.daily, avail), check(item, "peak", "refrigeration", b.peak, avail));
  }

  // Each room's share on each circuit, by the design duty of its evaporators there.
  const roomDuty = new Map<string, number>();
  for (const e of res.plant.evaporators) roomDuty.set(e.roomId, (roomDuty.get(e.roomId) ?? 0) + e.dutyW);
  const circuitReq = new Map<string, { daily: number; peak: number; design: number }>();
  for (const c of res.plant.circuits) {
    const hourly = new Array<number>(24).fill(0);
    let daily = 0;
    const shares = new Map<string, number>();
    for (const e of res.plant.evaporators.filter((x) => x.circuitId === c.id)) {
      const total = roomDuty.get(e.roomId) ?? 0;
      shares.set(e.roomId, (shares.get(e.roomId) ?? 0) + (total > 0 ? e.dutyW / total : 0));
    }
    for (const [roomId, share] of shares) {
      const b = rooms.get(roomId);
      if (!b) continue;
      daily += share * b.daily;
      for (let h = 0; h < 24; h++) hourly[h] += share * b.hourly[h];
    }
    // Cascade heat from low stages and the hot gas the compressors supply for defrosts.
    const cascadeW = c.refrigerationW - c.evaporatorRoomDutyW + (c.hotGasDefrost?.heatW ?? 0);
    circuitReq.set(c.id, { daily: daily + cascadeW, peak: Math.max(...hourly) + cascadeW, design: c.refrigerationW + (c.hotGasDefrost?.heatW ?? 0) });
  }
  const compsByCircuit = new Map<string, string[]>();
  for (const x of installed.compressors) compsByCircuit.set(x.circuitId, [...(compsByCircuit.get(x.circuitId) ?? []), x.tag]);
  for (const cr of rr.circuits) {
    const req = circuitReq.get(cr.circuitId);
    if (!req) continue;
    const item = { kind: "compressors" as const, id: cr.circuitId, label: `${cr.tag} compressors`, tags: compsByCircuit.get(cr.circuitId) ?? [] };
    out.push(
      check(item, "daily", "refrigeration", req.daily, cr.compressorCapacityW),
      check(item, "peak", "refrigeration", req.peak, cr.compressorCapacityW),
    );
  }

  for (const cd of model.plant.condensers) {
    const units = installed.condensers.filter((x) => x.condenserId === cd.id);
    if (units.length === 0) continue;
    const onIds = new Set(model.plant.circuits.filter((m) => m.heatRejection.to === "condenser" && m.heatRejection.condenserId === cd.id).map((m) => m.id));
    const on = rr.circuits.filter((c) => c.condenserLimitW !== null && onIds.has(c.circuitId));
    if (on.length === 0) continue;
    // Heat-rejection capacity: Σ (refrigeration limit × heat rejected per W refrigerated) —
    // rerateInstalled's split of the condenser between its circuits, added back up.
    const capacityHeatW = on.reduce((a, c) => a + c.condenserLimitW! * (1 + (c.compressorCapacityW > 0 ? c.compressorShaftPowerW / c.compressorCapacityW : 0)), 0);
    let daily = 0;
    let peak = 0;
    for (const c of on) {
      const design = res.plant.circuits.find((x) => x.id === c.circuitId);
      const req = circuitReq.get(c.circuitId);
      if (!design || !req || design.refrigerationW <= 0) continue;
      const heatPerW = design.heatRejectedW / design.refrigerationW;
      daily += req.daily * heatPerW;
      peak += req.peak * heatPerW;
    }
    const item = { kind: "condenser" as const, id: cd.id, label: `${cd.tag} condenser`, tags: units.map((u) => u.tag) };
    out.push(check(item, "daily", "heat", daily, capacityHeatW), check(item, "peak", "heat", peak, capacityHeatW));
  }
  return out;
}

/** The limiting check: smallest relative headroom (ties: the larger shortfall in W). */
export function limitingCheck(checks: CapacityCheck[]): CapacityCheck | null {
  let best: CapacityCheck | null = null;
  for (const c of checks) {
    if (!best || c.headroomFraction < best.headroomFraction || (c.headroomFraction === best.headroomFraction && c.headroomW < best.headroomW)) best = c;
  }
  return best;
}

/** A prepared scenario: the re-rated plant (it does not depend on the load) and an engine. */
export interface StockingContext {
  base: FacilityModel;
  baseResult: FacilityResult;
  rerate: RerateResult;
  engine: FacilityEngine;
  placement: SafetyFactorPlacement;
}

export function prepareStocking(base: FacilityModel, changes: ScenarioChanges, opts: StockingOptions = {}): { ctx: StockingContext; changed: FacilityModel } {
  const inst = base.plant.installed;
  if (!inst || (inst.evaporators.length === 0 && inst.compressors.length === 0 && inst.condensers.length === 0))
    throw new StockingError("NO_INSTALLED_PLANT", "This facility has no installed plant recorded, so there is nothing to check against. A designer records it under the plant's installed items.", "plant.installed");
  const changed = applyStockingChanges(base, changes);
  const rerate = rerateInstalled(changed, {}, opts.getFluid);
  const engine = createFacilityEngine({ getFluid: opts.getFluid });
  const baseResult = computeFacility(base, { getFluid: opts.getFluid });
  return { ctx: { base, baseResult, rerate, engine, placement: changes.safetyFactorPlacement }, changed };
}

/** Checks an already changed model in a prepared context. */
export function evaluateChanged(ctx: StockingContext, changed: FacilityModel, roomIds: string[]): Omit<StockingCheckResult, "solves"> & { result: FacilityResult } {
  const res = ctx.engine.compute(changed);
  const checks = compareWithInstalled(changed, res, ctx.rerate, ctx.placement);
  const limiting = limitingCheck(checks);
  const notes = ctx.rerate.warnings.map((w) => w.message);
  if (checks.length === 0) notes.push("No installed item could be compared: record installed evaporators, compressors and condensers.");
  return {
    verdict: worstVerdict(checks.map((c) => c.verdict)),
    limiting,
    checks,
    safetyFactor: { placement: ctx.placement, statement: sfStatement(ctx.placement) },
    tightHeadroomFraction: TIGHT_HEADROOM_FRACTION,
    rooms: roomIds.map((id) => ({ roomId: id, before: summary(ctx.base, ctx.baseResult, id, ctx.placement), after: summary(changed, res, id, ctx.placement) })),
    notes,
    result: res,
  };
}
