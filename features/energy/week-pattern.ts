/**
 * A week of hourly multipliers (7 days × 24 hours, 0 = Monday) from a simple pattern — open
 * hours on weekdays with one multiplier, another outside them, and a factor for Saturday and
 * Sunday — and back. Pure; used by the tariff and operation form.
 */
export type Week = number[][];
export const DAYS = ["Monday", "Tuesday", "Wednesday", "Thursday", "Friday", "Saturday", "Sunday"];

/** A week of multipliers from a simple pattern: open hours on weekdays, factors for closed hours and the weekend. */
export function weekFromPattern(p: { from: number; to: number; open: number; closed: number; sat: number; sun: number }): Week {
  return DAYS.map((_, d) => {
    const day = d < 5 ? 1 : d === 5 ? p.sat : p.sun;
    return Array.from({ length: 24 }, (_, h) => Math.round((h >= p.from && h < p.to ? p.open : p.closed) * day * 1000) / 1000);
  });
}

/** The pattern a week was made from, or null when it is a custom week the pattern cannot express. */
export function patternFromWeek(w: Week): { from: number; to: number; open: number; closed: number; sat: number; sun: number } | null {
  const mon = w[0];
  const open = Math.max(...mon);
  const closed = Math.min(...mon);
  const from = mon.indexOf(open);
  let to = from;
  while (to < 24 && mon[to] === open) to++;
  const sat = open > 0 ? Math.max(...w[5]) / open : 0;
  const sun = open > 0 ? Math.max(...w[6]) / open : 0;
  const p = { from: open === closed ? 0 : from, to: open === closed ? 24 : to, open, closed, sat: Math.round(sat * 1000) / 1000, sun: Math.round(sun * 1000) / 1000 };
  const again = weekFromPattern(p);
  return again.every((row, d) => row.every((v, h) => Math.abs(v - w[d][h]) < 1e-3)) ? p : null;
}

