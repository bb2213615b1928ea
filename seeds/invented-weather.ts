/**
 * Invented hourly weather years, made deterministically from an invented monthly climate: the
 * demo site's year (shipped with the demo seed only) and test fixtures. Fictional data: they
 * describe no real place and no real year.
 *
 * Method (ours, for plausible-looking data only): each day's mean dry bulb follows the monthly
 * means (linear between mid-month points) plus a day-to-day anomaly (a first-order
 * autoregressive series, φ = 0.7, σ = 3 K, from a seeded generator); each hour follows a
 * cosine with its minimum at 03:00 and maximum at 15:00 over the month's mean daily range; the
 * dew point follows the month's mean dry bulb and mean relative humidity, so the humidity falls
 * in the afternoon as real air does.
 */
import { rhPctFromDewPoint } from "../lib/engine/loads/psychro";

export interface InventedMonth {
  /** Monthly mean dry bulb, °C. */
  meanDryBulbC: number;
  /** Mean daily range (max − min), K. */
  dailyRangeK: number;
  /** Mean relative humidity, %. */
  meanRhPct: number;
}

/** The invented climate of the invented Harrowfield site: temperate inland, design day 32 °C. */
export const HARROWFIELD_CLIMATE: InventedMonth[] = [
  { meanDryBulbC: 2.4, dailyRangeK: 6.0, meanRhPct: 86 },
  { meanDryBulbC: 3.1, dailyRangeK: 7.0, meanRhPct: 83 },
  { meanDryBulbC: 6.0, dailyRangeK: 8.5, meanRhPct: 78 },
  { meanDryBulbC: 9.2, dailyRangeK: 10.0, meanRhPct: 72 },
  { meanDryBulbC: 13.1, dailyRangeK: 11.0, meanRhPct: 70 },
  { meanDryBulbC: 16.5, dailyRangeK: 11.5, meanRhPct: 69 },
  { meanDryBulbC: 19.0, dailyRangeK: 12.0, meanRhPct: 67 },
  { meanDryBulbC: 18.6, dailyRangeK: 11.5, meanRhPct: 70 },
  { meanDryBulbC: 15.4, dailyRangeK: 10.0, meanRhPct: 75 },
  { meanDryBulbC: 11.2, dailyRangeK: 8.0, meanRhPct: 81 },
  { meanDryBulbC: 6.3, dailyRangeK: 6.5, meanRhPct: 86 },
  { meanDryBulbC: 3.2, dailyRangeK: 5.5, meanRhPct: 88 },
];

const DAYS = [31, 28, 31, 30, 31, 30, 31, 31, 30, 31, 30, 31];

/** A small seeded generator (mulberry32), so a year is the same on every machine. */
function mulberry32(seed: number) {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** Dew point (°C) of air at a dry bulb and relative humidity, by bisection on psychrolib's RH(t, t_dp). */
function dewPointC(tempC: number, rhPct: number): number {
  let lo = tempC - 60;
  let hi = tempC;
  for (let i = 0; i < 60; i++) {
    const mid = (lo + hi) / 2;
    if (rhPctFromDewPoint(tempC, mid) < rhPct) lo = mid;
    else hi = mid;
  }
  return (lo + hi) / 2;
}

export function inventYear(climate: InventedMonth[], opts: { year?: number; seed?: number } = {}): { year: number; dryBulbC: number[]; rhPct: number[] } {
  const year = opts.year ?? 2025;
  const leap = (year % 4 === 0 && year % 100 !== 0) || year % 400 === 0;
  const days = DAYS.map((d, m) => d + (leap && m === 1 ? 1 : 0));
  const rand = mulberry32(opts.seed ?? 1);
  const gauss = () => Math.sqrt(-2 * Math.log(1 - rand())) * Math.cos(2 * Math.PI * rand());
  const mid = days.map((d, m) => days.slice(0, m).reduce((a, b) => a + b, 0) + d / 2);
  const total = days.reduce((a, b) => a + b, 0);
  const dews = climate.map((c) => dewPointC(c.meanDryBulbC, c.meanRhPct));
  /** Linear between mid-month points, wrapping round the year. */
  const at = (dayMid: number, pick: (m: number) => number) => {
    let j = mid.findIndex((x) => x > dayMid);
    if (j === -1) j = 12;
    const i = j - 1;
    const [x0, v0] = i < 0 ? [mid[11] - total, pick(11)] : [mid[i], pick(i)];
    const [x1, v1] = j > 11 ? [mid[0] + total, pick(0)] : [mid[j], pick(j)];
    return v0 + ((v1 - v0) * (dayMid - x0)) / (x1 - x0);
  };
  const dryBulbC: number[] = [];
  const rhPct: number[] = [];
  let anomaly = 0;
  let day = 0;
  for (let m = 0; m < 12; m++) {
    for (let d = 0; d < days[m]; d++, day++) {
      anomaly = 0.7 * anomaly + Math.sqrt(1 - 0.49) * 3.0 * gauss();
      const mean = at(day + 0.5, (i) => climate[i].meanDryBulbC) + anomaly;
      const range = at(day + 0.5, (i) => climate[i].dailyRangeK) * (0.75 + 0.5 * rand());
      const dew = at(day + 0.5, (i) => dews[i]) + 0.6 * anomaly + 0.8 * gauss();
      for (let h = 0; h < 24; h++) {
        // minimum near 03:00, maximum near 15:00
        const t = mean + (range / 2) * Math.cos((2 * Math.PI * (h - 15)) / 24);
        const rh = Math.min(100, rhPctFromDewPoint(t, Math.min(dew, t)));
        dryBulbC.push(Math.round(t * 10) / 10);
        rhPct.push(Math.round(rh * 10) / 10);
      }
    }
  }
  return { year, dryBulbC, rhPct };
}

/** The year as the plain hourly CSV Rimeplan reads (ISO timestamps, °C, %). */
export function yearToCsv(y: { year: number; dryBulbC: number[]; rhPct: number[] }): string {
  const lines = ["Timestamp,Dry bulb [°C],Relative humidity [%]"];
  const start = Date.UTC(y.year, 0, 1);
  for (let i = 0; i < y.dryBulbC.length; i++) {
    const ts = new Date(start + i * 3_600_000).toISOString().slice(0, 16).replace("T", " ");
    lines.push(`${ts},${y.dryBulbC[i].toFixed(1)},${y.rhPct[i].toFixed(1)}`);
  }
  return lines.join("\n") + "\n";
}
