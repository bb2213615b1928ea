/**
 * What a circuit's p–h chart draws: the refrigerant's saturation dome (closed over the
 * critical region), a few isotherms, and the cycle's state points joined in their order
 * (1→2→…→n→1), which traces the single-stage loop and, for two-stage, the low and high loops
 * through the intercooler. SI: h in J/kg, p in Pa (absolute), T in K.
 */
import type { CircuitResult } from "@/lib/engine/plant/circuit";
import { phChart, type Fluid } from "@/lib/engine/thermo";

export interface PhLine {
  points: { h: number; p: number }[];
  label?: string;
}

export interface CircuitChart {
  fluidId: string;
  pMinPa: number;
  pMaxPa: number;
  dome: PhLine;
  isotherms: PhLine[];
  cycle: { id: string; label: string; h: number; p: number; tK: number; s: number }[];
}

export function circuitChart(fluid: Fluid, c: CircuitResult): CircuitChart {
  const ps = c.statePoints.map((p) => p.pPa);
  const pMinPa = Math.max(Math.min(...ps) * 0.5, fluid.saturationAtT(Math.max(fluid.range.tMinK, 193.15)).pDewPa);
  const pMaxPa = Math.min(Math.max(...ps) * 1.8, fluid.range.pMaxPa);
  const ch = phChart(fluid, { pMinPa, pMaxPa, pointsPerLine: 40, domePoints: 60 });
  const dome = [...ch.dome.liquid, ...[...ch.dome.vapour].reverse()].map((q) => ({ h: q.hJkg, p: q.pPa }));
  return {
    fluidId: ch.fluidId,
    pMinPa,
    pMaxPa,
    dome: { points: dome },
    isotherms: ch.isotherms.map((i) => ({ label: `${Math.round(i.tK - 273.15)} °C`, points: i.points.map((q) => ({ h: q.hJkg, p: q.pPa })) })),
    cycle: c.statePoints.map((p) => ({ id: p.id, label: p.label, h: p.hJkg, p: p.pPa, tK: p.tK, s: p.sJkgK })),
  };
}

/** 1-2-5 ticks per decade between a and b (log axis). */
export function logTicks(a: number, b: number): number[] {
  const out: number[] = [];
  for (let e = Math.floor(Math.log10(a)); e <= Math.ceil(Math.log10(b)); e++)
    for (const m of [1, 2, 5]) {
      const v = m * 10 ** e;
      if (v >= a && v <= b) out.push(v);
    }
  return out;
}
