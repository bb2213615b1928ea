import type { Commodity, RespirationData } from "./commodities";
import { fail } from "./errors";

/** Range the Becker–Fricke fits are used over here; the fitted data span about 0–27 °C. */
export const RESPIRATION_FIT_MAX_C = 30;

/**
 * Heat of respiration, W/kg. Becker & Fricke fit `W/kg = (10.7·f/3600)·(9T/5 + 32)^g`
 * (ASHRAE Handbook—Refrigeration, from memory), or log-linear interpolation in a tabulated
 * set of points. Temperatures outside the data (below the initial freezing point, above the
 * fit range, or outside a table) throw rather than extrapolate.
 */
export function respirationWPerKg(commodity: Commodity, tempC: number, field: string): number {
  const data: RespirationData | undefined = commodity.respiration;
  if (!data) fail(field, `no respiration data for "${commodity.id}" in the library`);
  if (data.kind === "fg") {
    if (tempC < commodity.initialFreezingPointC || tempC > RESPIRATION_FIT_MAX_C) {
      fail(
        field,
        `respiration of ${commodity.id} is defined from ${commodity.initialFreezingPointC} to ${RESPIRATION_FIT_MAX_C} °C (room at ${tempC} °C)`,
      );
    }
    return ((10.7 * data.f) / 3600) * Math.pow((9 * tempC) / 5 + 32, data.g);
  }
  const pts = data.points;
  const lo = pts[0][0];
  const hi = pts[pts.length - 1][0];
  if (tempC < lo || tempC > hi) fail(field, `respiration of ${commodity.id} is tabulated from ${lo} to ${hi} °C (room at ${tempC} °C)`);
  for (let i = 1; i < pts.length; i++) {
    const [t0, q0] = pts[i - 1];
    const [t1, q1] = pts[i];
    if (tempC <= t1) {
      const u = (tempC - t0) / (t1 - t0);
      return Math.exp(Math.log(q0) + u * (Math.log(q1) - Math.log(q0))) / 1000;
    }
  }
  return pts[pts.length - 1][1] / 1000;
}
