/**
 * Each room's load at any hour of the year, from its design-day ledger taken apart:
 *
 * - parts that follow the weather, computed here per hour with the ledger's own formulas
 *   (transmission through surfaces to outdoors with the sun allowance, Gosney–Olama door
 *   infiltration with the hour's outdoor air, fresh air);
 * - parts that follow a schedule (product intake, people, lights), each the difference of
 *   two ledger evaluations of the room (its inputs doubled and as given; every one of them
 *   is linear in the scaled input), multiplied per hour by the schedule;
 * - the rest (ground, neighbours, stored produce, machinery, heaters …), the ledger at the
 *   reference weather less all of the above: independent of weather and schedule.
 *
 * `directRoomHour` is the reference: the ledger itself with the hour's weather and the
 * schedules applied to the room's inputs. The two agree (annual tests).
 */
import type { LedgerContext, RoomInput } from "../loads";
import { computeRoomLoad } from "../loads";
import { fail } from "../loads/errors";
import { DOCK_SEAL_EFFECTIVENESS, PROTECTION_EFFECTIVENESS, defaultFlowFactor, gosneyOlamaFullyOpen } from "../loads/infiltration";
import type { AirState } from "../loads/psychro";
import type { DoorInput } from "../loads/schema";
import { INSIDE_FILM_M2KW, defaultOutsideFilm, solarAllowanceK, surfaceAreaM2, uValue } from "../loads/transmission";
import { NO_FEEDBACK } from "../plant/ledger-feedback";
import type { OperationInput } from "./schema";

const ONES24 = new Array<number>(24).fill(1);
const ONES_WEEK = Array.from({ length: 7 }, () => ONES24);

/** The multipliers of one room's scheduled parts on one day and hour. */
export interface HourFactors {
  product: number;
  people: number;
  lights: number;
}

export interface DoorPart {
  door: DoorInput;
  index: number;
  /** The warm side: outdoors (the hour's air) or a room's air (fixed). */
  warm: "outdoors" | AirState;
  passages: number[];
  week: number[][];
}

export interface RoomHourModel {
  room: RoomInput;
  index: number;
  air: AirState;
  ignoreColder: boolean;
  residual: Float64Array;
  product: Float64Array;
  people: Float64Array;
  lights: Float64Array;
  /** Outdoor surfaces: U·A and the sun allowance. */
  surfaces: { ua: number; solarK: number }[];
  doors: DoorPart[];
  vent?: { flowM3PerH: number; share: Float64Array };
  /** Design-day moisture brought in by air exchange, kg (the defrost rule's reference). */
  designMoistureKg: number;
  /** Tonnes of product taken in on a design day. */
  designIntakeT: number;
}

/** The fraction of each hour a load running `hours` from `start` covers (the ledger's spread). */
function onShares(start: number | undefined, hours: number): Float64Array {
  const s = new Float64Array(24);
  if (start === undefined || hours >= 24) {
    s.fill(Math.min(hours, 24) / 24);
    return s;
  }
  let t = start;
  const end = start + hours;
  while (t < end - 1e-12) {
    const hs = Math.floor(t);
    const next = Math.min(hs + 1, end);
    s[((hs % 24) + 24) % 24] += next - t;
    t = next;
  }
  return s;
}

function scaledRoom(room: RoomInput, f: HourFactors): RoomInput {
  const r: RoomInput = { ...room };
  if (f.product !== 1) {
    r.products = room.products.map((p) => ({
      ...p,
      massKgPerDay: p.massKgPerDay * f.product,
      packaging: p.packaging && p.packaging.massKgPerDay !== undefined ? { ...p.packaging, massKgPerDay: p.packaging.massKgPerDay * f.product } : p.packaging,
    }));
    if (room.batch)
      r.batch = {
        ...room.batch,
        massKg: room.batch.massKg * f.product,
        packaging:
          room.batch.packaging && room.batch.packaging.massKgPerDay !== undefined
            ? { ...room.batch.packaging, massKgPerDay: room.batch.packaging.massKgPerDay * f.product }
            : room.batch.packaging,
      };
  }
  if (f.people !== 1 && room.people) r.people = { ...room.people, count: room.people.count * f.people };
  if (f.lights !== 1 && room.lights)
    r.lights = { ...room.lights, powerW: room.lights.powerW === undefined ? undefined : room.lights.powerW * f.lights, wPerM2: room.lights.wPerM2 === undefined ? undefined : room.lights.wPerM2 * f.lights };
  return r;
}

