/**
 * Evaporators per room: design TD, evaporating temperature, unit count, airflow, fan power
 * and defrost heat, and the fixed point that feeds fan and defrost heat back into the room
 * load they serve (DOMAIN.md §1 "internal" loads and §2 "Q = UA·TD").
 */
import { PlantError } from "./errors";
import type { DefrostType, EvaporatorInput } from "./schema";

/** What the evaporator sizing needs to know about a room (a subset of the ledger's room). */
export interface RoomForSizing {
  id: string;
  setPointC: number;
  rhPct: number;
  lengthM: number;
  widthM: number;
}

export interface EvaporatorSizing {
  id: string;
  tag: string;
  roomId: string;
  circuitId: string;
  tdK: number;
  evaporatingC: number;
  units: number;
  /** Refrigeration duty of this evaporator item (all its units), W. */
  dutyW: number;
  dutyPerUnitW: number;
  airflowM3s: number;
  /** Fan motor electrical input of all units, W (all of it ends up as heat in the room). */
  fanPowerW: number;
  fanHoursPerDay: number;
  defrost: {
    type: DefrostType;
    /** Electric heater, or the equivalent hot-gas / water heat, of all units, W. */
    heaterW: number;
    minutesPerDefrost: number;
    defrostsPerDay: number;
    fractionToRoom: number;
    /** Electric heater load for the schedule (0 unless electric), W. */
    electricW: number;
  };
  feed: EvaporatorInput["feed"];
}

/** The two ledger inputs the plant replaces, in the ledger's own shape. */
export interface RoomFeedback {
  evaporatorFans: { powerW: number; hoursPerDay: number };
  defrost: { heaterW: number; minutesPerDefrost: number; defrostsPerDay: number; fractionToRoom: number };
}

/** Standard air: R = 287.05 J/(kg·K), cp = 1006 J/(kg·K) (ASHRAE Fundamentals, psychrometrics). */
const R_AIR = 287.05;
const CP_AIR = 1006;
const P_STD = 101_325;
/** Air throw of one unit cooler along the room, m (common practice 20–30 m). */
const THROW_M = 25;

/**
 * Default design TD by humidity class (DOMAIN.md §2, common practice): about 4–6 K for
 * high-RH produce (≥ 90 % → 5 K, 85–90 % → 6 K), 5–7 K freezers (6 K), 6–8 K general
 * chilled (7 K).
 */
export function defaultTdK(setPointC: number, rhPct: number): number {
  if (rhPct >= 90) return 5;
  if (rhPct >= 85) return 6;
  if (setPointC < -5) return 6;
  return 7;
}

/**
 * Default defrost by room temperature (common practice): rooms at +2 °C and above defrost
 * off-cycle with room air; colder rooms need heat, electric by default. Heater about 0.6 W
 * per W of cooling duty, 4 defrosts a day, 25 min electric / 15 min hot gas / 10 min water,
 * 40 % of the heat ending up in the room (DOMAIN.md §1: a third to a half).
 */
export function defaultDefrost(
  setPointC: number,
  d: EvaporatorInput["defrost"],
): { type: DefrostType; heaterWPerWDuty: number; minutesPerDefrost: number; defrostsPerDay: number; fractionToRoom: number } {
  const type: DefrostType = d?.type ?? (setPointC >= 2 ? "off-cycle" : "electric");
  const minutes = { electric: 25, "hot-gas": 15, water: 10, "off-cycle": 30 }[type];
  return {
    type,
    heaterWPerWDuty: d?.heaterWPerWDuty ?? (type === "off-cycle" ? 0 : 0.6),
    minutesPerDefrost: d?.minutesPerDefrost ?? minutes,
    defrostsPerDay: d?.defrostsPerDay ?? (setPointC >= 2 ? 2 : 4),
    fractionToRoom: type === "off-cycle" ? 0 : (d?.fractionToRoom ?? (type === "water" ? 0.3 : 0.4)),
  };
}

/**
 * Sizes the evaporators of one room for a design duty. The duty is shared equally among
 * the room's evaporator items. Airflow from the coil's sensible balance
 * V = Q / (ρ·cp·ΔT_air) with ΔT_air = fraction × TD, taking the whole duty as sensible
 * (conservative: more air, more fan heat); fan input P = V·Δp / η (fan laws, any HVAC
 * handbook). Units default to max(⌈Q / max unit duty⌉, ⌈longest side / 25 m throw⌉).
 */
export function sizeRoomEvaporators(room: RoomForSizing, evaporators: EvaporatorInput[], designDutyW: number): EvaporatorSizing[] {
  if (evaporators.length === 0) return [];
  const share = Math.max(0, designDutyW) / evaporators.length;
  const roomTK = room.setPointC + 273.15;
  const rhoAir = P_STD / (R_AIR * roomTK);
  const throwUnits = Math.ceil(Math.max(room.lengthM, room.widthM) / THROW_M / evaporators.length);
  return evaporators.map((e) => {
    const tdK = e.tdK ?? defaultTdK(room.setPointC, room.rhPct);
    const units = e.units ?? Math.max(1, Math.ceil(share / e.maxUnitDutyW), throwUnits);
    const airflowM3s = share / (rhoAir * CP_AIR * e.fan.airDropFractionOfTd * tdK);
    const fanPowerW = (airflowM3s * e.fan.staticPressurePa) / e.fan.efficiency;
    const df = defaultDefrost(room.setPointC, e.defrost);
    const heaterW = df.heaterWPerWDuty * share;
    // Fans stop while a heated defrost runs; an off-cycle defrost keeps them moving room air.
    const downH = df.type === "off-cycle" ? 0 : (df.minutesPerDefrost * df.defrostsPerDay) / 60;
    return {
      id: e.id,
      tag: e.tag,
      roomId: e.roomId,
      circuitId: e.circuitId,
      tdK,
      evaporatingC: room.setPointC - tdK,
      units,
      dutyW: share,
      dutyPerUnitW: share / units,
      airflowM3s,
      fanPowerW,
      fanHoursPerDay: Math.max(0, 24 - downH),
      defrost: {
        type: df.type,
        heaterW,
        minutesPerDefrost: df.minutesPerDefrost,
        defrostsPerDay: df.defrostsPerDay,
        fractionToRoom: df.fractionToRoom,
        electricW: df.type === "electric" ? heaterW : 0,
      },
      feed: e.feed,
    };
  });
}

