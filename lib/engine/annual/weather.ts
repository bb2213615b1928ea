/**
 * The weather year the annual engine runs on, its validation, its calendar (weekday, month,
 * day of each hour) and the sine-day year built from monthly means.
 */
import { LoadInputError, fail } from "../loads/errors";
import psychrolib from "psychrolib";
import { monthlyClimateSchema, type MonthlyClimate, type MonthlyClimateRaw } from "./schema";

psychrolib.SetUnitSystem(psychrolib.SI);

export interface WeatherYear {
  source: { kind: "file" | "monthly" | "demo"; label: string };
  year: number;
  /** Weekday of 1 January: 0 = Monday … 6 = Sunday. */
  startWeekday: number;
  /** Hourly dry bulb, °C, 8760 or 8784 values from 1 January 00:00. */
  dryBulbC: number[];
  /** Hourly relative humidity, %, same length. */
  rhPct: number[];
  /** Barometric pressure, Pa; default the site's standard-atmosphere pressure. */
  pressurePa?: number;
}

export const HOURS_NORMAL = 8760;
export const HOURS_LEAP = 8784;

const DAYS_IN_MONTH = [31, 28, 31, 30, 31, 30, 31, 31, 30, 31, 30, 31];
export const MONTH_NAMES = ["Jan", "Feb", "Mar", "Apr", "May", "Jun", "Jul", "Aug", "Sep", "Oct", "Nov", "Dec"];

/** Per hour: month (0–11), day of month (1–31), weekday (0 = Monday), hour of day. */
export interface Calendar {
  hours: number;
  month: Uint8Array;
  dayOfMonth: Uint8Array;
  weekday: Uint8Array;
  /** Day of year (0-based) of each hour. */
  day: Uint16Array;
  /** Days in the year. */
  days: number;
  /** Days in each month of this year. */
  daysInMonth: number[];
}

export function calendarOf(hours: number, startWeekday: number): Calendar {
  const leap = hours === HOURS_LEAP;
  const dim = DAYS_IN_MONTH.map((d, m) => (m === 1 && leap ? 29 : d));
  const month = new Uint8Array(hours);
  const dayOfMonth = new Uint8Array(hours);
  const weekday = new Uint8Array(hours);
  const day = new Uint16Array(hours);
  let m = 0;
  let dom = 1;
  for (let d = 0; d < hours / 24; d++) {
    for (let h = 0; h < 24; h++) {
      const i = d * 24 + h;
      month[i] = m;
      dayOfMonth[i] = dom;
      weekday[i] = (startWeekday + d) % 7;
      day[i] = d;
    }
    dom++;
    if (dom > dim[m]) {
      dom = 1;
      m++;
    }
  }
  return { hours, month, dayOfMonth, weekday, day, days: hours / 24, daysInMonth: dim };
}

/** "Mar 14 (Tue) 15:00" for an hour of the year. */
export function hourLabel(cal: Calendar, i: number): string {
  const wd = ["Mon", "Tue", "Wed", "Thu", "Fri", "Sat", "Sun"][cal.weekday[i]];
  return `${MONTH_NAMES[cal.month[i]]} ${cal.dayOfMonth[i]} (${wd}) ${String(i % 24).padStart(2, "0")}:00`;
}

/**
 * Checks a weather year; throws LoadInputError naming the field (`weather.dryBulbC.4521`)
 * and the allowed range. 8760 or 8784 hours; dry bulb −70…60 °C; RH 0…100 %.
 */
export function validateWeatherYear(w: WeatherYear): void {
  const issues: { field: string; message: string }[] = [];
  const n = w.dryBulbC?.length;
  if (n !== HOURS_NORMAL && n !== HOURS_LEAP)
    issues.push({ field: "weather.dryBulbC", message: `must hold 8760 or 8784 hourly values (got ${n ?? "none"})` });
  if (w.rhPct?.length !== n) issues.push({ field: "weather.rhPct", message: `must hold as many values as dryBulbC (${n}), got ${w.rhPct?.length ?? "none"}` });
  if (!(Number.isInteger(w.startWeekday) && w.startWeekday >= 0 && w.startWeekday <= 6))
    issues.push({ field: "weather.startWeekday", message: "must be a whole number between 0 (Monday) and 6 (Sunday)" });
  if (!(Number.isInteger(w.year) && w.year >= 1800 && w.year <= 2300)) issues.push({ field: "weather.year", message: "must be a whole number between 1800 and 2300" });
  if (w.pressurePa !== undefined && !(w.pressurePa >= 50_000 && w.pressurePa <= 110_000))
    issues.push({ field: "weather.pressurePa", message: "must be between 50000 and 110000 Pa" });
  if (issues.length) throw new LoadInputError(issues);
  for (let i = 0; i < n; i++) {
    const t = w.dryBulbC[i];
    if (!(t >= -70 && t <= 60)) fail(`weather.dryBulbC.${i}`, `must be between −70 and 60 °C (got ${t}) at hour ${i}`);
    const rh = w.rhPct[i];
    if (!(rh >= 0 && rh <= 100)) fail(`weather.rhPct.${i}`, `must be between 0 and 100 % (got ${rh}) at hour ${i}`);
  }
}