function profile(room: RoomInput, ctx: LedgerContext): number[] {
  return computeRoomLoad({ ...room, ...NO_FEEDBACK }, ctx).hourly;
}

function diff(a: number[], b: number[]): Float64Array {
  const out = new Float64Array(24);
  for (let h = 0; h < 24; h++) out[h] = a[h] - b[h];
  return out;
}

/** The week of door-traffic multipliers for a door. */
function doorWeek(op: OperationInput, doorId: string): number[][] {
  return op.doorTraffic.byDoor[doorId] ?? op.doorTraffic.all ?? ONES_WEEK;
}

/** One door's load on the colder room in one hour, W, and the moisture it brings, kg/s. */
export function doorHour(d: DoorPart, room: AirState, warm: AirState, passages: number, field: string): { w: number; moistureKgS: number } {
  if (!(warm.tempC > room.tempC)) return { w: 0, moistureKgS: 0 };
  const door = d.door;
  const open = gosneyOlamaFullyOpen(door.widthM, door.heightM, warm, room);
  if (open.qtW === 0) return { w: 0, moistureKgS: 0 };
  const df = door.flowFactor ?? defaultFlowFactor(warm.tempC - room.tempC);
  let e = door.protectionEffectiveness ?? PROTECTION_EFFECTIVENESS[door.protection];
  if (door.dock) {
    const eSeal = door.dock.sealEffectiveness ?? DOCK_SEAL_EFFECTIVENESS[door.dock.seal];
    e = door.dock.dockedShare * Math.max(eSeal, e) + (1 - door.dock.dockedShare) * e;
  }
  const dt = (passages * door.openCloseSecondsPerPassage + 60 * (door.minutesHeldOpenPerDay / 24)) / 3600;
  if (dt > 1 + 1e-9) fail(field, `the door would stand open ${(dt * 60).toFixed(0)} min in an hour (at most 60): lower the door-traffic multiplier`);
  const k = dt * df * (1 - e);
  return { w: open.qtW * k, moistureKgS: open.dryAirKgS * k * Math.max(0, warm.humRatio - room.humRatio) };
}

/** Fresh air in one hour: load W (with the colder-side rule) and moisture kg/s. */
function ventHour(flowM3PerH: number, share: number, out: AirState, room: AirState, ignoreColder: boolean): { w: number; moistureKgS: number } {
  if (share === 0) return { w: 0, moistureKgS: 0 };
  const dryAirKgS = ((flowM3PerH / 3600) * out.densityKgM3) / (1 + out.humRatio);
  const running = dryAirKgS * (out.enthalpyJkg - room.enthalpyJkg);
  const w = running < 0 && ignoreColder ? 0 : running * share;
  return { w, moistureKgS: dryAirKgS * share * Math.max(0, out.humRatio - room.humRatio) };
}

/**
 * The room taken apart (see the file comment). `ctx` is the ledger context at the reference
 * weather (the site's design state).
 */
export function buildRoomHourModel(room: RoomInput, index: number, ctx: LedgerContext, op: OperationInput): RoomHourModel {
  const air = ctx.roomAir.get(room.id)!;
  const ignoreColder = ctx.options.colderNeighbour === "ignore";
  const at = `rooms.${index}`;
  const base = profile(room, ctx);
  const two: HourFactors = { product: 2, people: 1, lights: 1 };
  const product = diff(profile(scaledRoom(room, two), ctx), base);
  const people = room.people ? diff(profile(scaledRoom(room, { product: 1, people: 2, lights: 1 }), ctx), base) : new Float64Array(24);
  const lights = room.lights ? diff(profile(scaledRoom(room, { product: 1, people: 1, lights: 2 }), ctx), base) : new Float64Array(24);

  const surfaces: RoomHourModel["surfaces"] = [];
  room.surfaces.forEach((s, j) => {
    if (s.otherSide !== "outdoors" || s.otherSideTempC !== undefined) return;
    const area = surfaceAreaM2(s, room, `${at}.surfaces.${j}`);
    const u = uValue(s.layers, s.insideFilmM2KW ?? INSIDE_FILM_M2KW, s.outsideFilmM2KW ?? defaultOutsideFilm(s), s.uValueWm2K);
    surfaces.push({ ua: u.uValueWm2K * area, solarK: solarAllowanceK(s, ctx.site.hemisphere) });
  });
  const doors: DoorPart[] = [];
  for (const { door, index: di } of ctx.doorsByRoom.get(room.id) ?? []) {
    const otherId = door.sides[0] === room.id ? door.sides[1] : door.sides[0];
    const warm = otherId === "outdoors" ? "outdoors" : ctx.roomAir.get(otherId);
    if (!warm) continue;
    const passages = Array.from({ length: 24 }, (_, h) => (door.passagesByHour ? door.passagesByHour[h] : (door.passagesPerDay ?? 0) / 24));
    doors.push({ door, index: di, warm, passages, week: doorWeek(op, door.id) });
  }
  const vent = room.ventilation
    ? { flowM3PerH: room.ventilation.flowM3PerH ?? (room.ventilation.airChangesPerHour as number) * room.lengthM * room.widthM * room.heightM, share: onShares(room.ventilation.startHour, room.ventilation.hoursPerDay) }
    : undefined;
  const model: RoomHourModel = {
    room,
    index,
    air,
    ignoreColder,
    residual: new Float64Array(24),
    product,
    people,
    lights,
    surfaces,
    doors,
    vent,
    designMoistureKg: 0,
    designIntakeT: (room.products.reduce((a, p) => a + p.massKgPerDay, 0) + (room.batch ? room.batch.massKg * room.batch.batchesPerDay : 0)) / 1000,
  };
  // The residual: the reference ledger less every part modelled separately, at the reference weather.
  const out = ctx.site.outdoor;
  let moisture = 0;
  for (let h = 0; h < 24; h++) {
    const w = weatherParts(model, h, out, DESIGN_DAY);
    moisture += w.moistureKgS * 3600;
    model.residual[h] = base[h] - product[h] - people[h] - lights[h] - w.w;
  }
  model.designMoistureKg = moisture;
  return model;
}

