/**
 * Fits the Peng–Robinson binary interaction parameters k_ij of the blend components to the
 * binary bubble pressures in lib/engine/thermo/cubic/fixtures/coolprop-8.0.0.json (CoolProp's
 * multi-fluid mixture model with published binary parameters), k_ij(T) linear in T: golden-section
 * search on the squared ln(P_model/P_ref) at each temperature, then a straight line in T.
 * A second stage refits R32/R1234yf to the R448A and R449A bubble/dew pressures (blend overrides). Prints the k_ij table used in cubic/blend-defs.ts.
 * Run: npx tsx scripts/fit-cubic-kij.ts
 */
import { COMPONENTS, type ComponentId } from "@/lib/engine/thermo/cubic/components";
import { PengRobinsonMixture } from "@/lib/engine/thermo/cubic/peng-robinson";
import { solveFixedBeta } from "@/lib/engine/thermo/cubic/vle";
import fx from "@/lib/engine/thermo/cubic/fixtures/coolprop-8.0.0.json";
import { BLEND_DEFS, kij } from "@/lib/engine/thermo/cubic/blend-defs";

const ids: Record<string, ComponentId> = { R32: "R32", R125: "R125", R134a: "R134a", R143a: "R143a", R1234yf: "R1234yf", "R1234ze(E)": "R1234zeE" };

type Row = { tK: number; x1: number; pPa: number };

function objective(a: ComponentId, b: ComponentId, k: number, rows: Row[], slope = 0) {
  const mix = new PengRobinsonMixture([COMPONENTS[a], COMPONENTS[b]], [[0, k], [k, 0]], [[0, slope], [slope, 0]]);
  let sum = 0;
  let worst = 0;
  for (const r of rows) {
    const sol = solveFixedBeta(mix, [r.x1, 1 - r.x1], "T", r.tK, 0);
    const d = Math.log(sol.pPa / r.pPa);
    sum += d * d;
    worst = Math.max(worst, Math.abs(d));
  }
  return { sum, worst };
}

function golden(f: (k: number) => number): number {
  let lo = -0.08;
  let hi = 0.08;
  const g = (Math.sqrt(5) - 1) / 2;
  for (let it = 0; it < 40; it++) {
    const m1 = hi - g * (hi - lo);
    const m2 = lo + g * (hi - lo);
    if (f(m1) < f(m2)) hi = m2;
    else lo = m1;
  }
  return 0.5 * (lo + hi);
}

// k_ij(T) = k + slope·(T − 280 K)/100 K: fit k at each temperature of the data, then a
// straight line through those k values.
for (const [pair, rows] of Object.entries(fx.binaries) as [string, Row[]][]) {
  const [a, b] = pair.split("/").map((s) => ids[s]);
  const temps = [...new Set(rows.map((r) => r.tK))];
  const pts = temps.map((t) => {
    const sub = rows.filter((r) => r.tK === t);
    return { u: (t - 280) / 100, k: golden((k) => objective(a, b, k, sub).sum) };
  });
  const mu = pts.reduce((s, p) => s + p.u, 0) / pts.length;
  const mk = pts.reduce((s, p) => s + p.k, 0) / pts.length;
  const slope = pts.reduce((s, p) => s + (p.u - mu) * (p.k - mk), 0) / pts.reduce((s, p) => s + (p.u - mu) ** 2, 0);
  const k = mk - slope * mu;
  const r0 = objective(a, b, 0, rows);
  const r = objective(a, b, k, rows, slope);
  console.log(`${a}/${b}: kij = ${k.toFixed(5)} slope = ${slope.toFixed(5)}  worst |dP/P| ${(r.worst * 100).toFixed(2)} % (kij = 0: ${(r0.worst * 100).toFixed(2)} %)`);
}

// Second stage: in R448A and R449A the binary-fitted R32/R1234yf value leaves a systematic
// offset (about −0.6 %) on the blend's pressures; refit that one k (at 280 K, slope kept) to the
// blend's own bubble and dew pressures, −50…+50 °C. These are the `kijOverride` values.
for (const id of ["R448A", "R449A"] as const) {
  const def = BLEND_DEFS[id];
  const cids = Object.keys(def.massFractions) as ComponentId[];
  const comps = cids.map((i) => COMPONENTS[i]);
  const moles = cids.map((i, k) => (def.massFractions[i] ?? 0) / comps[k].molarMassKgMol);
  const total = moles.reduce((a, b) => a + b, 0);
  const z = moles.map((v) => v / total);
  const rows = fx.blends[id].satT.filter((r) => r.tK > 222 && r.tK < 324);
  const isPair = (a: ComponentId, b: ComponentId) => (a === "R32" && b === "R1234yf") || (a === "R1234yf" && b === "R32");
  const blendObjective = (k: number) => {
    const mix = new PengRobinsonMixture(
      comps,
      cids.map((a) => cids.map((b) => (a === b ? 0 : isPair(a, b) ? k : kij(a, b)[0]))),
      cids.map((a) => cids.map((b) => (a === b ? 0 : kij(a, b)[1]))),
    );
    let sum = 0;
    let worst = 0;
    for (const r of rows) {
      const eb = Math.log(solveFixedBeta(mix, z, "T", r.tK, 0).pPa / r.bubble!.pPa);
      const ed = Math.log(solveFixedBeta(mix, z, "T", r.tK, 1).pPa / r.dew!.pPa);
      sum += eb * eb + ed * ed;
      worst = Math.max(worst, Math.abs(eb), Math.abs(ed));
    }
    return { sum, worst };
  };
  const k = golden((v) => blendObjective(v).sum);
  console.log(`${id} override R32/R1234yf: kij = ${k.toFixed(5)}  worst |dP/P| ${(blendObjective(k).worst * 100).toFixed(2)} %`);
}
