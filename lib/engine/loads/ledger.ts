import { buildCustomCommodity, getCommodity, type Commodity } from "./commodities";
import { LoadInputError, fail, pathToField } from "./errors";
import { airSurfaceCoefficientWm2K, effectiveSurfaceCoefficientWm2K, phamFreezingTimeS, plankFreezingTimeS } from "./freezing";
import {
  DOCK_SEAL_EFFECTIVENESS,
  PROTECTION_EFFECTIVENESS,
  defaultFlowFactor,
  doorwayOpenTimeFactor,
  gosneyOlamaFullyOpen,
  splitAirExchange,
} from "./infiltration";
import { PACKAGING_CP_KJKGK, packagingHeatKJ, productHeatSplit } from "./product";
import { airFromRH, airFromWetBulb, relativeHumidityPct, sitePressurePa, type AirState } from "./psychro";
import { airVapourPressurePa, evaporationHeatKJkg, surfaceVapourPressurePa } from "./moisture";
import { respirationWPerKg } from "./respiration";
import {
  ledgerInputSchema,
  type DoorInput,
  type LedgerInput,
  type LedgerInputRaw,
  type LedgerOptions,
  type PackagingInput,
  type RoomInput,
  type SurfaceInput,
} from "./schema";
import { INSIDE_FILM_M2KW, defaultOutsideFilm, solarAllowanceK, surfaceAreaM2, transmissionW, uValue } from "./transmission";
import type { LoadComponent, LoadComponentKind, LoadTrace } from "./types";

export const ENGINE_VERSION = "loads-1.1.0";

const HANDBOOK = "ASHRAE Handbook—Refrigeration, refrigerated-facility loads chapter";

/** Site psychrometrics every room shares. */
export interface SiteContext {
  pressurePa: number;
  outdoor: AirState;
  designDryBulbC: number;
  groundTempC: number;
  heatedSlabTempC: number;
  hemisphere: "north" | "south";
}

/** What one room's ledger needs from the rest of the facility. */
export interface LedgerContext {
  input: LedgerInput;
  site: SiteContext;
  options: LedgerOptions;
  /** Room air (set point and RH at site pressure), by room id. */
  roomAir: ReadonlyMap<string, AirState>;
  /** Position of each room in `input.rooms`, for field paths in errors. */
  roomIndex: ReadonlyMap<string, number>;
  /** Doors touching each room, with their index in `input.doors`. */
  doorsByRoom: ReadonlyMap<string, ReadonlyArray<{ door: DoorInput; index: number }>>;
  /** The input's own commodities (overriding the built-in library), by id. */
  commodities: ReadonlyMap<string, Commodity>;
  /**
   * Walls, floors or ceilings shared between two rooms are entered once, in one of them; this
   * lists, for each room, the shared surfaces entered in a neighbour, so the heat through them
   * is counted on both sides.
   */
  sharedSurfaces: ReadonlyMap<string, ReadonlyArray<SharedSurface>>;
  /** Doors set in a wall, by `${roomId}:${surfaceIndex}` of the room the wall is entered in. */
  doorsInWall: ReadonlyMap<string, ReadonlyArray<{ door: DoorInput; index: number }>>;
}

export interface SharedSurface {
  surface: SurfaceInput;
  owner: RoomInput;
  ownerIndex: number;
  surfaceIndex: number;
}

export interface RoomLoadResult {
  roomId: string;
  roomName: string;
  components: LoadComponent[];
  totalEnergyKWhPerDay: number;
  /** 24-h average of the ledger, W. */
  averageLoadW: number;
  safetyFactor: number;
  runHoursPerDay: number;
  /** 24-h energy × (1 + SF) / run hours, W. */
  requiredCapacityW: number;
  sensibleW: number;
  latentW: number;
  /** Sensible heat ratio of the 24-h average (1 when there is no latent load). */
  sensibleHeatRatio: number;
  /** Physical load in each hour of the design day (00:00 … 23:00), W. */
  hourly: number[];
  peakHourW: number;
  peakHour: number;
  /** Peak hour × (1 + SF), W. */
  requiredPeakCapacityW: number;
  /** The larger of requiredCapacityW and requiredPeakCapacityW, W. */
  designCapacityW: number;
  /**
   * Heat flowing out of the room to colder sides or into colder product (24-h average, W):
   * what a heat mode must supply; ignored or credited in the ledger per `colderNeighbour`.
   */
  heatOutflowW: number;
  /** How requiredCapacityW and requiredPeakCapacityW were found. */
  capacityTrace: LoadTrace;
}

export interface LedgerTotals {
  totalEnergyKWhPerDay: number;
  averageLoadW: number;
  requiredCapacityW: number;
  sensibleW: number;
  latentW: number;
  /** Sum of the rooms' hourly profiles, W. */
  hourly: number[];
  peakHourW: number;
  peakHour: number;
  /** Coincident peak: the largest hourly Σ room load × (1 + SF_room), W. */
  requiredPeakCapacityW: number;
}

export interface LedgerResult {
  rooms: RoomLoadResult[];
  totals: LedgerTotals;
  options: LedgerOptions & { statements: string[] };
  site: { pressurePa: number; outdoorHumRatio: number; outdoorEnthalpyJkg: number; outdoorDensityKgM3: number; outdoorRHPct: number };
  engineVersion: string;
}

/**
 * Validates a facility model against {@link ledgerInputSchema}; throws a
 * {@link LoadInputError} listing every issue with its field path.
 */
export function parseLedgerInput(raw: LedgerInputRaw | unknown): LedgerInput {
  const r = ledgerInputSchema.safeParse(raw);
  if (!r.success) {
    throw new LoadInputError(r.error.issues.map((i) => ({ field: pathToField(i.path), message: i.message })));
  }
  return r.data;
}

/**
 * Validates the model and prepares what every room shares: site pressure from elevation
 * (standard atmosphere), the outdoor and room moist-air states (psychrolib), door lookup.
 */
export function buildLedgerContext(raw: LedgerInputRaw | unknown): LedgerContext {
  return contextFromParsed(parseLedgerInput(raw));
}