/** The weekday index meaning "the design day" (every door-traffic multiplier 1). */
export const DESIGN_DAY = -1;

/** The weather-dependent parts of a room at one hour of the day: surfaces, doors, fresh air. */
export function weatherParts(m: RoomHourModel, hod: number, out: AirState, weekday: number): { w: number; moistureKgS: number } {
  const tRoom = m.air.tempC;
  let w = 0;
  let moisture = 0;
  for (const s of m.surfaces) {
    const q = s.ua * (out.tempC + s.solarK - tRoom);
    w += q < 0 && m.ignoreColder ? 0 : q;
  }
  for (const d of m.doors) {
    const warm = d.warm === "outdoors" ? out : d.warm;
    const r = doorHour(d, m.air, warm, d.passages[hod] * (weekday === DESIGN_DAY ? 1 : d.week[weekday][hod]), `operation.doorTraffic.byDoor.${d.door.id}.${weekday}.${hod}`);
    w += r.w;
    moisture += r.moistureKgS;
  }
  if (m.vent) {
    const r = ventHour(m.vent.flowM3PerH, m.vent.share[hod], out, m.air, m.ignoreColder);
    w += r.w;
    moisture += r.moistureKgS;
  }
  return { w, moistureKgS: moisture };
}

/** A room's load (without evaporator fans and defrost) in one hour, W, and the moisture brought in, kg/s. */
export function fastRoomHour(m: RoomHourModel, hod: number, weekday: number, f: HourFactors, out: AirState): { w: number; moistureKgS: number } {
  const wp = weatherParts(m, hod, out, weekday);
  return {
    w: m.residual[hod] + m.product[hod] * f.product + m.people[hod] * f.people + m.lights[hod] * f.lights + wp.w,
    moistureKgS: wp.moistureKgS,
  };
}

/**
 * The reference: the ledger itself for the room with the hour's schedules applied to its
 * inputs and the hour's outdoor air in the site context. Slow (one ledger call per room and
 * hour); used by the `direct` method and the tests.
 */
export function directRoomHour(m: RoomHourModel, hod: number, weekday: number, f: HourFactors, out: AirState, ctx: LedgerContext): number {
  const doorsByRoom = new Map(ctx.doorsByRoom);
  doorsByRoom.set(
    m.room.id,
    m.doors.map((d) => {
      const byHour = new Array<number>(24).fill(0);
      byHour[hod] = d.passages[hod] * d.week[weekday][hod];
      const door: DoorInput = { ...d.door, passagesByHour: byHour, passagesPerDay: undefined };
      return { door, index: d.index };
    }),
  );
  const hourCtx: LedgerContext = { ...ctx, site: { ...ctx.site, outdoor: out, designDryBulbC: out.tempC }, doorsByRoom };
  return computeRoomLoad({ ...scaledRoom(m.room, f), ...NO_FEEDBACK }, hourCtx).hourly[hod];
}
