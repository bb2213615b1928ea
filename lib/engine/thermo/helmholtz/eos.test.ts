import { describe, expect, it } from "vitest";
import { data as co2 } from "../fluids/r744";
import { data as r290 } from "../fluids/r290";
import { data as nh3 } from "../fluids/r717";
import { HelmholtzEos, newAlpha } from "./eos";

// Internal consistency of the analytic derivatives (no external values involved): each one
// against a central finite difference of the lower derivative, including the Span–Wagner
// non-analytic terms close to the critical point, the Gaussian terms and the ideal part.
describe("Helmholtz evaluator derivatives", () => {
  const points: [number, number][] = [
    [0.05, 1.4],
    [0.9, 0.98],
    [1.1, 1.02],
    [0.7, 1.05],
    [2.2, 1.3],
    [1.6, 0.85],
  ];
  for (const [name, d] of [
    ["R744", co2],
    ["R290", r290],
    ["R717", nh3],
  ] as const) {
    it(`${name}: δ- and τ-derivatives agree with finite differences`, () => {
      const eos = new HelmholtzEos(d.eos);
      const at = (delta: number, tau: number) => ({ ...eos.evaluate(delta, tau, newAlpha()) });
      for (const [delta, tau] of points) {
        const h = 1e-6;
        const a = at(delta, tau);
        const dp = at(delta * (1 + h), tau);
        const dm = at(delta * (1 - h), tau);
        const tp = at(delta, tau * (1 + h));
        const tm = at(delta, tau * (1 - h));
        const ddelta = (x: number, y: number) => (x - y) / (2 * h); // δ·∂/∂δ
        const close = (num: number, ana: number) =>
          expect(Math.abs(num - ana)).toBeLessThan(1e-6 * (Math.abs(ana) + Math.abs(a.ar) + 1));
        close(ddelta(dp.ar, dm.ar), a.dAr);
        // δ²αʳ_δδ = δ∂(δαʳ_δ)/∂δ − δαʳ_δ
        close(ddelta(dp.dAr, dm.dAr) - a.dAr, a.ddAr);
        close(ddelta(tp.ar, tm.ar), a.tAr);
        close(ddelta(tp.tAr, tm.tAr) - a.tAr, a.ttAr);
        close(ddelta(tp.dAr, tm.dAr), a.dtAr);
        close(ddelta(tp.a0, tm.a0), a.tA0);
        close(ddelta(tp.tA0, tm.tA0) - a.tA0, a.ttA0);
      }
    });
  }
});