/** As {@link buildLedgerContext} for an input that is already parsed. */
export function contextFromParsed(input: LedgerInput): LedgerContext {
  const { site } = input;
  const pressurePa = sitePressurePa(site.elevationM);
  const outdoor =
    site.coincidentWetBulbC !== undefined
      ? airFromWetBulb(site.designDryBulbC, site.coincidentWetBulbC, pressurePa, "site.coincidentWetBulbC")
      : airFromRH(site.designDryBulbC, site.designRH as number, pressurePa, "site.designRH");
  const roomAir = new Map<string, AirState>();
  const roomIndex = new Map<string, number>();
  const doorsByRoom = new Map<string, { door: DoorInput; index: number }[]>();
  input.rooms.forEach((r, i) => {
    roomIndex.set(r.id, i);
    roomAir.set(r.id, airFromRH(r.setPointC, r.rhPct, pressurePa, `rooms.${i}.rhPct`));
    doorsByRoom.set(r.id, []);
  });
  input.doors.forEach((door, index) => {
    for (const side of door.sides) doorsByRoom.get(side)?.push({ door, index });
  });
  const sharedSurfaces = new Map<string, SharedSurface[]>();
  input.rooms.forEach((owner, ownerIndex) => {
    owner.surfaces.forEach((surface, surfaceIndex) => {
      if (typeof surface.otherSide !== "object") return;
      const other = surface.otherSide.roomId;
      const list = sharedSurfaces.get(other);
      const entry = { surface, owner, ownerIndex, surfaceIndex };
      if (list) list.push(entry);
      else sharedSurfaces.set(other, [entry]);
    });
  });
  // A shared surface entered in both rooms would be counted twice on each side.
  input.rooms.forEach((room, i) => {
    room.surfaces.forEach((s, j) => {
      if (typeof s.otherSide !== "object") return;
      const otherId = s.otherSide.roomId;
      const back = (sharedSurfaces.get(room.id) ?? []).find((m) => m.owner.id === otherId);
      if (back && back.ownerIndex < i) {
        fail(
          `rooms.${i}.surfaces.${j}.otherSide`,
          `the surface between rooms "${back.owner.id}" and "${room.id}" is already entered in room "${back.owner.id}" (surfaces.${back.surfaceIndex}); enter a shared wall once, in one of the two rooms — it is counted for both`,
        );
      }
    });
  });
  // Doors set in a wall: their area comes out of the wall's; more door than wall is refused.
  const doorsInWall = new Map<string, { door: DoorInput; index: number }[]>();
  input.doors.forEach((door, index) => {
    if (!door.wall) return;
    const key = `${door.wall.roomId}:${door.wall.surfaceIndex}`;
    const list = doorsInWall.get(key) ?? [];
    list.push({ door, index });
    doorsInWall.set(key, list);
    const ri = roomIndex.get(door.wall.roomId);
    if (ri === undefined) fail(`doors.${index}.wall.roomId`, `no room with id "${door.wall.roomId}"`);
    const room = input.rooms[ri];
    const surface = room.surfaces[door.wall.surfaceIndex];
    if (!surface || surface.kind !== "wall") fail(`doors.${index}.wall.surfaceIndex`, `room "${room.id}" has no wall at surfaces.${door.wall.surfaceIndex}`);
    const wallM2 = surfaceAreaM2(surface, room, `rooms.${ri}.surfaces.${door.wall.surfaceIndex}`);
    const doorsM2 = list.reduce((a, d) => a + d.door.widthM * d.door.heightM, 0);
    if (doorsM2 > wallM2 * (1 + 1e-9)) {
      fail(
        `doors.${index}.wall`,
        `the doors in wall rooms.${ri}.surfaces.${door.wall.surfaceIndex} (${list.map((d) => d.door.id).join(", ")}) add up to ${doorsM2.toFixed(2)} m², more than the wall's ${wallM2.toFixed(2)} m²: make the doors smaller or the wall larger`,
      );
    }
  });
  const commodities = new Map<string, Commodity>();
  // `commodities` came after the first contract; inputs built by hand may not carry it.
  for (const c of input.commodities ?? []) commodities.set(c.id, buildCustomCommodity(c));
  return {
    input,
    options: input.options,
    site: {
      pressurePa,
      outdoor,
      designDryBulbC: site.designDryBulbC,
      groundTempC: site.groundTempC,
      heatedSlabTempC: site.heatedSlabTempC,
      hemisphere: site.hemisphere,
    },
    roomAir,
    roomIndex,
    doorsByRoom,
    commodities,
    sharedSurfaces,
    doorsInWall,
  };
}

// ---------------------------------------------------------------------------------------------
// Hourly distribution helpers (all energies in Wh)

/** Adds `energyWh` spread at a constant rate over `durationH` hours from `startH`, wrapping the day. */
function spreadPeriodic(hourly: number[], energyWh: number, startH: number, durationH: number): void {
  if (energyWh === 0) return;
  if (durationH >= 24 && Number.isInteger(startH)) {
    // A steady-periodic day: anything spread over a day or more averages out evenly.
    const each = energyWh / 24;
    for (let h = 0; h < 24; h++) hourly[h] += each;
    return;
  }
  const rate = energyWh / durationH;
  let t = startH;
  const end = startH + durationH;
  while (t < end - 1e-12) {
    const hourStart = Math.floor(t);
    const next = Math.min(hourStart + 1, end);
    hourly[((hourStart % 24) + 24) % 24] += rate * (next - t);
    t = next;
  }
}

/** A load running `hoursPerDay` from `startHour`, or spread evenly when no start is given. */
function spreadScheduled(hourly: number[], energyWh: number, hoursPerDay: number, startHour: number | undefined): void {
  if (startHour === undefined || hoursPerDay >= 24) spreadPeriodic(hourly, energyWh, 0, 24);
  else if (hoursPerDay > 0) spreadPeriodic(hourly, energyWh, startHour, hoursPerDay);
}

function component(
  kind: LoadComponentKind,
  label: string,
  powerW: number,
  latentW: number,
  trace: LoadTrace,
  sourceId?: string,
): LoadComponent {
  const c: LoadComponent = {
    kind,
    label,
    powerW,
    energyKWhPerDay: (powerW * 24) / 1000,
    sensibleW: powerW - latentW,
    latentW,
    trace,
  };
  if (sourceId !== undefined) c.sourceId = sourceId;
  return c;
}

/** Pushes a load that runs `hoursPerDay` at `powerWhileOnW` and adds it to the hourly profile. */
function scheduled(
  components: LoadComponent[],
  hourly: number[],
  kind: LoadComponentKind,
  label: string,
  powerWhileOnW: number,
  hoursPerDay: number,
  startHour: number | undefined,
  method: string,
  source: string,
  inputs: Record<string, number | string>,
  formula: string,
): void {
  const energyWh = powerWhileOnW * hoursPerDay;
  inputs.hoursPerDay = hoursPerDay;
  components.push(component(kind, label, energyWh / 24, 0, { method, source, inputs, formula }));
  spreadScheduled(hourly, energyWh, hoursPerDay, startHour);
}

function requireFinite(value: number, field: string, what: string): void {
  if (!Number.isFinite(value) || value < 0) fail(field, `${what} must be a finite number ≥ 0 (got ${value})`);
}

function commodityOrFail(id: string, field: string, ctx: LedgerContext): Commodity {
  const c = ctx.commodities.get(id) ?? getCommodity(id);
  if (!c) fail(field, `unknown commodity "${id}"`);
  return c;
}

function packagingMassKg(p: PackagingInput, productKg: number): number {
  if (p.massKgPerDay !== undefined) return p.massKgPerDay;
  return (p.massFractionOfProduct ?? 0) * productKg;
}

const NO_DOORS: ReadonlyArray<{ door: DoorInput; index: number }> = [];

/** Trace values are kept at full precision; the UI formats them. */
const round = (x: number) => x;

/**
 * The moisture a fresh product loses (transpiration, ṁ = k_t·m·(p_s − p_a)) evaporates from the
 * produce and condenses (or frosts) on the coil: its heat ṁ·h_fg moves from the sensible to the
 * latent side of the room's load. The evaporation is driven by heat already in the ledger
 * (respiration, the product's own pull-down, the air), so the line adds latent load and takes
 * the same off the sensible side: its total is zero, the sensible heat ratio falls.
 * `excessOverC`: for a warm stream, only the excess over the loss at that temperature.
 */
