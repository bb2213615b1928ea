/**
 * The facility model: the one document the app stores and the canvas edits — the heat
 * ledger's input (site, rooms, doors, options) plus the plant — and `computeFacility`, which
 * computes the ledger and the plant together. Fan and defrost heat depend on the
 * evaporators, which depend on the load, so each room is solved as a fixed point
 * (see `solveDutyFixedPoint`) before the circuits are computed.
 */
import { z } from "zod";
import {
  LoadInputError,
  computeRoomLoad,
  contextFromParsed,
  ledgerFromResults,
  ledgerInputSchema,
  type LedgerContext,
  type LedgerInput,
  type LedgerResult,
  type RoomInput,
  type RoomLoadResult,
} from "./loads";
import { getFluid as thermoGetFluid } from "./thermo";
import type { Fluid, FluidId } from "./thermo/types";
import {
  cascadeOrder,
  computeCircuit,
  evaporatorWarnings,
  preparePlant,
  type CircuitResult,
  type PlantWarning,
} from "./plant/circuit";
import { ambientOf } from "./plant/ambient";
import { PlantError } from "./plant/errors";
import {
  feedbackWhPerDayPerW,
  roomFeedback,
  sizeRoomEvaporators,
  solveDutyFixedPoint,
  type EvaporatorSizing,
  type FixedPointResult,
} from "./plant/evaporator";
import { assemblePlant, computePlant, fluidsNeeded, type PlantResult } from "./plant/plant";
import { designCapacityWithFeedback, NO_FEEDBACK, withFeedback } from "./plant/ledger-feedback";
import { plantInputSchema, type EvaporatorInput, type PlantInput } from "./plant/schema";
import { MAX_PLANT_OPTIONS, plantOptionSchema, plantStudySchema, DESIGN_ID } from "./options";
import { operationSchema } from "./annual/schema";

export { buildSchedule } from "./plant/schedule";
export { rerateInstalled } from "./plant/rerate";

export { stullWetBulbC, ambientOf } from "./plant/ambient";

export const FACILITY_SCHEMA_VERSION = 1 as const;
export const PLANT_ENGINE_VERSION = "plant-1.1.0";

const plantPart = z.object({
  schemaVersion: z.literal(FACILITY_SCHEMA_VERSION),
  plant: plantInputSchema.prefault({}),
  /** Alternative plants for the same rooms (see ./options.ts); old documents have none. */
  plantOptions: z.array(plantOptionSchema).max(MAX_PLANT_OPTIONS, `at most ${MAX_PLANT_OPTIONS} options`).default([]),
  /** What the options share (years, grid factor) and the design's own name and assessment. */
  plantStudy: plantStudySchema.prefault({}),
  /**
   * How the facility runs through the year (schedules, part load, tariff) for the annual
   * engine (`lib/engine/annual`); optional, and every default is the design day.
   */
  operation: operationSchema.optional(),
});

function checkRoomRefs(plant: PlantInput | undefined, rooms: Set<string>, at: (string | number)[], ctx: z.RefinementCtx): void {
  (plant?.evaporators ?? []).forEach((e, i) => {
    if (!rooms.has(e.roomId)) ctx.addIssue({ code: "custom", path: [...at, "evaporators", i, "roomId"], message: `no room with id "${e.roomId}"` });
  });
  (plant?.installed?.evaporators ?? []).forEach((e, i) => {
    if (!rooms.has(e.roomId))
      ctx.addIssue({ code: "custom", path: [...at, "installed", "evaporators", i, "roomId"], message: `no room with id "${e.roomId}"` });
  });
}

/**
 * `{ schemaVersion: 1, site, rooms, doors, plant, plantOptions?, plantStudy?, options? }` —
 * the ledger input and the plant in one document, with the cross-references between them
 * checked (every evaporator of the design and of every option in an existing room; option
 * ids and names unique).
 */
