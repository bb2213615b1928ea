/**
 * Pressure–enthalpy chart data for any `Fluid`: the saturation dome (liquid and vapour lines
 * up to just below the critical point), isotherms and isentropes, sampled on a logarithmic
 * pressure axis. IIR reference state, like every state of the module. For zeotropic blends
 * the liquid line is the bubble line and the vapour line the dew line; inside their dome an
 * isotherm runs from its dew point to its bubble point (drawn straight between the two).
 */
import { ThermoRangeError, type Fluid } from "./types";

export interface PhPoint {
  hJkg: number;
  pPa: number;
}

export interface PhChartOptions {
  /** Lowest pressure of the chart, Pa (default: saturation pressure at −60 °C or the fluid's lowest temperature). */
  pMinPa?: number;
  /** Highest pressure, Pa (default: twice the critical pressure, capped at the fluid's range). */
  pMaxPa?: number;
  /** Isotherm temperatures, K (default: every 20 °C across the fluid's range). */
  isothermsK?: number[];
  /** Isentrope entropies, J/(kg·K) (default: eight values across the vapour side of the dome). */
  isentropesJkgK?: number[];
  /** Points per isotherm / isentrope (default 60). */
  pointsPerLine?: number;
  /** Points per dome line (default 80). */
  domePoints?: number;
}

export interface PhChart {
  fluidId: string;
  referenceState: "IIR";
  pMinPa: number;
  pMaxPa: number;
  dome: { liquid: PhPoint[]; vapour: PhPoint[] };
  isotherms: { tK: number; points: PhPoint[] }[];
  isentropes: { sJkgK: number; points: PhPoint[] }[];
}

function logSpace(a: number, b: number, n: number): number[] {
  const la = Math.log(a),
    lb = Math.log(b);
  return Array.from({ length: n }, (_, i) => Math.exp(la + ((lb - la) * i) / (n - 1)));
}

/** Runs fn, returning undefined where the model reports the input out of its range. */
function inRange<T>(fn: () => T): T | undefined {
  try {
    return fn();
  } catch (e) {
    if (e instanceof ThermoRangeError) return undefined;
    throw e;
  }
}

/** Highest pressure at which the model still gives a saturation state (bisection in ln P). */
function topOfDome(fluid: Fluid, pLow: number): number {
  let lo = pLow,
    hi = fluid.meta.criticalPressurePa;
  if (inRange(() => fluid.saturationAtP(hi))) return hi;
  for (let i = 0; i < 40; i++) {
    const mid = Math.sqrt(lo * hi);
    if (inRange(() => fluid.saturationAtP(mid))) lo = mid;
    else hi = mid;
  }
  return lo;
}

/**
 * P–h chart data: saturation dome, isotherms and isentropes (points ordered by rising
 * pressure; the dome lines end at the highest pressure the model saturates, within a
 * fraction of a percent of the critical pressure).
 */
export function phChart(fluid: Fluid, opts: PhChartOptions = {}): PhChart {
  const tLow = Math.max(fluid.range.tMinK, 213.15);
  const pMin = opts.pMinPa ?? fluid.saturationAtT(tLow).pDewPa;
  const pMax = opts.pMaxPa ?? Math.min(fluid.range.pMaxPa, 2 * fluid.meta.criticalPressurePa);
  const n = opts.pointsPerLine ?? 60;
  const nd = opts.domePoints ?? 80;
  const pTop = Math.min(topOfDome(fluid, pMin), pMax);

  const liquid: PhPoint[] = [];
  const vapour: PhPoint[] = [];
  for (const p of logSpace(pMin, pTop, nd)) {
    const s = inRange(() => fluid.saturationAtP(p));
    if (!s) continue;
    liquid.push({ hJkg: s.liquid.hJkg, pPa: p });
    vapour.push({ hJkg: s.vapour.hJkg, pPa: p });
  }

  const tHigh = Math.min(fluid.range.tMaxK, 273.15 + 160);
  const isothermsK =
    opts.isothermsK ??
    Array.from({ length: 20 }, (_, i) => 273.15 - 60 + 20 * i).filter((t) => t >= fluid.range.tMinK && t <= tHigh);
  const pressures = logSpace(pMin, pMax, n);

  const isotherms = isothermsK.map((tK) => {
    const sDew = inRange(() => fluid.saturationAtT(tK, "dew"));
    const sBub = inRange(() => fluid.saturationAtT(tK, "bubble"));
    const points: PhPoint[] = [];
    const single = (p: number) => {
      const st = inRange(() => fluid.statePT(p, tK));
      if (st) points.push({ hJkg: st.hJkg, pPa: p });
    };
    if (sDew && sBub) {
      for (const p of pressures) if (p < sDew.pDewPa) single(p);
      points.push({ hJkg: sDew.vapour.hJkg, pPa: sDew.pDewPa });
      points.push({ hJkg: sBub.liquid.hJkg, pPa: sBub.pBubblePa });
      for (const p of pressures) if (p > sBub.pBubblePa) single(p);
    } else {
      for (const p of pressures) single(p);
    }
    return { tK, points };
  });

  let isentropesJkgK = opts.isentropesJkgK;
  if (!isentropesJkgK) {
    const sHi = fluid.saturationAtP(pMin).vapour.sJkgK;
    const sLo = fluid.saturationAtP(pTop).vapour.sJkgK;
    const step = (sHi - sLo) / 7;
    isentropesJkgK = Array.from({ length: 8 }, (_, i) => Math.round((sLo + step * i) / 10) * 10);
  }
  const isentropes = isentropesJkgK.map((sJkgK) => {
    const points: PhPoint[] = [];
    for (const p of pressures) {
      const st = inRange(() => fluid.statePS(p, sJkgK));
      if (st) points.push({ hJkg: st.hJkg, pPa: p });
    }
    return { sJkgK, points };
  });

  return {
    fluidId: fluid.meta.id,
    referenceState: "IIR",
    pMinPa: pMin,
    pMaxPa: pMax,
    dome: { liquid, vapour },
    isotherms,
    isentropes,
  };
}