function moistureLine(
  c: Commodity,
  massKg: number,
  productTempC: number,
  hoursPerDay: number,
  air: AirState,
  sourceId: string,
  what: "stored" | "pull-down",
  excessOverC?: number,
): LoadComponent {
  const kt = c.transpirationNgKgSPa as number;
  // ṁ = k_t·m·(p_s − p_a), each pressure computed once (this runs inside the plant's loop).
  const pA = airVapourPressurePa(air);
  const pS = surfaceVapourPressurePa(productTempC);
  const rate = (ps: number) => Math.max(0, kt * 1e-12 * massKg * (ps - pA));
  let kgS = rate(pS);
  if (excessOverC !== undefined) kgS = Math.max(0, kgS - rate(surfaceVapourPressurePa(excessOverC)));
  const kgPerDay = kgS * 3600 * hoursPerDay;
  const hfg = evaporationHeatKJkg(productTempC);
  const latentW = (kgPerDay * hfg * 1000) / 86400;
  const trace: LoadTrace = {
    method: `Product moisture loss (transpiration)${what === "pull-down" ? " during pull-down, excess over storage" : ""}`,
    source: `ASHRAE Handbook—Refrigeration, thermal properties of foods: transpiration ṁ = k_t·(p_s − p_a); vapour pressures Hyland–Wexler (ASHRAE Fundamentals); k_t: ${c.sources.transpirationNgKgSPa}`,
    inputs: {
      commodity: c.id,
      massKg: round(massKg),
      productTempC: round(productTempC),
      transpirationNgKgSPa: kt,
      surfaceVapourPressurePa: round(pS),
      airVapourPressurePa: round(pA),
      hoursPerDay,
      moistureLossKgPerDay: round(kgPerDay),
      weightLossPctPerDay: massKg > 0 ? round((100 * kgPerDay) / massKg) : 0,
      evaporationHeatKJkg: round(hfg),
      effect: "latent load on the coil; the same heat comes off the sensible side (total unchanged)",
    },
    formula: "ṁ = k_t·m·(p_s(T_product) − p_a); q_latent = ṁ·h_fg; q_sensible = −q_latent",
  };
  const line = component("moisture", `${c.name}: moisture loss${what === "pull-down" ? " during pull-down" : ""}`, 0, latentW, trace, sourceId);
  return line;
}

// ---------------------------------------------------------------------------------------------

/**
 * One room's heat ledger by the handbook method (ASHRAE Handbook—Refrigeration, refrigerated-
 * facility loads): transmission per surface with solar allowance, Gosney–Olama door
 * infiltration, ventilation, product pull-down (Chen enthalpy), packaging, respiration,
 * batch freezing (Pham / Plank), people `272 − 6·t` W, lights, machinery, forklifts, battery
 * charging, heaters, evaporator fans, defrost. Each component is a 24-h average on the stated
 * basis; `requiredCapacityW = Σ energy × (1 + SF) / run hours`. The hourly profile is the
 * physical load through the design day. Cheap enough to call once per room in a plant loop.
 */
