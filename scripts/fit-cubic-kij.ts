/**
 * Fits the Peng–Robinson binary interaction parameters k_ij of the blend components to the
 * binary bubble pressures in lib/engine/thermo/cubic/fixtures/coolprop-8.0.0.json (CoolProp's
 * multi-fluid mixture model with published binary parameters), k_ij(T) linear in T: golden-section
 * search on the squared ln(P_model/P_ref) at each temperature, then a straight line in T. Prints the k_ij table used in cubic/blends.ts.
 * Run: npx tsx scripts/fit-cubic-kij.ts
 */
import { COMPONENTS, type ComponentId } from "@/lib/engine/thermo/cubic/components";
import { PengRobinsonMixture } from "@/lib/engine/thermo/cubic/peng-robinson";
import { solveFixedBeta } from "@/lib/engine/thermo/cubic/vle";
import fx from "@/lib/engine/thermo/cubic/fixtures/coolprop-8.0.0.json";

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
