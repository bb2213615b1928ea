import type { BenchCase } from "@/scripts/bench-harness";
import { createBlend, BLEND_IDS } from "./index";
import { HelmholtzBlend } from "./blend";
import { BLEND_DEFS } from "./blend-defs";

const C = 273.15;

/** Saturation at T (table), PH/PS flashes (two-phase from the table, single-phase on the mixture equation), the full VLE solve and the table build. */
export default [
  ...BLEND_IDS.flatMap((id): BenchCase[] => {
    const f = createBlend(id);
    const te = C - 10;
    const sat = f.saturationAtT(te);
    const pe = sat.pDewPa;
    const pc = f.saturationAtT(C + 40).pDewPa;
    const s1 = f.statePT(pe, te + 5).sJkgK;
    const hMix = 0.5 * (sat.liquid.hJkg + sat.vapour.hJkg);
    const hVap = f.statePT(pe, te + 20).hJkg;
    let k = 0;
    return [
      { name: `${id} saturationAtT (dew)`, fn: () => f.saturationAtT(te + (k++ & 63) * 0.05), targetMedianUs: 2 },
      { name: `${id} saturationAtT (mean)`, fn: () => f.saturationAtT(te + (k++ & 63) * 0.05, "mean"), targetMedianUs: 2 },
      { name: `${id} statePH two-phase`, fn: () => f.statePH(pe, hMix + (k++ & 63) * 100), targetMedianUs: 20 },
      { name: `${id} statePH vapour`, fn: () => f.statePH(pe, hVap + (k++ & 63) * 100), targetMedianUs: 20 },
      { name: `${id} statePS discharge`, fn: () => f.statePS(pc, s1 + (k++ & 63) * 0.1), targetMedianUs: 20 },
    ];
  }),
  {
    name: "R448A full VLE dew point at T (no table)",
    fn: (() => {
      const b = createBlend("R448A") as HelmholtzBlend;
      let k = 0;
      return () => b.exactSaturationAtT(C - 10 + (k++ & 63) * 0.05, 1);
    })(),
  },
  // first load of each blend (the tables): the canvas worker and the server pay this once per blend
  ...BLEND_IDS.map(
    (id): BenchCase => ({
      name: `${id} model build (tables, first creation)`,
      fn: () => new HelmholtzBlend(BLEND_DEFS[id]),
      samples: 5,
      batch: 1,
      targetMedianUs: 150_000,
    }),
  ),
] satisfies BenchCase[];