export function computeRoomLoad(room: RoomInput, ctx: LedgerContext): RoomLoadResult {
  const idx = ctx.roomIndex.get(room.id);
  const at = idx === undefined ? `rooms[${room.id}]` : `rooms.${idx}`;
  const opts = ctx.options;
  const ignoreColder = opts.colderNeighbour === "ignore";
  const air = ctx.roomAir.get(room.id) ?? airFromRH(room.setPointC, room.rhPct, ctx.site.pressurePa, `${at}.rhPct`);
  const tRoom = room.setPointC;
  const hourly = new Array<number>(24).fill(0);
  const components: LoadComponent[] = [];
  const floorAreaM2 = room.lengthM * room.widthM;
  const volumeM3 = floorAreaM2 * room.heightM;
  // Heat leaving the room to colder sides or into colder product, W (24-h average): what a
  // heat mode would have to supply; shown whether it is ignored or credited in the ledger.
  let heatOutflowW = 0;
  const multiplier = room.ripening?.chargeActive ? room.ripening.respirationMultiplier : 1;

  // Transmission ---------------------------------------------------------------------------
  // Door leaves set in a wall: their own line at their own U (default the wall's), same temperatures.
  const doorLeaves = (doors: ReadonlyArray<{ door: DoorInput; index: number }>, wallU: number, tOutC: number, wallLabel: string, solarK: number) => {
    for (const { door, index } of doors) {
      const a = door.widthM * door.heightM;
      const u = door.uValueWm2K ?? wallU;
      const qW = transmissionW(u, a, tOutC, tRoom);
      const ignored = qW < 0 && ignoreColder;
      const powerW = ignored ? 0 : qW;
      if (qW < 0) heatOutflowW -= qW;
      components.push(
        component(
          "transmission",
          `door ${door.name ?? door.id} (leaf, in ${wallLabel})`,
          powerW,
          0,
          {
            method: "Transmission through a door leaf set in a wall, q = U·A·ΔT",
            source: `${HANDBOOK}; the door's area is taken out of the wall's`,
            inputs: {
              door: `doors.${index}`,
              doorAreaM2: round(a),
              uValueWm2K: round(u),
              uFrom: door.uValueWm2K === undefined ? "the wall's U (no door U given)" : "door leaf U given",
              otherSideTempC: round(tOutC - solarK),
              solarAllowanceK: solarK,
              roomTempC: tRoom,
              computedW: round(qW),
              colderSide: ignored ? "heat to a colder side ignored (option colderNeighbour = ignore)" : "counted",
            },
            formula: "q = U_door·A_door·(T_other + solar − T_room)",
          },
          door.id,
        ),
      );
      spreadPeriodic(hourly, powerW * 24, 0, 24);
    }
  };

  room.surfaces.forEach((s, j) => {
    const field = `${at}.surfaces.${j}`;
    const inWall = ctx.doorsInWall?.size ? (ctx.doorsInWall.get(`${room.id}:${j}`) ?? NO_DOORS) : NO_DOORS;
    const grossM2 = surfaceAreaM2(s, room, field);
    const doorsM2 = inWall.reduce((a, d) => a + d.door.widthM * d.door.heightM, 0);
    const areaM2 = Math.max(0, grossM2 - doorsM2);
    const rsi = s.insideFilmM2KW ?? INSIDE_FILM_M2KW;
    const rse = s.outsideFilmM2KW ?? defaultOutsideFilm(s);
    const u = uValue(s.layers, rsi, rse, s.uValueWm2K);
    let otherC: number;
    let otherLabel: string;
    if (typeof s.otherSide === "object") {
      const neighbour = ctx.roomAir.get(s.otherSide.roomId);
      if (!neighbour) fail(`${field}.otherSide.roomId`, `no room with id "${s.otherSide.roomId}"`);
      otherC = neighbour.tempC;
      otherLabel = `room ${s.otherSide.roomId}`;
    } else if (s.otherSide === "outdoors") {
      otherC = ctx.site.designDryBulbC;
      otherLabel = "outdoors";
    } else if (s.otherSide === "ground") {
      otherC = ctx.site.groundTempC;
      otherLabel = "ground";
    } else {
      otherC = ctx.site.heatedSlabTempC;
      otherLabel = "heated slab";
    }
    if (s.otherSideTempC !== undefined) otherC = s.otherSideTempC;
    const solarK = solarAllowanceK(s, ctx.site.hemisphere);
    const tOutC = otherC + solarK;
    const qW = transmissionW(u.uValueWm2K, areaM2, tOutC, tRoom);
    const ignored = qW < 0 && ignoreColder;
    const powerW = ignored ? 0 : qW;
    if (qW < 0) heatOutflowW -= qW;
    const label = s.label ?? `${s.kind}${s.orientation ? " " + s.orientation : ""} to ${otherLabel}`;
    components.push(
      component(
        "transmission",
        label,
        powerW,
        0,
        {
          method: "Transmission q = U·A·ΔT with solar allowance",
          source: `${HANDBOOK}; U = 1/(R_si + ΣL/λ + R_se), ASHRAE Handbook—Fundamentals; sun allowance table (from memory)`,
          inputs: {
            areaM2: round(areaM2),
            ...(inWall.length ? { grossAreaM2: round(grossM2), doorsAreaM2: round(doorsM2), doorsInWall: inWall.map((d) => d.door.id).join(", ") } : {}),
            uValueWm2K: round(u.uValueWm2K),
            uMethod: u.method,
            insideFilmM2KW: s.uValueWm2K === undefined ? rsi : "in U",
            outsideFilmM2KW: s.uValueWm2K === undefined ? rse : "in U",
            otherSideTempC: otherC,
            solarAllowanceK: solarK,
            roomTempC: tRoom,
            computedW: round(qW),
            colderSide: ignored ? "heat to a colder side ignored (option colderNeighbour = ignore)" : "counted",
          },
          formula: inWall.length ? "q = U·(A_gross − ΣA_doors)·(T_other + solar − T_room)" : "q = U·A·(T_other + solar − T_room)",
        },
        s.id,
      ),
    );
    spreadPeriodic(hourly, powerW * 24, 0, 24);
    doorLeaves(inWall, u.uValueWm2K, tOutC, label, solarK);
  });
  // The same transmission seen from this room, for shared surfaces entered in a neighbour.
  for (const m of ctx.sharedSurfaces.get(room.id) ?? []) {
    const s = m.surface;
    const field = `rooms.${m.ownerIndex}.surfaces.${m.surfaceIndex}`;
    const inWall = ctx.doorsInWall?.size ? (ctx.doorsInWall.get(`${m.owner.id}:${m.surfaceIndex}`) ?? NO_DOORS) : NO_DOORS;
    const grossM2 = surfaceAreaM2(s, m.owner, field);
    const doorsM2 = inWall.reduce((a, d) => a + d.door.widthM * d.door.heightM, 0);
    const areaM2 = Math.max(0, grossM2 - doorsM2);
    const rsi = s.insideFilmM2KW ?? INSIDE_FILM_M2KW;
    const rse = s.outsideFilmM2KW ?? defaultOutsideFilm(s);
    const u = uValue(s.layers, rsi, rse, s.uValueWm2K);
    const otherC = ctx.roomAir.get(m.owner.id)?.tempC ?? m.owner.setPointC;
    const qW = transmissionW(u.uValueWm2K, areaM2, otherC, tRoom);
    const ignored = qW < 0 && ignoreColder;
    const powerW = ignored ? 0 : qW;
    if (qW < 0) heatOutflowW -= qW;
    components.push(
      component(
        "transmission",
        `${s.kind} shared with room ${m.owner.id}`,
        powerW,
        0,
        {
          method: "Transmission q = U·A·ΔT through a surface shared with a neighbouring room",
          source: `${HANDBOOK}; U = 1/(R_si + ΣL/λ + R_se), ASHRAE Handbook—Fundamentals`,
          inputs: {
            enteredIn: `${field} (room ${m.owner.id})`,
            areaM2: round(areaM2),
            ...(inWall.length ? { grossAreaM2: round(grossM2), doorsAreaM2: round(doorsM2), doorsInWall: inWall.map((d) => d.door.id).join(", ") } : {}),
            uValueWm2K: round(u.uValueWm2K),
            uMethod: u.method,
            otherSideTempC: otherC,
            roomTempC: tRoom,
            computedW: round(qW),
            colderSide: ignored ? "heat to a colder side ignored (option colderNeighbour = ignore)" : "counted",
          },
          formula: "q = U·A·(T_neighbour − T_room)",
        },
        s.id ? `${s.id}@${m.owner.id}` : undefined,
      ),
    );
    spreadPeriodic(hourly, powerW * 24, 0, 24);
    doorLeaves(inWall, u.uValueWm2K, otherC, `${s.kind} shared with room ${m.owner.id}`, 0);
  }

  // Door infiltration -------------------------------------------------------------------------
  for (const { door, index } of ctx.doorsByRoom.get(room.id) ?? []) {
    const field = `doors.${index}`;
    const otherId = door.sides[0] === room.id ? door.sides[1] : door.sides[0];
    const warm = otherId === "outdoors" ? ctx.site.outdoor : ctx.roomAir.get(otherId);
    if (!warm) fail(`${field}.sides`, `no room with id "${otherId}"`);
    // The colder room of the pair carries the exchange; the warmer side's small gain of cold air is not credited.
    if (!(warm.tempC > tRoom)) continue;
    const open = gosneyOlamaFullyOpen(door.widthM, door.heightM, warm, air);
    const dT = warm.tempC - tRoom;
    const df = door.flowFactor ?? defaultFlowFactor(dT);
    let e = door.protectionEffectiveness ?? PROTECTION_EFFECTIVENESS[door.protection];
    let dockNote = "no dock";
    if (door.dock) {
      const eSeal = door.dock.sealEffectiveness ?? DOCK_SEAL_EFFECTIVENESS[door.dock.seal];
      // Docked openings see the seal; the others see the door's own protection.
      e = door.dock.dockedShare * Math.max(eSeal, e) + (1 - door.dock.dockedShare) * e;
      dockNote = `${door.dock.seal}, ${Math.round(door.dock.dockedShare * 100)} % docked, seal E ${eSeal}`;
    }
    const heldOpenMinPerHour = door.minutesHeldOpenPerDay / 24;
    const theta = door.openCloseSecondsPerPassage;
    let dtSum = 0;
    for (let h = 0; h < 24; h++) {
      const passages = door.passagesByHour ? door.passagesByHour[h] : (door.passagesPerDay ?? 0) / 24;
      const dtH = doorwayOpenTimeFactor(passages, theta, heldOpenMinPerHour, 1);
      if (dtH > 1 + 1e-9) {
        fail(
          door.passagesByHour ? `${field}.passagesByHour.${h}` : `${field}.passagesPerDay`,
          `the door would stand open ${(dtH * 60).toFixed(0)} min in hour ${h} (at most 60): fewer passages or a shorter open-close time`,
        );
      }
      dtSum += dtH;
      hourly[h] += open.qtW * dtH * df * (1 - e);
    }
    const dt = dtSum / 24;
    const factor = dt * df * (1 - e);
    const powerW = open.qtW * factor;
    const split = splitAirExchange(open.dryAirKgS * factor, warm, air);
    components.push(
      component(
        "infiltration",
        `door ${door.name ?? door.id} from ${otherId}`,
        powerW,
        split.latentW,
        {
          method: "Gosney–Olama door infiltration",
          source: `Gosney & Olama (1975) as given in the ${HANDBOOK}; moist air by psychrolib (ASHRAE Fundamentals) at site pressure`,
          inputs: {
            doorAreaM2: round(door.widthM * door.heightM),
            doorHeightM: door.heightM,
            warmSide: otherId,
            warmTempC: warm.tempC,
            warmEnthalpyKJkg: round(warm.enthalpyJkg / 1000),
            warmDensityKgM3: round(warm.densityKgM3),
            roomEnthalpyKJkg: round(air.enthalpyJkg / 1000),
            roomDensityKgM3: round(air.densityKgM3),
            densityFactorFm: round(open.densityFactor),
            fullyOpenQtW: round(open.qtW),
            openTimeFactorDt: round(dt),
            flowFactorDf: df,
            protection: door.protection,
            effectivenessE: round(e),
            dock: dockNote,
            passagesPerDay: door.passagesByHour ? door.passagesByHour.reduce((a, b) => a + b, 0) : (door.passagesPerDay ?? 0),
            openCloseSeconds: theta,
            minutesHeldOpenPerDay: door.minutesHeldOpenPerDay,
          },
          formula:
            "q = q_t·D_t·D_f·(1−E); q_t = 0.221·A·(h_i−h_r)·ρ_r·(1−ρ_i/ρ_r)^0.5·(g·H)^0.5·F_m; F_m = (2/(1+(ρ_r/ρ_i)^(1/3)))^1.5; D_t = (P·θ_p + 60·θ_o)/(3600·θ_d)",
        },
        door.id,
      ),
    );
  }

  // Ventilation / fresh air ---------------------------------------------------------------
  if (room.ventilation) {
    const v = room.ventilation;
    const flowM3PerH = v.flowM3PerH ?? (v.airChangesPerHour as number) * volumeM3;
    const out = ctx.site.outdoor;
    const dryAirKgS = ((flowM3PerH / 3600) * out.densityKgM3) / (1 + out.humRatio);
    const runningW = dryAirKgS * (out.enthalpyJkg - air.enthalpyJkg);
    const ignored = runningW < 0 && ignoreColder;
    const share = v.hoursPerDay / 24;
    if (runningW < 0) heatOutflowW -= runningW * share;
    const powerW = ignored ? 0 : runningW * share;
    const split = splitAirExchange(dryAirKgS * share, out, air);
    const latentW = ignored ? 0 : split.latentW;
    components.push(
      component("ventilation", "fresh air", powerW, latentW, {
        method: "Fresh-air load from the moist-air enthalpy difference",
        source: `${HANDBOOK}; moist air by psychrolib (ASHRAE Fundamentals)`,
        inputs: {
          flowM3PerH: round(flowM3PerH),
          airChangesPerHour: v.airChangesPerHour ?? "—",
          hoursPerDay: v.hoursPerDay,
          outdoorEnthalpyKJkg: round(out.enthalpyJkg / 1000),
          roomEnthalpyKJkg: round(air.enthalpyJkg / 1000),
          dryAirKgS: round(dryAirKgS),
        },
        formula: "q = ṁ_da·(h_out − h_room), ṁ_da = V·ρ_out/(1 + W_out)",
      }),
    );
    spreadScheduled(hourly, powerW * 24, v.hoursPerDay, v.startHour);
  }

  // Product pull-down -------------------------------------------------------------------------
  room.products.forEach((p, j) => {
    const field = `${at}.products.${j}`;
    const c = commodityOrFail(p.commodityId, `${field}.commodityId`, ctx);
    const tFinal = p.finalTempC ?? tRoom;
    if (tFinal < tRoom) fail(`${field}.finalTempC`, `cannot be below the room set point (${tRoom} °C): the room air cannot cool product below itself`);
    const split = productHeatSplit(c, p.enteringTempC, tFinal);
    const basisHours = opts.pullDownBasis === "rate" ? Math.min(p.pullDownHours, 24) : 24;
    // kJ/day → W on the chosen basis: 1 kJ over `basisHours` h = 1000/(3600·basisHours) W.
    const toW = (kJ: number) => (kJ * 1000) / (3600 * basisHours);
    const parts: Array<[string, number]> = [
      ["sensible above freezing", split.sensibleAboveKJkg],
      ["latent heat of freezing", split.latentKJkg],
      ["sensible below freezing", split.sensibleBelowKJkg],
    ];
    let dailyKJ = 0;
    for (const [name, kJkg] of parts) {
      if (kJkg === 0) continue;
      let kJ = p.massKgPerDay * kJkg;
      const ignored = kJ < 0 && ignoreColder;
      if (kJ < 0) heatOutflowW -= (kJ * 1000) / 86400;
      if (ignored) kJ = 0;
      dailyKJ += kJ;
      components.push(
        component(
          "product",
          `${c.name}: ${name}`,
          toW(kJ),
          0,
          {
            method: "Product pull-down, Chen (1985) food enthalpy",
            source: `${HANDBOOK}; Chen (1985) enthalpy and ice fraction with Schwartzberg bound water, ASHRAE thermal properties of foods; commodity data: ${c.sources.waterFraction}`,
            inputs: {
              commodity: c.id,
              massKgPerDay: p.massKgPerDay,
              enteringTempC: p.enteringTempC,
              finalTempC: tFinal,
              initialFreezingPointC: c.initialFreezingPointC,
              waterFraction: c.waterFraction,
              heatKJkg: round(kJkg),
              pullDownHours: p.pullDownHours,
              basis: opts.pullDownBasis === "rate" ? `rate over ${basisHours} h carried over the day` : "daily energy over 24 h",
              colderProduct: ignored ? "warming of colder product ignored (option colderNeighbour = ignore)" : "counted",
            },
            formula:
              "Q = m·[c_u·(T_in − T_f) + L0·x_ice(T_final) + (1.55 + 1.26·x_s)·(T_f − T_final)], x_ice = (x_wo − x_b)(1 − T_f/T); q = Q / basis hours",
          },
          p.id ?? `${j}`,
        ),
      );
    }
    if (p.packaging) {
      const pk = p.packaging;
      const massKg = packagingMassKg(pk, p.massKgPerDay);
      const cp = pk.specificHeatKJkgK ?? PACKAGING_CP_KJKGK[pk.kind];
      let kJ = packagingHeatKJ(massKg, cp, p.enteringTempC, tFinal);
      if (kJ < 0) heatOutflowW -= (kJ * 1000) / 86400;
      if (kJ < 0 && ignoreColder) kJ = 0;
      dailyKJ += kJ;
      components.push(
        component(
          "packaging",
          `${c.name}: packaging (${pk.kind})`,
          toW(kJ),
          0,
          {
            method: "Packaging sensible heat m·c·ΔT",
            source: `${HANDBOOK}; specific heats from general property tables (from memory)`,
            inputs: { kind: pk.kind, massKgPerDay: round(massKg), cpKJkgK: cp, enteringTempC: p.enteringTempC, finalTempC: tFinal },
            formula: "Q = m·c·(T_in − T_final); q = Q / basis hours",
          },
          p.id ?? `${j}`,
        ),
      );
    }
    // Fresh produce respires faster while it is still warm: the day's intake spends the
    // pull-down at about its mean temperature; only the excess over the room temperature is
    // added, as the stored mass already carries respiration at the set point. Produce being
    // frozen stops respiring as it freezes, so a freezing stream carries none.
    const chilled = tFinal >= c.initialFreezingPointC;
    if ((c.group === "fruit" || c.group === "vegetable") && c.respiration && chilled && p.massKgPerDay > 0) {
      const meanC = (p.enteringTempC + tFinal) / 2;
      const excessWPerKg = respirationWPerKg(c, meanC, `${field}.enteringTempC`) - respirationWPerKg(c, tRoom, `${field}.commodityId`);
      const hoursWarm = Math.min(p.pullDownHours, 24);
      const wh = p.massKgPerDay * Math.max(0, excessWPerKg) * hoursWarm * multiplier;
      if (wh > 0) {
        components.push(
          component(
            "respiration",
            `${c.name}: respiration during pull-down`,
            wh / 24,
            0,
            {
              method: c.respiration.kind === "fg" ? "Respiration, Becker–Fricke fit, at the mean pull-down temperature" : "Respiration, tabulated, at the mean pull-down temperature",
              source: c.sources.respiration,
              inputs: {
                commodity: c.id,
                massKgPerDay: p.massKgPerDay,
                meanPullDownTempC: meanC,
                excessWPerKg: round(excessWPerKg),
                hoursWarm,
                ripeningMultiplier: multiplier,
              },
              formula: "q = m·[q(T_mean) − q(T_room)]·t_pd / 24 h",
            },
            p.id ?? `${j}`,
          ),
        );
        dailyKJ += wh * 3.6;
      }
    }
    // Warm produce also loses moisture faster during its pull-down: the excess over the rate
    // at the room temperature (which the stored mass carries) for the pull-down hours.
    if ((c.group === "fruit" || c.group === "vegetable") && chilled && p.massKgPerDay > 0 && (c.transpirationNgKgSPa ?? 0) > 0) {
      const meanC = (p.enteringTempC + tFinal) / 2;
      if (meanC > tRoom) components.push(moistureLine(c, p.massKgPerDay, meanC, Math.min(p.pullDownHours, 24), air, p.id ?? `${j}`, "pull-down", tRoom));
    }
    const dailyWh = dailyKJ / 3.6;
    if (p.arrivalsByHour) {
      const sum = p.arrivalsByHour.reduce((a, b) => a + b, 0);
      if (!(sum > 0)) fail(`${field}.arrivalsByHour`, "at least one hour must have arrivals");
      p.arrivalsByHour.forEach((w, h) => {
        if (w > 0) spreadPeriodic(hourly, (dailyWh * w) / sum, h, p.pullDownHours);
      });
    } else {
      spreadPeriodic(hourly, dailyWh, 0, 24);
    }
  });

  // Respiration ---------------------------------------------------------------------------------
  room.storedProduce.forEach((s, j) => {
    const field = `${at}.storedProduce.${j}`;
    const c = commodityOrFail(s.commodityId, `${field}.commodityId`, ctx);
    // Meat, fish, dairy and frozen produce do not respire.
    if ((c.group !== "fruit" && c.group !== "vegetable") || tRoom < c.initialFreezingPointC) return;
    const massKg = s.massKg ?? (s.palletPositions as number) * (s.kgPerPallet as number);
    const wPerKg = respirationWPerKg(c, tRoom, `${field}.commodityId`);
    const powerW = massKg * wPerKg * multiplier;
    components.push(
      component(
        "respiration",
        `${c.name}: respiration`,
        powerW,
        0,
        {
          method: c.respiration?.kind === "fg" ? "Respiration, Becker–Fricke fit" : "Respiration, tabulated heat of respiration",
          source: c.sources.respiration,
          inputs: {
            commodity: c.id,
            massKg: round(massKg),
            palletPositions: s.palletPositions ?? "—",
            kgPerPallet: s.kgPerPallet ?? "—",
            roomTempC: tRoom,
            wPerKg: round(wPerKg),
            ripeningMultiplier: multiplier,
            ...(c.respiration?.kind === "fg" ? { f: c.respiration.f, g: c.respiration.g } : {}),
          },
          formula:
            c.respiration?.kind === "fg"
              ? "q = m·(10.7·f/3600)·(9T/5 + 32)^g × ripening multiplier"
              : "q = m·q(T) (log-linear between tabulated points) × ripening multiplier",
        },
        `${j}`,
      ),
    );
    spreadPeriodic(hourly, powerW * 24, 0, 24);
    if (c.transpirationNgKgSPa !== undefined && c.transpirationNgKgSPa > 0) {
      components.push(moistureLine(c, massKg, tRoom, 24, air, `${j}`, "stored"));
    }
  });

  // Batch freezing ------------------------------------------------------------------------------
  if (room.batch) {
    const b = room.batch;
    const field = `${at}.batch`;
    const c = commodityOrFail(b.commodityId, `${field}.commodityId`, ctx);
    const airC = b.airTempC ?? tRoom;
    const tf = c.initialFreezingPointC;
    if (!(airC < b.finalTempC)) fail(`${field}.finalTempC`, `the final temperature must be above the air temperature (${airC} °C)`);
    if (!(b.enteringTempC > b.finalTempC)) fail(`${field}.enteringTempC`, `must be above the final temperature (${b.finalTempC} °C)`);
    const rho = b.densityKgM3 ?? c.densityKgM3;
    const k = b.frozenConductivityWmK ?? c.frozenConductivityWmK;
    if (rho === undefined) fail(`${field}.densityKgM3`, `no density for "${c.id}" in the library: give densityKgM3`);
    if (k === undefined) fail(`${field}.frozenConductivityWmK`, `no frozen conductivity for "${c.id}" in the library: give frozenConductivityWmK`);
    const hAirWm2K = b.surfaceHeatTransferWm2K ?? airSurfaceCoefficientWm2K(b.airVelocityMS);
    const hWm2K = effectiveSurfaceCoefficientWm2K(hAirWm2K, b.packagingResistanceM2KW);
    let freezeS: number;
    let methodName: string;
    if (b.freezingTimeMethod === "plank") {
      if (!(airC < tf)) fail(`${field}.airTempC`, `air at ${airC} °C cannot freeze ${c.id} (initial freezing point ${tf} °C)`);
      freezeS = plankFreezingTimeS({
        densityKgM3: rho,
        latentHeatJkg: c.latentHeatKJkg * 1000,
        freezingPointC: tf,
        airTempC: airC,
        thicknessM: b.thicknessM,
        hWm2K,
        frozenConductivityWmK: k,
        shape: b.shape,
      });
      methodName = "Plank (phase change only)";
    } else {
      const pham = phamFreezingTimeS({
        densityKgM3: rho,
        latentHeatJkg: c.latentHeatKJkg * 1000,
        cpUnfrozenJkgK: c.cpAboveKJkgK * 1000,
        cpFrozenJkgK: c.cpBelowKJkgK * 1000,
        initialTempC: b.enteringTempC,
        finalCentreTempC: b.finalTempC,
        airTempC: airC,
        thicknessM: b.thicknessM,
        hWm2K,
        frozenConductivityWmK: k,
        shape: b.shape,
      });
      if (!(b.enteringTempC > pham.meanFreezingTempC)) {
        fail(`${field}.enteringTempC`, `Pham's method needs the product to enter above its mean freezing temperature (${pham.meanFreezingTempC.toFixed(1)} °C); use freezingTimeMethod "plank"`);
      }
      if (!(airC < pham.meanFreezingTempC)) fail(`${field}.airTempC`, `air at ${airC} °C cannot freeze ${c.id}`);
      freezeS = pham.timeS;
      methodName = "Pham (1986), including pre-cooling and sub-cooling";
    }
    const batchHours = b.batchHours ?? freezeS / 3600;
    if (b.batchesPerDay * batchHours > 24 + 1e-9) {
      fail(`${field}.batchesPerDay`, `${b.batchesPerDay} batches of ${batchHours.toFixed(1)} h do not fit in 24 h (use a fraction, e.g. 0.5 for a batch every two days)`);
    }
    const split = productHeatSplit(c, b.enteringTempC, b.finalTempC);
    const batchKJ = b.massKg * split.totalKJkg;
    const packKJ = b.packaging
      ? packagingHeatKJ(packagingMassKg(b.packaging, b.massKg), b.packaging.specificHeatKJkgK ?? PACKAGING_CP_KJKGK[b.packaging.kind], b.enteringTempC, b.finalTempC)
      : 0;
    const basisNote = opts.pullDownBasis === "rate" ? `batch rate over ${batchHours.toFixed(2)} h carried over the day` : "daily energy over 24 h";
    const toW = (kJPerBatch: number) =>
      opts.pullDownBasis === "rate" ? (kJPerBatch * 1000) / (batchHours * 3600) : (kJPerBatch * b.batchesPerDay * 1000) / (24 * 3600);
    const common = {
      commodity: c.id,
      massKgPerBatch: b.massKg,
      batchesPerDay: b.batchesPerDay,
      enteringTempC: b.enteringTempC,
      finalTempC: b.finalTempC,
      airTempC: airC,
      airVelocityMS: b.airVelocityMS,
      hAirWm2K: round(hAirWm2K),
      packagingResistanceM2KW: b.packagingResistanceM2KW,
      hEffectiveWm2K: round(hWm2K),
      thicknessM: b.thicknessM,
      shape: b.shape,
      densityKgM3: rho,
      frozenConductivityWmK: k,
      freezingTimeMethod: methodName,
      freezingTimeH: round(freezeS / 3600),
      batchHours: round(batchHours),
      basis: basisNote,
    };
    components.push(
      component(
        "batch",
        `${c.name}: batch freezing`,
        toW(batchKJ),
        0,
        {
          method: `Batch freezing, Chen (1985) enthalpy; batch time by ${methodName}`,
          source: `${HANDBOOK}; Plank (1913) / Pham (1986) freezing time; Chen (1985) enthalpy; h by Jürges/McAdams (from memory)`,
          inputs: { ...common, heatKJkg: round(split.totalKJkg), latentKJkg: round(split.latentKJkg) },
          formula: "Q = m·(H(T_in) − H(T_final)); q = Q / batch time (rate) or n·Q / 24 h",
        },
        "batch",
      ),
    );
    if (packKJ !== 0) {
      components.push(
        component(
          "packaging",
          `${c.name}: batch packaging (${b.packaging?.kind})`,
          toW(packKJ),
          0,
          {
            method: "Packaging sensible heat m·c·ΔT",
            source: `${HANDBOOK}; specific heats from general property tables (from memory)`,
            inputs: { ...common, packagingKJPerBatch: round(packKJ) },
            formula: "Q = m·c·(T_in − T_final)",
          },
          "batch",
        ),
      );
    }
    const fanWh = b.fanPowerW * batchHours * b.batchesPerDay;
    if (b.fanPowerW > 0) {
      components.push(
        component(
          "batch",
          "batch fans",
          opts.pullDownBasis === "rate" ? b.fanPowerW : fanWh / 24,
          0,
          {
            method: "Fan motor heat (all input power becomes heat in the room)",
            source: HANDBOOK,
            inputs: { fanPowerW: b.fanPowerW, runHoursPerDay: round(batchHours * b.batchesPerDay), basis: basisNote },
            formula: "q = P_fan while a batch runs",
          },
          "batch",
        ),
      );
    }
    // Whole batches back to back from startHour; a fractional batchesPerDay (a batch every
    // few days) puts its share of one batch on the day.
    const batchWh = (batchKJ + packKJ) / 3.6 + b.fanPowerW * batchHours;
    const whole = Math.floor(b.batchesPerDay);
    for (let n = 0; n < whole; n++) spreadPeriodic(hourly, batchWh, b.startHour + n * batchHours, batchHours);
    const part = b.batchesPerDay - whole;
    if (part > 0) spreadPeriodic(hourly, part * batchWh, b.startHour + whole * batchHours, batchHours);
  }

  // Internal loads --------------------------------------------------------------------------------

  if (room.people && room.people.count > 0) {
    const perPersonW = 272 - 6 * tRoom;
    scheduled(components, hourly,
      "people",
      "people",
      room.people.count * perPersonW,
      room.people.hoursPerDay,
      room.people.startHour,
      "Heat from people, 272 − 6·t W per person",
      `${HANDBOOK} (from memory)`,
      { count: room.people.count, roomTempC: tRoom, perPersonW: round(perPersonW) },
      "q = n·(272 − 6·t)",
    );
  }
  if (room.lights) {
    const l = room.lights;
    const w = l.powerW ?? (l.wPerM2 as number) * floorAreaM2;
    scheduled(components, hourly, "lights", "lights", w, l.hoursPerDay, l.startHour, "Lighting heat", HANDBOOK, { powerW: round(w), wPerM2: l.wPerM2 ?? "—", floorAreaM2: round(floorAreaM2) }, "q = P·h/24");
  }
  for (const m of room.machinery) {
    scheduled(components, hourly, "machinery", m.label, m.powerW, m.hoursPerDay, m.startHour, "Machinery input power as heat", HANDBOOK, { powerW: m.powerW }, "q = P·h/24");
  }
  if (room.forklifts && room.forklifts.count > 0) {
    const f = room.forklifts;
    scheduled(components, hourly, "forklifts", "forklifts", f.count * f.powerWEach, f.hoursPerDay, f.startHour, "Forklift heat", HANDBOOK, { count: f.count, powerWEach: f.powerWEach }, "q = n·P·h/24");
  }
  if (room.batteryCharging) {
    const bc = room.batteryCharging;
    scheduled(components, hourly, "batteryCharging", "battery charging", bc.heatW, bc.hoursPerDay, bc.startHour, "Battery-charging heat released in the room", "common practice", { heatW: bc.heatW }, "q = P·h/24");
  }
  room.heaters.forEach((h, j) => {
    const w = h.powerW * h.fractionToRoom;
    scheduled(components, hourly,
      "heater",
      h.label ?? `${h.kind} heater`,
      w,
      h.hoursPerDay,
      undefined,
      "Heater power reaching the room",
      `${HANDBOOK}; share to room as given`,
      { kind: h.kind, powerW: h.powerW, fractionToRoom: h.fractionToRoom, index: j },
      "q = P·share·h/24",
    );
  });

  if (room.ripening?.heating && room.ripening.heating.powerW > 0) {
    const hm = room.ripening.heating;
    scheduled(
      components,
      hourly,
      "heater",
      "ripening heat mode",
      hm.powerW,
      hm.hoursPerDay,
      hm.startHour,
      "Ripening-room heaters run on the design day; their heat is removed by the coil",
      HANDBOOK,
      { powerW: hm.powerW },
      "q = P·h/24",
    );
  }
  appendEvaporatorHeat(components, hourly, room.evaporatorFans, room.defrost, at);
  return finishRoom(
    { roomId: room.id, roomName: room.name, safetyFactor: room.safetyFactor, runHoursPerDay: room.runHoursPerDay, pullDownBasis: opts.pullDownBasis, colderNeighbour: opts.colderNeighbour },
    components,
    hourly,
    heatOutflowW,
    at,
  );
}