export const facilityModelSchema = z.intersection(ledgerInputSchema, plantPart).superRefine((m, ctx) => {
  const rooms = new Set((m.rooms ?? []).map((r) => r.id));
  checkRoomRefs(m.plant, rooms, ["plant"], ctx);
  const ids = new Set<string>([DESIGN_ID]);
  const names = new Set<string>([(m.plantStudy?.designName ?? "Design").toLowerCase()]);
  (m.plantOptions ?? []).forEach((o, i) => {
    if (ids.has(o.id)) ctx.addIssue({ code: "custom", path: ["plantOptions", i, "id"], message: `duplicate option id "${o.id}"` });
    ids.add(o.id);
    if (names.has(o.name.toLowerCase()))
      ctx.addIssue({ code: "custom", path: ["plantOptions", i, "name"], message: `"${o.name}" is already the name of a plant of this facility` });
    names.add(o.name.toLowerCase());
    checkRoomRefs(o.plant, rooms, ["plantOptions", i, "plant"], ctx);
  });
});

export type FacilityModel = z.output<typeof facilityModelSchema>;
export type FacilityModelRaw = z.input<typeof facilityModelSchema>;

/**
 * Validates a facility document; throws the ledger's `LoadInputError` (code
 * LOAD_INPUT_INVALID) listing every issue as `{ field: "plant.circuits.0.subcoolingK", message }`,
 * so the API maps ledger and plant input errors the same way.
 */
export function parseFacilityModel(raw: unknown): FacilityModel {
  const r = facilityModelSchema.safeParse(raw);
  if (!r.success)
    throw new LoadInputError(r.error.issues.map((i) => ({ field: i.path.length ? i.path.map(String).join(".") : "(input)", message: i.message })));
  return r.data;
}

export interface RoomFixedPoint extends FixedPointResult {
  roomId: string;
}

export interface FacilityResult {
  ledger: LedgerResult;
  plant: PlantResult;
  /** Per room with evaporators: the fan/defrost fixed point, its iterations and residual. */
  fixedPoint: { tolerance: number; maxIterations: number; rooms: RoomFixedPoint[] };
  engineVersion: string;
}

export interface ComputeOptions {
  /** Where fluids come from; default the thermo engine's `getFluid` (load them first). */
  getFluid?: (id: FluidId) => Fluid;
}

/** Refrigerants a facility needs loaded before `computeFacility`. */
export function facilityFluidsNeeded(model: Pick<FacilityModel, "plant">): FluidId[] {
  return fluidsNeeded(model.plant);
}

/** The ledger's own part of the document: everything but the version and the plant. */
function ledgerPart(m: FacilityModel): LedgerInput {
  const { schemaVersion, plant, plantOptions, plantStudy, operation, ...ledger } = m;
  void schemaVersion;
  void plant;
  void plantOptions;
  void plantStudy;
  void operation;
  return ledger;
}

/** The same facility with another plant in the design's place (an option, for comparison). */
export function withPlant(model: FacilityModel, plant: PlantInput): FacilityModel {
  return { ...model, plant };
}

interface RoomSolution {
  result: RoomLoadResult;
  sized: EvaporatorSizing[];
  fixedPoint?: RoomFixedPoint;
}

/**
 * One room: the ledger with the plant's fan and defrost heat fed back, solved by
 * `solveDutyFixedPoint` on the design capacity (the larger of the daily requirement and the
 * peak hour, both with the safety factor). Rooms without evaporators keep the fan and
 * defrost entries the user typed.
 */
function solveRoom(room: RoomInput, index: number, evs: EvaporatorInput[], lctx: LedgerContext, plant: PlantInput): RoomSolution {
  if (evs.length === 0) return { result: computeRoomLoad(room, lctx), sized: [] };
  // One ledger call per room: the room without fans and defrost; the plant's lines are added
  // the way the ledger adds them (ledger-feedback.ts, checked against the ledger in its tests).
  const base = computeRoomLoad({ ...room, ...NO_FEEDBACK }, lctx);
  // A room whose ledger nets out below zero (credited colder sides) needs no cooling duty.
  const f = (x: number) => Math.max(0, designCapacityWithFeedback(base, roomFeedback(sizeRoomEvaporators(room, evs, x))));
  const whPerW = feedbackWhPerDayPerW(room, evs);
  const fp = solveDutyFixedPoint(f, {
    tolerance: plant.options.fixedPointTolerance,
    maxIterations: plant.options.fixedPointMaxIterations,
    field: `rooms.${index}`,
    // The ledger turns daily energy into capacity by (1 + SF)/run hours, or — when the peak
    // hour governs — spreads fans and defrost evenly, (1 + SF)/24 per hour. The prediction
    // only saves steps: convergence is still checked on the map itself.
    predict: (f0) => {
      const perWh = (1 + base.safetyFactor) / (base.requiredCapacityW >= base.requiredPeakCapacityW ? base.runHoursPerDay : 24);
      const slope = perWh * whPerW;
      return slope < 1 ? f0 / (1 - slope) : undefined;
    },
  });
  const sized = sizeRoomEvaporators(room, evs, fp.valueW);
  return { result: withFeedback(base, roomFeedback(sized)), sized, fixedPoint: { roomId: room.id, ...fp } };
}

