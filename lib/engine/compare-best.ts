/** Marking the best figure of each row of the options comparison (no engine imports: browser-light). */

/** Which way is better for each compared row. */
export const BETTER: Record<string, "lower" | "higher"> = {
  installedRefrigerationW: "lower",
  designElectricalW: "lower",
  peakKWe: "lower",
  annualKWh: "lower",
  annualCost: "lower",
  seasonalCOP: "higher",
  chargeKg: "lower",
  gwpWeighted: "lower",
  tewiDirect: "lower",
  tewiIndirect: "lower",
  tewiTotal: "lower",
  codeAidRatio: "lower",
};

/** Index of the best value (ties: all of them), ignoring missing values; none when every plant has the same figure. */
export function bestOf(values: (number | undefined)[], better: "lower" | "higher"): number[] {
  const present = values.filter((v): v is number => v !== undefined && Number.isFinite(v));
  if (present.length < 2) return [];
  const best = better === "lower" ? Math.min(...present) : Math.max(...present);
  const tol = Math.abs(best) * 1e-9;
  const at = values.flatMap((v, i) => (v !== undefined && Number.isFinite(v) && Math.abs(v - best) <= tol ? [i] : []));
  return at.length === present.length ? [] : at;
}