/** The evaporator fan and defrost lines (the two inputs the plant's fixed point replaces). */
function appendEvaporatorHeat(
  components: LoadComponent[],
  hourly: number[],
  fans: RoomInput["evaporatorFans"],
  d: RoomInput["defrost"],
  at: string,
): void {
  requireFinite(fans.powerW, `${at}.evaporatorFans.powerW`, "evaporator fan power");
  requireFinite(fans.hoursPerDay, `${at}.evaporatorFans.hoursPerDay`, "evaporator fan hours");
  if (fans.hoursPerDay > 24) fail(`${at}.evaporatorFans.hoursPerDay`, "must be between 0 and 24 h/day");
  if (fans.powerW > 0) {
    scheduled(components, hourly, "evaporatorFans", "evaporator fans", fans.powerW, fans.hoursPerDay, undefined, "Evaporator fan motor heat (all input inside the room)", HANDBOOK, { powerW: fans.powerW }, "q = P·h/24");
  }
  requireFinite(d.heaterW, `${at}.defrost.heaterW`, "defrost heater power");
  requireFinite(d.minutesPerDefrost, `${at}.defrost.minutesPerDefrost`, "defrost minutes");
  requireFinite(d.defrostsPerDay, `${at}.defrost.defrostsPerDay`, "defrosts per day");
  if (!(d.fractionToRoom >= 0 && d.fractionToRoom <= 1)) fail(`${at}.defrost.fractionToRoom`, "must be between 0 and 1");
  const defrostWh = d.heaterW * (d.minutesPerDefrost / 60) * d.defrostsPerDay * d.fractionToRoom;
  if (defrostWh > 0) {
    components.push(
      component("defrost", "defrost", defrostWh / 24, 0, {
        method: "Defrost heat reaching the room",
        source: `${HANDBOOK}; share to room a third to a half (common practice)`,
        inputs: { heaterW: d.heaterW, minutesPerDefrost: d.minutesPerDefrost, defrostsPerDay: d.defrostsPerDay, fractionToRoom: d.fractionToRoom },
        formula: "q = P·(min/60)·n·share / 24",
      }),
    );
    spreadPeriodic(hourly, defrostWh, 0, 24);
  }
}