/** A constant-weather year (every hour the same dry bulb and RH): the engine's design-hour check. */
export function constantYear(dryBulbC: number, rhPct: number, opts: { year?: number; startWeekday?: number; hours?: number } = {}): WeatherYear {
  const n = opts.hours ?? HOURS_NORMAL;
  return {
    source: { kind: "monthly", label: `constant ${dryBulbC} °C / ${rhPct} % RH` },
    year: opts.year ?? 2025,
    startWeekday: opts.startWeekday ?? 0,
    dryBulbC: new Array<number>(n).fill(dryBulbC),
    rhPct: new Array<number>(n).fill(rhPct),
  };
}

/** Weekday of 1 January (0 = Monday) by Zeller's congruence for the Gregorian calendar. */
export function weekdayOfJan1(year: number): number {
  const y = year - 1;
  // Zeller for 1 January, treated as the 13th month of the previous year.
  const k = y % 100;
  const j = Math.floor(y / 100);
  const h = (1 + Math.floor((13 * 14) / 5) + k + Math.floor(k / 4) + Math.floor(j / 4) + 5 * j) % 7; // 0 = Saturday
  return (h + 5) % 7;
}

export function isLeapYear(year: number): boolean {
  return (year % 4 === 0 && year % 100 !== 0) || year % 400 === 0;
}

/** Parses a monthly climate, throwing LoadInputError with `monthly.<field>.<month>` paths. */
export function parseMonthlyClimate(raw: MonthlyClimateRaw | unknown): MonthlyClimate {
  const r = monthlyClimateSchema.safeParse(raw);
  if (!r.success)
    throw new LoadInputError(r.error.issues.map((i) => ({ field: ["monthly", ...i.path.map(String)].join("."), message: i.message })));
  return r.data;
}

/**
 * A year of hours from monthly means — the sine-day method, an approximation stated with the
 * result: every day of a month has the month's mean dry bulb and mean daily range, the dry
 * bulb following a cosine through the day, T(h) = T_mean + (R/2)·cos(2π(h − 15)/24) (lowest
 * at 03:00, highest at 15:00); the moisture content is held through the day at the month's
 * mean RH at the mean dry bulb (constant vapour pressure), so RH rises at night and falls by
 * day, capped at 100 %. Saturation pressures by psychrolib (Hyland–Wexler, ASHRAE
 * Handbook—Fundamentals). Each month's mean dry bulb is exactly the input. Day-to-day
 * weather (fronts, heat waves) is not represented, so peaks are milder than in a real year.
 */
export function sineDayYear(monthlyRaw: MonthlyClimate | MonthlyClimateRaw, year: number): WeatherYear {
  const monthly = parseMonthlyClimate(monthlyRaw);
  if (!(Number.isInteger(year) && year >= 1800 && year <= 2300)) fail("year", "must be a whole number between 1800 and 2300");
  const hours = isLeapYear(year) ? HOURS_LEAP : HOURS_NORMAL;
  const cal = calendarOf(hours, weekdayOfJan1(year));
  const dryBulbC = new Array<number>(hours);
  const rhPct = new Array<number>(hours);
  const shape = Array.from({ length: 24 }, (_, h) => 0.5 * Math.cos((2 * Math.PI * (h - 15)) / 24));
  const pv = monthly.meanDryBulbC.map((t, m) => (monthly.meanRhPct[m] / 100) * psychrolib.GetSatVapPres(t));
  for (let i = 0; i < hours; i++) {
    const m = cal.month[i];
    const t = monthly.meanDryBulbC[m] + monthly.dailyRangeK[m] * shape[i % 24];
    dryBulbC[i] = t;
    rhPct[i] = Math.min(100, (100 * pv[m]) / psychrolib.GetSatVapPres(t));
  }
  return {
    source: { kind: "monthly", label: `${monthly.label} — sine-day approximation from monthly means (not measured hourly data)` },
    year,
    startWeekday: cal.weekday[0],
    dryBulbC,
    rhPct,
  };
}