function evaporatorsByRoom(plant: PlantInput): Map<string, EvaporatorInput[]> {
  const m = new Map<string, EvaporatorInput[]>();
  for (const e of plant.evaporators) {
    const list = m.get(e.roomId);
    if (list) list.push(e);
    else m.set(e.roomId, [e]);
  }
  return m;
}

function roomWarnings(model: FacilityModel, results: RoomLoadResult[], byRoom: Map<string, EvaporatorInput[]>): PlantWarning[] {
  const out: PlantWarning[] = [];
  results.forEach((r) => {
    if (r.designCapacityW > 0 && !byRoom.has(r.roomId) && model.plant.evaporators.length > 0)
      out.push({
        code: "ROOM_WITHOUT_EVAPORATOR",
        severity: "warning",
        message: `${r.roomName} needs ${(r.designCapacityW / 1000).toFixed(1)} kW but has no evaporator`,
        ref: { kind: "room", id: r.roomId },
      });
  });
  return out;
}

/**
 * Ledger and plant together for a parsed facility model (`facilityModelSchema.parse`):
 * per room the fan/defrost fixed point (tolerance and cap from `plant.options`;
 * non-convergence throws PlantError NO_CONVERGENCE naming the room), then every circuit
 * with its first- and second-law checks. Fluids must be loaded first
 * (`facilityFluidsNeeded` lists them).
 */
export function computeFacility(model: FacilityModel, opts: ComputeOptions = {}): FacilityResult {
  const getFluid = fluidGetter(opts);
  const lctx = contextFromParsed(ledgerPart(model));
  const byRoom = evaporatorsByRoom(model.plant);
  const solutions = model.rooms.map((room, i) => solveRoom(room, i, byRoom.get(room.id) ?? [], lctx, model.plant));
  const results = solutions.map((s) => s.result);
  const sized = solutions.flatMap((s) => s.sized);
  const plant = computePlant(sized, circuitContext(model, getFluid));
  plant.warnings.unshift(...roomWarnings(model, results, byRoom));
  return {
    ledger: ledgerFromResults(lctx, results),
    plant,
    fixedPoint: fixedPointSummary(model, solutions),
    engineVersion: PLANT_ENGINE_VERSION,
  };
}

function fixedPointSummary(model: FacilityModel, solutions: RoomSolution[]): FacilityResult["fixedPoint"] {
  return {
    tolerance: model.plant.options.fixedPointTolerance,
    maxIterations: model.plant.options.fixedPointMaxIterations,
    rooms: solutions.flatMap((s) => (s.fixedPoint ? [s.fixedPoint] : [])),
  };
}

function fluidGetter(opts: ComputeOptions): (id: FluidId) => Fluid {
  const g = opts.getFluid ?? thermoGetFluid;
  return (id) => {
    try {
      return g(id);
    } catch (err) {
      throw new PlantError("FLUID_NOT_LOADED", err instanceof Error ? err.message : String(err), "plant.circuits.refrigerant");
    }
  };
}

function circuitContext(model: FacilityModel, getFluid: (id: FluidId) => Fluid) {
  return {
    plant: model.plant,
    ambient: ambientOf(model.site),
    rooms: new Map(model.rooms.map((r) => [r.id, { setPointC: r.setPointC, rhPct: r.rhPct }])),
    getFluid,
  };
}

/**
 * Deep equality of JSON-like values (what a parsed model is made of), with an identity fast
 * path; cheaper than serialising both sides when a re-parsed document shares no objects.
 */
export function sameJson(a: unknown, b: unknown): boolean {
  if (a === b) return true;
  if (typeof a !== "object" || typeof b !== "object" || a === null || b === null) return false;
  if (Array.isArray(a)) {
    if (!Array.isArray(b) || a.length !== b.length) return false;
    for (let i = 0; i < a.length; i++) if (!sameJson(a[i], b[i])) return false;
    return true;
  }
  if (Array.isArray(b)) return false;
  const ka = Object.keys(a);
  if (ka.length !== Object.keys(b).length) return false;
  for (const k of ka) if (!sameJson((a as Record<string, unknown>)[k], (b as Record<string, unknown>)[k])) return false;
  return true;
}