interface RoomHead {
  roomId: string;
  roomName: string;
  safetyFactor: number;
  runHoursPerDay: number;
  pullDownBasis: LedgerOptions["pullDownBasis"];
  colderNeighbour: LedgerOptions["colderNeighbour"];
}

/** The room's sums, safety factor, run time and design capacity from its components. */
function finishRoom(head: RoomHead, components: LoadComponent[], hourly: number[], heatOutflowW: number, at: string): RoomLoadResult {
  let averageLoadW = 0;
  let latentW = 0;
  for (const c of components) {
    averageLoadW += c.powerW;
    latentW += c.latentW;
  }
  const sensibleW = averageLoadW - latentW;
  let peakHour = 0;
  for (let h = 1; h < 24; h++) if (hourly[h] > hourly[peakHour]) peakHour = h;
  const sf = head.safetyFactor;
  const totalEnergyKWhPerDay = (averageLoadW * 24) / 1000;
  const requiredCapacityW = (averageLoadW * 24 * (1 + sf)) / head.runHoursPerDay;
  const requiredPeakCapacityW = hourly[peakHour] * (1 + sf);
  const result: RoomLoadResult = {
    roomId: head.roomId,
    roomName: head.roomName,
    components,
    totalEnergyKWhPerDay,
    averageLoadW,
    safetyFactor: sf,
    runHoursPerDay: head.runHoursPerDay,
    requiredCapacityW,
    sensibleW,
    latentW,
    sensibleHeatRatio: averageLoadW > 0 ? sensibleW / averageLoadW : 1,
    hourly,
    peakHourW: hourly[peakHour],
    peakHour,
    requiredPeakCapacityW,
    designCapacityW: Math.max(requiredCapacityW, requiredPeakCapacityW),
    heatOutflowW,
    capacityTrace: {
      method: "Design capacity from the 24-h energy, safety factor and allowed run time",
      source: `${HANDBOOK}; safety factor and run time by common practice`,
      inputs: {
        totalEnergyKWhPerDay,
        safetyFactor: sf,
        runHoursPerDay: head.runHoursPerDay,
        peakHour,
        peakHourW: hourly[peakHour],
        pullDownBasis: head.pullDownBasis,
        colderNeighbour: head.colderNeighbour,
      },
      formula: "Q_req = E_24h·(1 + SF)/t_run; Q_peak = max_h q_h·(1 + SF); design = max(Q_req, Q_peak)",
    },
  };
  for (const key of ["averageLoadW", "requiredCapacityW", "latentW", "peakHourW"] as const) {
    if (!Number.isFinite(result[key])) fail(at, `${key} came out non-finite: check the room's inputs`);
  }
  return result;
}

