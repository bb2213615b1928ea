import { COMPONENTS, type ComponentId } from "@/lib/engine/thermo/cubic/components";
import { PengRobinsonMixture } from "@/lib/engine/thermo/cubic/peng-robinson";
import { solveFixedBeta } from "@/lib/engine/thermo/cubic/vle";
import { BLEND_DEFS, kij } from "@/lib/engine/thermo/cubic/blend-defs";
import fx from "@/lib/engine/thermo/cubic/fixtures/coolprop-8.0.0.json";
for (const [id, def] of Object.entries(BLEND_DEFS)) {
  const ids = Object.keys(def.massFractions) as ComponentId[];
  const comps = ids.map((i) => COMPONENTS[i]);
  const w = ids.map((i) => def.massFractions[i]!);
  const nm = w.map((wi, k) => wi / comps[k].molarMassKgMol);
  const s = nm.reduce((a, b) => a + b);
  const z = nm.map((v) => v / s);
  const mix = new PengRobinsonMixture(comps, ids.map((a) => ids.map((b) => (a === b ? 0 : kij(a, b)[0]))), ids.map((a) => ids.map((b) => (a === b ? 0 : kij(a, b)[1]))));
  const rows = (fx.blends as any)[id].satT;
  let line = id + "\n";
  let gb: any, gd: any;
  for (const r of rows) {
    if (r.tK < 223 || r.tK > 324) continue;
    gb = solveFixedBeta(mix, z, "T", r.tK, 0, gb);
    gd = solveFixedBeta(mix, z, "T", r.tK, 1, gd);
    line += `  ${(r.tK - 273.15).toFixed(0)}: b ${((gb.pPa / r.bubble.pPa - 1) * 100).toFixed(2)}% d ${((gd.pPa / r.dew.pPa - 1) * 100).toFixed(2)}%\n`;
  }
  console.log(line);
}
