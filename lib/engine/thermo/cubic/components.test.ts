import { describe, expect, it } from "vitest";
import { COMPONENTS, type ComponentId } from "./components";
import { newPhaseEval, PengRobinsonMixture, VAPOUR_ROOT, LIQUID_ROOT } from "./peng-robinson";
import { solveFixedBeta } from "./vle";
// Reference: CoolProp 8.0.0 with each component's reference Helmholtz equation (named in
// components.ts), via fixtures/gen_fixtures.py.
import fx from "./fixtures/coolprop-8.0.0.json";

const NAMES: Record<keyof typeof fx.components, ComponentId> = {
  R32: "R32",
  R125: "R125",
  R134a: "R134a",
  R143a: "R143a",
  R1234yf: "R1234yf",
  "R1234ze(E)": "R1234zeE",
};
const ENTRIES = Object.entries(fx.components) as [keyof typeof fx.components, (typeof fx.components)["R32"]][];

describe.each(ENTRIES)("PR pure component %s against its reference equation", (name, ref) => {
  const comp = COMPONENTS[NAMES[name]];
  const mix = new PengRobinsonMixture([comp], [[0]]);

  it("saturation pressure within 0.1 % from −60 °C to 0.95·Tc", () => {
    for (const r of ref.sat.filter((s) => s.tK >= 213 && s.tK <= 0.95 * ref.tcK)) {
      const sol = solveFixedBeta(mix, [1], "T", r.tK, 0);
      expect(Math.abs(sol.pPa / r.pPa - 1)).toBeLessThan(1e-3);
    }
  });

  it("latent heat within 4.5 % (R32 is the worst, 4.2 %) and saturated-liquid density within 5 % from −60 °C to 0.85·Tc", () => {
    for (const r of ref.sat.filter((s) => s.tK >= 213 && s.tK <= 0.85 * ref.tcK)) {
      const sol = solveFixedBeta(mix, [1], "T", r.tK, 0);
      expect(Math.abs((sol.vapour.hJmol - sol.liquid.hJmol) / r.hLVJmol - 1)).toBeLessThan(0.045);
      expect(Math.abs(1 / sol.liquid.vM3Mol / r.rhoLmolM3 - 1)).toBeLessThan(0.05);
    }
  });

  it("ideal-gas cp0 polynomial within 0.4 % over 150…520 K", () => {
    for (const r of ref.cp0) {
      expect(Math.abs(mix.cp0(r.tK, [1]) / r.cp0JmolK - 1)).toBeLessThan(0.004);
    }
    expect(comp.tcK).toBeCloseTo(ref.tcK, 2);
    expect(comp.molarMassKgMol).toBeCloseTo(ref.molarMassKgMol, 6);
  });
});

describe("thermodynamic consistency of the PR evaluation (a mixture, both roots)", () => {
  // Identities, not data: cp = (∂h/∂T)_P, T(∂s/∂T)_P = cp, and (∂h/∂P)_T = v − T(∂v/∂T)_P.
  const ids: ComponentId[] = ["R32", "R125", "R1234yf", "R134a"];
  const mix = new PengRobinsonMixture(
    ids.map((i) => COMPONENTS[i]),
    [
      [0, 0.001, 0.04, 0],
      [0.001, 0, 0.002, 0.001],
      [0.04, 0.002, 0, 0.018],
      [0, 0.001, 0.018, 0],
    ],
    [
      [0, 0.015, 0.01, 0.001],
      [0.015, 0, 0.001, 0.004],
      [0.01, 0.001, 0, 0.002],
      [0.001, 0.004, 0.002, 0],
    ],
  );
  const x = [0.45, 0.2, 0.18, 0.17];
  it.each([
    [250, 1e5, VAPOUR_ROOT],
    [330, 15e5, VAPOUR_ROOT],
    [230, 10e5, LIQUID_ROOT],
    [290, 20e5, LIQUID_ROOT],
  ] as const)("T = %d K, P = %d Pa", (t, p, root) => {
    const a = newPhaseEval();
    const b = newPhaseEval();
    const dT = 1e-3;
    mix.evaluate(t - dT, p, x, root, false, a);
    mix.evaluate(t + dT, p, x, root, false, b);
    const e = newPhaseEval();
    mix.evaluate(t, p, x, root, false, e);
    expect(Math.abs((b.hJmol - a.hJmol) / (2 * dT) / e.cpJmolK - 1)).toBeLessThan(1e-6);
    expect(Math.abs((t * (b.sJmolK - a.sJmolK)) / (2 * dT) / e.cpJmolK - 1)).toBeLessThan(1e-6);
    const dvdT = (b.vM3Mol - a.vM3Mol) / (2 * dT);
    const dP = p * 1e-5;
    mix.evaluate(t, p - dP, x, root, false, a);
    mix.evaluate(t, p + dP, x, root, false, b);
    const dhdP = (b.hJmol - a.hJmol) / (2 * dP);
    expect(Math.abs(dhdP - (e.vM3Mol - t * dvdT))).toBeLessThan(1e-6 * Math.abs(e.vM3Mol) + 1e-9);
  });
});

describe("cp is continuous where a component crosses its critical temperature", () => {
  // Smoothness, not data: alpha switches form at each component's Tc (see setTemperature).
  const ids: ComponentId[] = ["R125", "R143a", "R134a"];
  const mix = new PengRobinsonMixture(ids.map((i) => COMPONENTS[i]), [[0, 0, 0], [0, 0, 0], [0, 0, 0]]);
  it.each(ids)("vapour cp across Tc of %s at 10 bar", (id) => {
    const tc = COMPONENTS[id].tcK;
    const a = newPhaseEval();
    const b = newPhaseEval();
    mix.evaluate(tc - 1e-3, 10e5, [0.44, 0.52, 0.04], VAPOUR_ROOT, false, a);
    mix.evaluate(tc + 1e-3, 10e5, [0.44, 0.52, 0.04], VAPOUR_ROOT, false, b);
    expect(Math.abs(b.cpJmolK / a.cpJmolK - 1)).toBeLessThan(1e-4);
  });
});