/**
 * A room ledger computed with no evaporator fan or defrost heat, plus those two lines: the
 * same result as {@link computeRoomLoad} with them in the room's fields. The plant's
 * fan/defrost fixed point computes the rest of the room once and adds these per trial.
 */
export function withEvaporatorHeat(
  base: RoomLoadResult,
  fans: RoomInput["evaporatorFans"],
  defrost: RoomInput["defrost"],
  at = `rooms[${base.roomId}]`,
): RoomLoadResult {
  if (base.components.some((c) => c.kind === "evaporatorFans" || c.kind === "defrost")) {
    throw new Error(`withEvaporatorHeat needs room ${base.roomId} computed without fan and defrost heat`);
  }
  const components = base.components.slice();
  const hourly = base.hourly.slice();
  appendEvaporatorHeat(components, hourly, fans, defrost, at);
  const t = base.capacityTrace.inputs;
  return finishRoom(
    {
      roomId: base.roomId,
      roomName: base.roomName,
      safetyFactor: base.safetyFactor,
      runHoursPerDay: base.runHoursPerDay,
      pullDownBasis: t.pullDownBasis as LedgerOptions["pullDownBasis"],
      colderNeighbour: t.colderNeighbour as LedgerOptions["colderNeighbour"],
    },
    components,
    hourly,
    base.heatOutflowW,
    at,
  );
}