/**
 * Folds a room's evaporators into the ledger's single fan and defrost entries so that the
 * daily energy is exact: fan hours are the power-weighted mean, and the defrost minutes and
 * room fraction are chosen so heaterW × minutes/60 × defrosts × fraction equals the sum
 * over the evaporators.
 */
export function roomFeedback(sized: EvaporatorSizing[]): RoomFeedback {
  let fanW = 0;
  let fanWh = 0;
  let heaterW = 0;
  let heatWmin = 0;
  let roomWmin = 0;
  let perDay = 0;
  let minutes = 0;
  for (const s of sized) {
    fanW += s.fanPowerW;
    fanWh += s.fanPowerW * s.fanHoursPerDay;
    heaterW += s.defrost.heaterW;
    const e = s.defrost.heaterW * s.defrost.minutesPerDefrost * s.defrost.defrostsPerDay;
    heatWmin += e;
    roomWmin += e * s.defrost.fractionToRoom;
    perDay = Math.max(perDay, s.defrost.defrostsPerDay);
    minutes = Math.max(minutes, s.defrost.minutesPerDefrost);
  }
  const energetic = heaterW > 0 && perDay > 0 && heatWmin > 0;
  return {
    // Clamped: the weighted mean of 24 h values can round to a hair above 24.
    evaporatorFans: { powerW: fanW, hoursPerDay: fanW > 0 ? Math.min(24, fanWh / fanW) : 24 },
    defrost: {
      heaterW,
      minutesPerDefrost: energetic ? heatWmin / (heaterW * perDay) : minutes,
      defrostsPerDay: perDay,
      fractionToRoom: energetic ? roomWmin / heatWmin : 0,
    },
  };
}

export interface FixedPointResult {
  valueW: number;
  iterations: number;
  /** |x − f(x)| / x at the solution. */
  residual: number;
}

/**
 * Solves x = f(x) for a room's design duty, where f adds the fan and defrost heat of
 * evaporators sized for x. Secant steps on g(x) = f(x) − x: the map is affine in x when the
 * unit count is fixed, so the secant lands on the answer in one step and the next call
 * confirms it; a plain step is taken when the secant degenerates. Convergence means
 * |f(x) − x| ≤ tol·max(x, 1 W). A map whose slope is 1 or more (fan and defrost heat
 * growing as fast as the duty it serves) has no finite answer and throws NO_CONVERGENCE.
 * With `predict` giving the affine map's answer from f(0), two calls usually suffice.
 */
export function solveDutyFixedPoint(
  f: (dutyW: number) => number,
  opts: {
    tolerance: number;
    maxIterations: number;
    field: string;
    /** A predicted fixed point from f(0) (e.g. from the map's known slope); tried first. */
    predict?: (f0: number) => number | undefined;
  },
): FixedPointResult {
  const check = (v: number, x: number) => {
    if (!Number.isFinite(v) || v < 0)
      throw new PlantError("NO_CONVERGENCE", `room load is ${v} W at a trial duty of ${x} W`, opts.field);
    return v;
  };
  let x0 = 0;
  let f0 = check(f(x0), x0);
  const guess = opts.predict?.(f0);
  let x1 = guess !== undefined && Number.isFinite(guess) && guess >= f0 ? guess : f0;
  let iterations = 1;
  for (; iterations < opts.maxIterations; iterations++) {
    const f1 = check(f(x1), x1);
    const residual = Math.abs(f1 - x1);
    if (residual <= opts.tolerance * Math.max(x1, 1)) return { valueW: x1, iterations: iterations + 1, residual: residual / Math.max(x1, 1) };
    const g0 = f0 - x0;
    const g1 = f1 - x1;
    const slope = (g1 - g0) / (x1 - x0);
    let x2 = slope !== 0 && Number.isFinite(slope) ? x1 - g1 / slope : f1;
    if (slope >= 0 && g1 > 0)
      throw new PlantError(
        "NO_CONVERGENCE",
        "fan and defrost heat grow at least as fast as the duty they serve: no finite design duty",
        opts.field,
      );
    if (!(x2 > 0)) x2 = f1;
    x0 = x1;
    f0 = f1;
    x1 = x2;
  }
  throw new PlantError(
    "NO_CONVERGENCE",
    `fan/defrost fixed point not converged in ${opts.maxIterations} iterations (tolerance ${opts.tolerance})`,
    opts.field,
  );
}

/**
 * Daily fan and defrost energy fed back into the room per W of design duty, Wh/(day·W):
 * Σ fan W·h + heater W·(min/60)·defrosts·fraction for evaporators sized for 1 W. The
 * sizing is linear in duty, so this is the exact slope of the feedback energy.
 */
export function feedbackWhPerDayPerW(room: RoomForSizing, evaporators: EvaporatorInput[]): number {
  let wh = 0;
  for (const s of sizeRoomEvaporators(room, evaporators, 1)) {
    wh += s.fanPowerW * s.fanHoursPerDay;
    wh += s.defrost.heaterW * (s.defrost.minutesPerDefrost / 60) * s.defrost.defrostsPerDay * s.defrost.fractionToRoom;
  }
  return wh;
}
