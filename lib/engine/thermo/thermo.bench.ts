import type { BenchCase } from "@/scripts/bench-harness";
import { loadFluid } from "./index";
import type { FluidId } from "./types";

const C = 273.15;

/** Saturation at T (tabulated Maxwell solution) and (P,h) / (P,s) flashes per pure fluid. */
export default async function cases(): Promise<BenchCase[]> {
  const out: BenchCase[] = [];
  const setups: [FluidId, number, number][] = [
    // fluid, evaporating °C, condensing (or gas-cooler) pressure Pa
    ["R717", -30, 1.35e6],
    ["R744", -30, 100e5],
    ["R134a", -10, 1.0e6],
    ["R290", -10, 1.37e6],
  ];
  for (const [id, tEvapC, pHigh] of setups) {
    const f = await loadFluid(id);
    const te = C + tEvapC;
    const sat = f.saturationAtT(te);
    const s1 = sat.vapour.sJkgK;
    const h2 = f.statePS(pHigh, s1).hJkg;
    const hMix = 0.5 * (sat.liquid.hJkg + sat.vapour.hJkg);
    let k = 0;
    out.push(
      {
        name: `${id} saturationAtT`,
        fn: () => f.saturationAtT(te + (k++ & 63) * 0.05),
        targetMedianUs: 2,
      },
      {
        name: `${id} statePH superheated/supercritical discharge`,
        fn: () => f.statePH(pHigh, h2 + (k++ & 63) * 10),
        targetMedianUs: 20,
      },
      {
        name: `${id} statePH two-phase (after expansion)`,
        fn: () => f.statePH(sat.pDewPa, hMix + (k++ & 63) * 10),
        targetMedianUs: 20,
      },
      {
        name: `${id} statePS isentropic discharge`,
        fn: () => f.statePS(pHigh, s1 + (k++ & 63) * 0.01),
        targetMedianUs: 20,
      },
    );
  }
  return out;
}