function statements(o: LedgerOptions): string[] {
  return [
    o.colderNeighbour === "ignore"
      ? "Heat flowing to a colder side (neighbour room, ground, cool air or colder product) is ignored, not credited."
      : "Heat flowing to a colder side (neighbour room, ground, cool air or colder product) is credited against the load.",
    o.pullDownBasis === "rate"
      ? "Product pull-downs and batches shorter than a day are put on the 24-hour basis at their pull-down rate, carried over the whole day (sizing practice)."
      : "Product pull-downs and batches are put on the 24-hour basis by their actual daily energy.",
    "Door infiltration is charged to the colder of the two spaces a door joins; the warmer side is not credited.",
    "The hourly profile is the physical load through the design day (arrivals, door traffic and schedules by hour).",
  ];
}

/**
 * The facility's heat ledger: validates the model, builds the shared context and computes
 * every room with {@link computeRoomLoad}; totals are sums over rooms, the coincident peak
 * from the summed hourly profiles. Throws {@link LoadInputError} naming the field on bad input.
 */
export function computeLedger(raw: LedgerInputRaw): LedgerResult {
  const ctx = buildLedgerContext(raw);
  return ledgerFromContext(ctx);
}

/** As {@link computeLedger} for a context already built (e.g. by a plant loop). */
export function ledgerFromContext(ctx: LedgerContext, rooms: ReadonlyArray<RoomInput> = ctx.input.rooms): LedgerResult {
  return ledgerFromResults(
    ctx,
    rooms.map((r) => computeRoomLoad(r, ctx)),
  );
}

/**
 * The facility ledger from room results already computed (e.g. by the plant's fan/defrost
 * loop): the sums, the coincident hourly profile and peak, the stated options and site.
 */
export function ledgerFromResults(ctx: LedgerContext, results: RoomLoadResult[]): LedgerResult {
  const hourly = new Array<number>(24).fill(0);
  const hourlyWithSF = new Array<number>(24).fill(0);
  let totalEnergyKWhPerDay = 0;
  let averageLoadW = 0;
  let requiredCapacityW = 0;
  let sensibleW = 0;
  let latentW = 0;
  for (const r of results) {
    totalEnergyKWhPerDay += r.totalEnergyKWhPerDay;
    averageLoadW += r.averageLoadW;
    requiredCapacityW += r.requiredCapacityW;
    sensibleW += r.sensibleW;
    latentW += r.latentW;
    for (let h = 0; h < 24; h++) {
      hourly[h] += r.hourly[h];
      hourlyWithSF[h] += r.hourly[h] * (1 + r.safetyFactor);
    }
  }
  let peakHour = 0;
  let peakSF = 0;
  for (let h = 0; h < 24; h++) {
    if (hourly[h] > hourly[peakHour]) peakHour = h;
    if (hourlyWithSF[h] > peakSF) peakSF = hourlyWithSF[h];
  }
  const out = ctx.site.outdoor;
  return {
    rooms: results,
    totals: {
      totalEnergyKWhPerDay,
      averageLoadW,
      requiredCapacityW,
      sensibleW,
      latentW,
      hourly,
      peakHourW: hourly[peakHour],
      peakHour,
      requiredPeakCapacityW: peakSF,
    },
    options: { ...ctx.options, statements: statements(ctx.options) },
    site: {
      pressurePa: ctx.site.pressurePa,
      outdoorHumRatio: out.humRatio,
      outdoorEnthalpyJkg: out.enthalpyJkg,
      outdoorDensityKgM3: out.densityKgM3,
      outdoorRHPct: relativeHumidityPct(out),
    },
    engineVersion: ENGINE_VERSION,
  };
}
