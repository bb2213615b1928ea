import { COMPONENTS, type ComponentId } from "@/lib/engine/thermo/cubic/components";
import { PengRobinsonMixture } from "@/lib/engine/thermo/cubic/peng-robinson";
import { solveFixedBeta } from "@/lib/engine/thermo/cubic/vle";
import { BLEND_DEFS, kij } from "@/lib/engine/thermo/cubic/blend-defs";
import fx from "@/lib/engine/thermo/cubic/fixtures/coolprop-8.0.0.json";
for (const id of ["R448A", "R449A"] as const) {
  const def = BLEND_DEFS[id];
  const ids = Object.keys(def.massFractions) as ComponentId[];
  const comps = ids.map((i) => COMPONENTS[i]);
  const w = ids.map((i) => def.massFractions[i]!);
  const nm = w.map((wi, k) => wi / comps[k].molarMassKgMol);
  const s = nm.reduce((a, b) => a + b);
  const z = nm.map((v) => v / s);
  const rows = (fx.blends as any)[id].satT.filter((r: any) => r.tK > 222 && r.tK < 324);
  const obj = (k: number) => {
    const K = (a: ComponentId, b: ComponentId) => (a === b ? 0 : (a === "R32" && b === "R1234yf") || (b === "R32" && a === "R1234yf") ? k : kij(a, b)[0]);
    const mix = new PengRobinsonMixture(comps, ids.map((a) => ids.map((b) => K(a, b))), ids.map((a) => ids.map((b) => (a === b ? 0 : kij(a, b)[1]))));
    let sum = 0, worst = 0;
    let gb: any, gd: any;
    for (const r of rows) {
      gb = solveFixedBeta(mix, z, "T", r.tK, 0, gb);
      gd = solveFixedBeta(mix, z, "T", r.tK, 1, gd);
      const e1 = Math.log(gb.pPa / r.bubble.pPa), e2 = Math.log(gd.pPa / r.dew.pPa);
      sum += e1 * e1 + e2 * e2; worst = Math.max(worst, Math.abs(e1), Math.abs(e2));
    }
    return { sum, worst };
  };
  let lo = 0.0, hi = 0.06; const g = (Math.sqrt(5) - 1) / 2;
  for (let it = 0; it < 30; it++) { const m1 = hi - g * (hi - lo), m2 = lo + g * (hi - lo); if (obj(m1).sum < obj(m2).sum) hi = m2; else lo = m1; }
  const k = (lo + hi) / 2;
  console.log(id, k.toFixed(5), obj(k).worst);
}