/** A small FNV-1a hash of a string, as 8 hex digits (the memo key; not for security). */
export function hashString(s: string): string {
  let h = 0x811c9dc5;
  for (let i = 0; i < s.length; i++) {
    h ^= s.charCodeAt(i);
    h = Math.imul(h, 0x01000193);
  }
  return (h >>> 0).toString(16).padStart(8, "0");
}

export interface FacilityEngine {
  /** As `computeFacility`, reusing rooms and circuits whose inputs hash the same as last time. */
  compute(model: FacilityModel): FacilityResult;
  /** How many rooms and circuits the last `compute` actually recomputed. */
  readonly lastStats: { roomsComputed: number; circuitsComputed: number };
}

/**
 * Incremental `computeFacility`: a memo keyed by input hash. A room's key covers the site,
 * ledger and plant options, the room, its evaporators, its doors and the set points of
 * the rooms its surfaces and doors face; a circuit's key covers its inputs, the condensers,
 * ambient, and the sized evaporators and cascade heat it serves. Only what an edit reaches
 * is recomputed; the results equal a full `computeFacility`. Unchanged objects (same
 * reference, as immutable editors keep them) are not even re-serialised.
 */
export function createFacilityEngine(opts: ComputeOptions = {}): FacilityEngine {
  const getFluid = fluidGetter(opts);
  let roomMemo = new Map<string, RoomSolution>();
  let circuitMemo = new Map<string, { result: CircuitResult | undefined; warnings: PlantWarning[] }>();
  // The serialised input is itself the key (the native string hash of a Map is faster than
  // hashing it again in JS); cached per object so unchanged objects are not re-serialised.
  const hashes = new WeakMap<object, string>();
  const hashOf = (o: object) => {
    let k = hashes.get(o);
    if (k === undefined) {
      k = JSON.stringify(o);
      hashes.set(o, k);
    }
    return k;
  };
  const stats = { roomsComputed: 0, circuitsComputed: 0 };
  let lastCtx: LedgerContext | undefined;
  let slots: { room: RoomInput; evs: EvaporatorInput[]; key: string; sol: RoomSolution }[] = [];
  let lastDoors: unknown = undefined;
  let lastCtxKey = "";
  return {
    get lastStats() {
      return { ...stats };
    },
    compute(model) {
      stats.roomsComputed = 0;
      stats.circuitsComputed = 0;
      const { schemaVersion, plant: plantInput, rooms: roomsInput, doors: doorsInput, plantOptions, plantStudy, ...shared } = model;
      void plantOptions;
      void plantStudy;
      void schemaVersion;
      void plantInput;
      void roomsInput;
      void doorsInput;
      // Site, ledger options and anything else the ledger shares across rooms (e.g. custom commodities).
      const globalKey = hashString(JSON.stringify([shared, model.plant.options]));
      // The ledger context (site and room air by psychrometrics, door lookup) depends only on
      // the site, the options, each room's id / set point / RH and the doors: reuse it.
      // Shared surfaces are counted in both rooms from the context, so a change to one (or to
      // its owner's dimensions, which give its area) must rebuild it.
      const ctxKey = `${globalKey}|${model.rooms
        .map((r) => {
          const shared = r.surfaces.filter((s) => typeof s.otherSide === "object");
          return `${r.id}:${r.setPointC}/${r.rhPct}${shared.length ? `#${r.lengthM}x${r.widthM}x${r.heightM}:${shared.map(hashOf).join(";")}` : ""}`;
        })
        .join(",")}`;
      const ctxSame = ctxKey === lastCtxKey && lastCtx !== undefined && sameJson(model.doors, lastDoors);
      lastDoors = model.doors;
      let lctx = lastCtx;
      if (!ctxSame || !lctx) {
        lctx = contextFromParsed(ledgerPart(model));
        lastCtx = lctx;
        lastCtxKey = ctxKey;
      }
      const byRoom = evaporatorsByRoom(model.plant);
      const faces = new Map(model.rooms.map((r) => [r.id, `${r.setPointC}/${r.rhPct}`]));
      const nextRooms = new Map<string, RoomSolution>();
      const nextSlots: typeof slots = [];
      const solutions = model.rooms.map((room, i) => {
        const evs = byRoom.get(room.id) ?? [];
        // Same context, same room object, same evaporator objects: nothing it depends on moved.
        const slot = slots[i];
        if (ctxSame && slot && sameJson(slot.room, room) && sameJson(slot.evs, evs)) {
          nextRooms.set(slot.key, slot.sol);
          nextSlots.push(slot);
          return slot.sol;
        }
        const doors = lctx.doorsByRoom.get(room.id) ?? [];
        const faced: string[] = [];
        for (const s of room.surfaces) if (typeof s.otherSide === "object") faced.push(faces.get(s.otherSide.roomId) ?? "");
        // Shared surfaces entered in a neighbour (with the neighbour's set point and size).
        for (const m of lctx.sharedSurfaces.get(room.id) ?? [])
          faced.push(`${faces.get(m.owner.id) ?? ""}#${m.owner.lengthM}x${m.owner.widthM}x${m.owner.heightM}:${hashOf(m.surface)}`);
        for (const d of doors) for (const side of d.door.sides) faced.push(faces.get(side) ?? side);
        const key = [globalKey, i, hashOf(room), evs.map(hashOf).join(","), doors.map((d) => hashOf(d.door)).join(","), faced.join(",")].join("|");
        let sol = roomMemo.get(key);
        if (!sol) {
          sol = solveRoom(room, i, evs, lctx, model.plant);
          stats.roomsComputed++;
        }
        nextRooms.set(key, sol);
        nextSlots.push({ room, evs, key, sol });
        return sol;
      });
      roomMemo = nextRooms;
      slots = nextSlots;
      const results = solutions.map((s) => s.result);
      const sized = solutions.flatMap((s) => s.sized);
      const cctx = circuitContext(model, getFluid);
      const prep = preparePlant(model.plant);
      const plantKey = hashString(JSON.stringify([cctx.ambient, model.plant.options, model.plant.condensers]));
      const warnings = evaporatorWarnings(sized, cctx.rooms);
      const done = new Map<string, CircuitResult>();
      const nextCircuits = new Map<string, { result: CircuitResult | undefined; warnings: PlantWarning[] }>();
      const sizedByCircuit = new Map<string, EvaporatorSizing[]>();
      for (const s of sized) {
        const list = sizedByCircuit.get(s.circuitId);
        if (list) list.push(s);
        else sizedByCircuit.set(s.circuitId, [s]);
      }
      for (const c of cascadeOrder(model.plant.circuits)) {
        const evs = sizedByCircuit.get(c.id) ?? [];
        const lows = prep.lowStages.get(c.id) ?? [];
        let key = `${plantKey}|${prep.circuitIndex.get(c.id)}|${hashOf(c)}|`;
        for (const e of evs) {
          const room = cctx.rooms.get(e.roomId);
          key += `${e.id}@${prep.evapIndex.get(e.id)}:${e.dutyW}:${e.tdK}:${hashOf(e.feed)}:${room?.setPointC}/${room?.rhPct}:${e.defrost.type === "hot-gas" ? hashOf(e.defrost) : "-"},`;
        }
        for (const l of lows) key += `<${l.id}:${done.get(l.id)?.heatRejectedW ?? 0}@${done.get(l.id)?.entropySinkC ?? 0}`;
        let entry = circuitMemo.get(key);
        if (!entry) {
          const w: PlantWarning[] = [];
          entry = { result: computeCircuit(c, evs, done, cctx, prep, w), warnings: w };
          stats.circuitsComputed++;
        }
        nextCircuits.set(key, entry);
        warnings.push(...entry.warnings);
        if (entry.result) done.set(c.id, entry.result);
      }
      circuitMemo = nextCircuits;
      const circuits = model.plant.circuits.map((c) => done.get(c.id)).filter((r): r is CircuitResult => r !== undefined);
      const plant = assemblePlant(sized, circuits, warnings, model.plant);
      plant.warnings.unshift(...roomWarnings(model, results, byRoom));
      return {
        ledger: ledgerFromResults(lctx, results),
        plant,
        fixedPoint: fixedPointSummary(model, solutions),
        engineVersion: PLANT_ENGINE_VERSION,
      };
    },
  };
}
