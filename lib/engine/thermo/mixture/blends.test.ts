import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { singleStageCycle } from "../../plant/cycle";
import type { CompressorInput } from "../../plant/schema";
import { ThermoRangeError, type FluidId, type TempConvention } from "../types";
import { getBlend, HelmholtzBlend } from "./blend";
import { componentAsPureFluid, type ComponentId } from "./component";
import { COMPONENTS } from "./components";
import { blendMeta, BLEND_IDS, createBlend } from "./index";
import { LIQUID_ROOT, MixtureModel, newPhaseEval, VAPOUR_ROOT } from "./kunz-wagner";
import { solveFixedBeta } from "./vle";
import { HelmholtzEos, newAlpha } from "../helmholtz/eos";
import { LEMMON_2003 } from "./fixtures/lemmon2003";

// Where every number below comes from: fixtures/README.md (published tables and papers, values
// from memory marked so, and the reference states stored in the public CoolProp fluid files).

const C = 273.15;
const rel = (a: number, b: number) => Math.abs(a / b - 1);

describe("blend components: reference equations against their papers and fluid files", () => {
  // CoolProp/CoolProp dev/fluids/<fluid>.json, STATES.triple_liquid / triple_vapor (or the
  // EOS entry's ptriple, rhoLtriple, rhoVtriple), computed by CoolProp from the same equations.
  const triple: [ComponentId, number, number, number, number | null][] = [
    // id, p Pa, ρ' mol/m³, ρ'' mol/m³, h'' − h' J/mol
    ["R32", 47.999893876059375, 27473.344990002282, 0.04235254461811375, 23114.565057462252 + 992.1972213356988],
    ["R125", 2914.046009081991, 14086.490950189836, 2.038105466009394, null],
    ["R143a", 1074.9454424528105, 15832.104698511093, 0.8036165079079269, 26858.701856601056 - 4413.832298902538],
    ["R1234yf", 31507.55885, 11633.08448763467, 17.58443653644202, null],
  ];
  it.each(triple)("%s: triple-point saturation as the reference file states", (id, p, rl, rv, hfg) => {
    const c = COMPONENTS[id];
    const f = componentAsPureFluid(c);
    const M = c.eos.molarMassKgMol;
    const s = f.saturationAtT(c.tTripleK);
    // R1234yf's stored triple-point densities carry 5 significant digits of agreement only.
    const tol = id === "R1234yf" ? 1e-4 : 1e-7;
    expect(rel(s.pDewPa, p)).toBeLessThan(tol);
    expect(rel(s.liquid.densityKgM3 / M, rl)).toBeLessThan(tol);
    expect(rel(s.vapour.densityKgM3 / M, rv)).toBeLessThan(tol);
    if (hfg !== null) expect(rel((s.vapour.hJkg - s.liquid.hJkg) * M, hfg)).toBeLessThan(1e-7);
  });

  it("normal boiling points as the papers give them", () => {
    // Tillner-Roth & Yokozeki (1997) 221.499 K; Lemmon & Jacobsen (2005) 225.06 K; Lemmon &
    // Jacobsen (2000) 225.909 K; Richter, McLinden & Lemmon (2011) 243.665 K (from memory).
    const nbp: [ComponentId, number, number][] = [
      ["R32", 221.499, 0.002],
      ["R125", 225.06, 0.01],
      ["R143a", 225.909, 0.002],
      ["R1234yf", 243.665, 0.002],
    ];
    for (const [id, t, tol] of nbp) {
      const f = componentAsPureFluid(COMPONENTS[id]);
      expect(Math.abs(f.saturationAtP(101325).tDewK - t)).toBeLessThan(tol);
    }
  });

  it("R32 at 0 °C against the ASHRAE Handbook—Fundamentals R32 table", () => {
    // ASHRAE Handbook—Fundamentals, refrigerant tables, R32 (from memory): 0 °C 813.1 kPa,
    // h_fg 315.3 kJ/kg, saturated liquid 1055.3 kg/m³.
    const s = componentAsPureFluid(COMPONENTS.R32).saturationAtT(C);
    expect(rel(s.pDewPa, 813.1e3)).toBeLessThan(0.002);
    expect(rel(s.vapour.hJkg - s.liquid.hJkg, 315.3e3)).toBeLessThan(0.002);
    expect(rel(s.liquid.densityKgM3, 1055.3)).toBeLessThan(0.002);
  });
});

/** A model over all seven components, for the composition-derivative checks. */
const ALL: ComponentId[] = ["R32", "R125", "R1234yf", "R134a", "R1234zeE", "R744", "R143a"];
const model = new MixtureModel(ALL.map((i) => COMPONENTS[i]));
const X = [0.25, 0.15, 0.15, 0.2, 0.08, 0.05, 0.12];

describe("mixture model: internal consistency", () => {
  it.each([
    ["liquid", LIQUID_ROOT, 260, 2e6],
    ["vapour", VAPOUR_ROOT, 300, 4e5],
    ["dense vapour", VAPOUR_ROOT, 360, 3e6],
  ] as const)("analytic ln φ equals the numerical n-derivative of n·α^r (%s)", (_, root, T, P) => {
    const e = newPhaseEval();
    model.evaluate(T, P, X, root, true, e);
    const lnPhi = Array.from(model.lnPhi);
    const V = 1 / e.rhoMolM3; // volume of one mole
    const nAr = (n: number[]) => {
      const N = n.reduce((a, b) => a + b, 0);
      return N * model.alphaR(N / V, T, n.map((v) => v / N));
    };
    for (let i = 0; i < X.length; i++) {
      const h = 1e-6;
      const up = X.slice();
      const dn = X.slice();
      up[i] += h;
      dn[i] -= h;
      const numeric = (nAr(up) - nAr(dn)) / (2 * h);
      // ∂(nα^r)/∂n_i = ln φ_i + ln Z
      expect(Math.abs(lnPhi[i] + Math.log(e.z) - numeric)).toBeLessThan(1e-7);
    }
    // the pressure the density was solved for
    expect(rel(model.pressure(e.rhoMolM3, T, X), P)).toBeLessThan(1e-10);
  });

  it("Euler and Gibbs–Duhem: Σx ln φ = g^r/RT, Σx d ln φ = 0 at constant T and P", () => {
    for (const [root, T, P] of [
      [LIQUID_ROOT, 250, 1.5e6],
      [VAPOUR_ROOT, 320, 5e5],
    ] as const) {
      const e = newPhaseEval();
      model.evaluate(T, P, X, root, true, e);
      const lnPhi = Array.from(model.lnPhi);
      const ar = model.alphaR(e.rhoMolM3, T, X);
      const sum = X.reduce((s, x, i) => s + x * lnPhi[i], 0);
      expect(Math.abs(sum - (ar + e.z - 1 - Math.log(e.z)))).toBeLessThan(1e-12);
      // move composition along e_0 − e_3 (mole fractions still sum to 1)
      const h = 1e-5;
      const at = (d: number) => {
        const x = X.slice();
        x[0] += d;
        x[3] -= d;
        const ev = newPhaseEval();
        ev.rhoMolM3 = e.rhoMolM3;
        ev.root = root;
        model.evaluate(T, P, x, root, true, ev);
        return Array.from(model.lnPhi);
      };
      const up = at(h);
      const dn = at(-h);
      const gd = X.reduce((s, x, i) => s + (x * (up[i] - dn[i])) / (2 * h), 0);
      expect(Math.abs(gd)).toBeLessThan(1e-7);
    }
  });

  it("x → pure component: the mixture equals the component's own equation", () => {
    for (const [k, id] of ALL.entries()) {
      const f = componentAsPureFluid(COMPONENTS[id], 420, 20e6);
      const x = ALL.map((_, j) => (j === k ? 1 : 0));
      const T = Math.min(0.8 * COMPONENTS[id].eos.tReducingK, 270);
      const P = f.saturationAtT(T).pDewPa;
      for (const [root, p] of [
        [LIQUID_ROOT, 1.5 * P],
        [VAPOUR_ROOT, 0.5 * P],
      ] as const) {
        const e = newPhaseEval();
        model.evaluate(T, p, x, root, false, e);
        const st = f.statePT(p, T);
        const M = COMPONENTS[id].eos.molarMassKgMol;
        expect(rel(e.rhoMolM3 * M, st.densityKgM3)).toBeLessThan(1e-10);
        expect(rel(e.cpJmolK / M, st.cpJkgK!)).toBeLessThan(1e-10);
        expect(rel(e.speedOfSoundMs, st.speedOfSoundMs!)).toBeLessThan(1e-10);
      }
    }
  });

  it("an infinitely dilute binary boils at the solvent's vapour pressure", () => {
    // R32 in R1234yf at a mole fraction of 1e-7 (the Akasaka 2013 pair with its departure function)
    const bin = new MixtureModel([COMPONENTS.R1234yf, COMPONENTS.R32]);
    const pure = componentAsPureFluid(COMPONENTS.R1234yf);
    for (const T of [240, 280, 320]) {
      const sol = solveFixedBeta(bin, [1 - 1e-7, 1e-7], "T", T, 0);
      expect(rel(sol.pPa, pure.saturationAtT(T).pDewPa)).toBeLessThan(1e-5);
    }
  });

  it("ln φ, h, s do not depend on the order of the components", () => {
    const rev = new MixtureModel(ALL.slice().reverse().map((i) => COMPONENTS[i]));
    const xr = X.slice().reverse();
    const a = newPhaseEval();
    const b = newPhaseEval();
    model.evaluate(280, 1e6, X, LIQUID_ROOT, true, a);
    const la = Array.from(model.lnPhi);
    rev.evaluate(280, 1e6, xr, LIQUID_ROOT, true, b);
    const lb = Array.from(rev.lnPhi).reverse();
    expect(rel(a.rhoMolM3, b.rhoMolM3)).toBeLessThan(1e-12);
    expect(Math.abs(a.hJmol - b.hJmol)).toBeLessThan(1e-6);
    for (let i = 0; i < X.length; i++) expect(Math.abs(la[i] - lb[i])).toBeLessThan(1e-11);
  });
});

describe.each(BLEND_IDS)("%s on the mixture model", (id) => {
  const f = getBlend(id);

  it("equal fugacities and the material balance at the solved bubble and dew points", () => {
    for (const tC of [-45, -10, 20, 45]) {
      for (const beta of [0, 1] as const) {
        const sol = solveFixedBeta(f.mix, f.z, "T", tC + C, beta);
        const e = newPhaseEval();
        f.mix.evaluate(sol.tK, sol.pPa, sol.x, LIQUID_ROOT, true, e);
        const lnL = Array.from(f.mix.lnPhi);
        f.mix.evaluate(sol.tK, sol.pPa, sol.y, VAPOUR_ROOT, true, e);
        for (let i = 0; i < f.z.length; i++) {
          const fl = Math.log(sol.x[i]) + lnL[i];
          const fv = Math.log(sol.y[i]) + f.mix.lnPhi[i];
          expect(Math.abs(fl - fv)).toBeLessThan(1e-9);
          const zi = (1 - beta) * sol.x[i] + beta * sol.y[i];
          expect(Math.abs(zi - f.z[i])).toBeLessThan(1e-12);
        }
        // two distinct phases
        expect(sol.liquid.rhoMolM3).toBeGreaterThan(3 * sol.vapour.rhoMolM3);
      }
    }
  });

  it("tables against the full VLE solve: p within 1e-6, h within 0.5 J/kg, (P,h) temperature within 1 mK", () => {
    fc.assert(
      fc.property(fc.double({ min: -55, max: 50, noNaN: true }), fc.constantFrom(0 as const, 1 as const), (tC, beta) => {
        const tK = tC + C;
        const exact = f.exactSaturationAtT(tK, beta);
        const sat = f.saturationAtT(tK, beta === 0 ? "bubble" : "dew");
        const ph = beta === 0 ? sat.liquid : sat.vapour;
        expect(rel(ph.pPa, exact.pPa)).toBeLessThan(1e-6);
        expect(Math.abs(ph.hJkg - exact.hJkg)).toBeLessThan(0.5);
        expect(rel(ph.densityKgM3, exact.densityKgM3)).toBeLessThan(1e-5);
      }),
      { numRuns: 40, seed: 42 },
    );
    fc.assert(
      fc.property(fc.double({ min: 0.9e5, max: 24e5, noNaN: true }), fc.double({ min: 0.02, max: 0.98, noNaN: true }), (p, beta) => {
        const ex = f.exactTwoPhase(p, beta);
        const st = f.statePH(p, ex.hJkg);
        expect(st.phase).toBe("two-phase");
        expect(Math.abs(st.tK - ex.tK)).toBeLessThan(1e-3);
        expect(Math.abs(st.quality! - ex.quality)).toBeLessThan(1e-5);
        expect(Math.abs(f.statePS(p, ex.sJkgK).tK - ex.tK)).toBeLessThan(1e-3);
      }),
      { numRuns: 40, seed: 42 },
    );
  });

  it("two-phase energy balance: h of the mixture is the phases' h weighted by the vapour fraction", () => {
    for (const p of [1.5e5, 8e5, 20e5]) {
      const sol = solveFixedBeta(f.mix, f.z, "P", p, 0.4);
      const bub = solveFixedBeta(f.mix, f.z, "P", p, 0);
      const mL = f.mix.molarMass(sol.x);
      const mV = f.mix.molarMass(sol.y);
      const m = 0.6 * mL + 0.4 * mV;
      const mz = f.mix.molarMass(f.z);
      expect(Math.abs(m - mz)).toBeLessThan(1e-15);
      // per kg of blend, relative to the bubble-point liquid (the reference offsets cancel)
      const dhPhases = (0.6 * sol.liquid.hJmol + 0.4 * sol.vapour.hJmol) / m - bub.liquid.hJmol / mz;
      const dhTable = f.exactTwoPhase(p, 0.4).hJkg - f.saturationAtP(p).liquid.hJkg;
      expect(Math.abs(dhPhases - dhTable)).toBeLessThan(0.5);
      const ex = f.exactTwoPhase(p, 0.4);
      const sat = f.saturationAtP(p);
      expect(ex.tK).toBeGreaterThan(sat.tBubbleK - 1e-6);
      expect(ex.tK).toBeLessThan(sat.tDewK + 1e-6);
      expect(Math.abs(ex.quality - (0.4 * mV) / m)).toBeLessThan(1e-12);
    }
  });

  it("cp and the speed of sound agree with numerical derivatives of h and P", () => {
    for (const [p, tK] of [
      [3e5, C + 20],
      [15e5, C + 80],
      [20e5, C - 20],
    ]) {
      const s = f.statePT(p, tK);
      const dT = 1e-3;
      const cpNum = (f.statePT(p, tK + dT).hJkg - f.statePT(p, tK - dT).hJkg) / (2 * dT);
      expect(rel(s.cpJkgK!, cpNum)).toBeLessThan(1e-6);
      // w² = (∂P/∂ρ)_s
      const dp = p * 1e-5;
      const up = f.statePS(p + dp, s.sJkgK);
      const dn = f.statePS(p - dp, s.sJkgK);
      const w2 = (2 * dp) / (up.densityKgM3 - dn.densityKgM3);
      expect(rel(s.speedOfSoundMs!, Math.sqrt(w2))).toBeLessThan(1e-5);
    }
  });

  it("flashes invert statePT: (P,h) and (P,s) give back T in liquid and vapour", () => {
    fc.assert(
      fc.property(fc.double({ min: 1e5, max: 25e5, noNaN: true }), fc.double({ min: 1, max: 80, noNaN: true }), fc.boolean(), (p, dT, vap) => {
        const sat = f.saturationAtP(p);
        const tK = vap ? sat.tDewK + dT : Math.max(f.range.tMinK, sat.tBubbleK - dT);
        const st = f.statePT(p, tK);
        expect(st.phase).toBe(vap ? "vapour" : "liquid");
        expect(Math.abs(f.statePH(p, st.hJkg).tK - tK)).toBeLessThan(1e-6);
        expect(Math.abs(f.statePS(p, st.sJkgK).tK - tK)).toBeLessThan(1e-6);
      }),
      { numRuns: 60, seed: 42 },
    );
  });

  it("IIR reference: bubble-point liquid at 0 °C has h = 200 kJ/kg and s = 1 kJ/(kg·K)", () => {
    const s = f.saturationAtT(C, "bubble");
    expect(Math.abs(s.liquid.hJkg - 200e3)).toBeLessThan(0.5);
    expect(Math.abs(s.liquid.sJkgK - 1e3)).toBeLessThan(0.002);
  });

  it("conventions: dew, bubble and mean temperatures; the liquid speed of sound is given", () => {
    const d = f.saturationAtT(C - 10, "dew");
    const b = f.saturationAtT(C - 10, "bubble");
    const m = f.saturationAtT(C - 10, "mean");
    expect(d.tDewK).toBe(C - 10);
    expect(b.tBubbleK).toBe(C - 10);
    expect(Math.abs(0.5 * (m.tBubbleK + m.tDewK) - (C - 10))).toBeLessThan(1e-8);
    expect(d.pDewPa).toBeLessThanOrEqual(m.pDewPa);
    expect(m.pDewPa).toBeLessThanOrEqual(b.pDewPa);
    expect(b.liquid.speedOfSoundMs).toBeGreaterThan(300);
    expect(d.vapour.speedOfSoundMs).toBeGreaterThan(100);
  });

  it("inputs outside the range are refused naming the field", () => {
    expect(() => f.saturationAtT(C - 80)).toThrow(ThermoRangeError);
    expect(() => f.statePT(40e5, C)).toThrowError(/pPa/);
    expect(() => f.statePT(5e5, C + 200)).toThrowError(/tK/);
    expect(() => f.statePH(5e5, Number.NaN)).toThrowError(/hJkg/);
  });
});

/** R410A (R32/R125 50/50) and R407C (R32/R125/R134a 23/25/52): not offered here, built for this check only. */
const testBlend = (id: "R410A" | "R407C") =>
  new HelmholtzBlend({
    id: id as FluidId,
    name: `${id} (test only)`,
    massFractions: id === "R410A" ? { R32: 0.5, R125: 0.5 } : { R32: 0.23, R125: 0.25, R134a: 0.52 },
    safetyGroup: "A1",
    zeotropic: true,
    criticalTempK: id === "R410A" ? 344.494 : 359.345,
    criticalPressurePa: id === "R410A" ? 4.9012e6 : 4.6317e6,
    criticalDensityKgM3: 455,
    pMaxPa: 32e5,
  });

describe.each(["R404A", "R507A", "R410A", "R407C"] as const)("%s single-phase states against Lemmon's (2003) pseudo-pure equation", (id) => {
  // Lemmon (2003), Int. J. Thermophys. 24, 991: a pure-fluid-form equation fitted to the
  // Lemmon–Jacobsen mixture model at the nominal composition (fixtures/lemmon2003.ts). Its own
  // representation of that model is closest in the vapour; in the liquid its heat capacity and
  // speed of sound carry about 1–2 %, so the liquid limits are wider.
  const f = id === "R410A" || id === "R407C" ? testBlend(id) : createBlend(id);
  const e = new HelmholtzEos(LEMMON_2003[id]);
  const a = newAlpha();
  const ref = (P: number, T: number, liquid: boolean) => {
    let rho = liquid ? 3.2 * e.rhor : P / (e.r * T);
    for (let i = 0; i < 100; i++) {
      e.evaluate(rho / e.rhor, e.tr / T, a, true);
      const step = (rho * e.r * T * (1 + a.dAr) - P) / (e.r * T * (1 + 2 * a.dAr + a.ddAr));
      rho -= step;
      if (Math.abs(step) < 1e-12 * rho) break;
    }
    e.evaluate(rho / e.rhor, e.tr / T, a);
    const cvR = -(a.ttA0 + a.ttAr);
    const num = 1 + a.dAr - a.dtAr;
    const den = 1 + 2 * a.dAr + a.ddAr;
    return {
      rho,
      h: e.r * T * (1 + a.tA0 + a.tAr + a.dAr),
      cp: e.r * (cvR + (num * num) / den),
      w: Math.sqrt(e.r * T * (den + (num * num) / cvR)),
    };
  };
  // enthalpies compared as differences from one vapour state (the reference states differ)
  const t0 = f.saturationAtP(3e5).tDewK + 10;
  const h0 = f.statePT(3e5, t0).hJkg;
  const h0ref = ref(3e5, t0, false).h;

  it("superheated vapour 1–25 bar, 10–80 K superheat: ρ and w within 0.05 %, cp within 0.4 %, Δh within 0.15 kJ/kg", () => {
    for (const P of [1e5, 3e5, 10e5, 18e5, 25e5]) {
      for (const dT of [10, 40, 80]) {
        const T = f.saturationAtP(P).tDewK + dT;
        const m = f.statePT(P, T);
        const r = ref(P, T, false);
        expect(rel(m.densityKgM3, r.rho)).toBeLessThan(5e-4);
        expect(rel(m.speedOfSoundMs!, r.w)).toBeLessThan(5e-4);
        expect(rel(m.cpJkgK!, r.cp)).toBeLessThan(4e-3);
        expect(Math.abs(m.hJkg - h0 - (r.h - h0ref))).toBeLessThan(150);
      }
    }
  });

  it("single-stage cycles −40/+45 … 0/+50 °C (dew and mean): COP within 0.3 %, discharge within 0.2 K", () => {
    // 5 K superheat, 5 K subcooling, isentropic compression: every state point single-phase,
    // so the pseudo-pure equation applies at each; the pressures are the blend's own.
    const sAt = (P: number, T: number) => {
      ref(P, T, false);
      return e.r * (a.tA0 + a.tAr - a.a0 - Math.log(ref(P, T, false).rho / e.rhor) - a.ar);
    };
    const tAtS = (P: number, s: number, T0: number) => {
      let T = T0;
      for (let i = 0; i < 50; i++) {
        const d = (sAt(P, T) - s) / (ref(P, T, false).cp / T);
        T -= d;
        if (Math.abs(d) < 1e-9) break;
      }
      return T;
    };
    for (const [te, tc] of [
      [-40, 45],
      [-35, 40],
      [-10, 40],
      [0, 50],
    ]) {
      for (const conv of ["dew", "mean"] as const) {
        const pe = f.saturationAtT(te + C, conv).pDewPa;
        const pc = f.saturationAtT(tc + C, conv).pDewPa;
        const T1 = f.saturationAtP(pe).tDewK + 5;
        const T3 = f.saturationAtP(pc).tBubbleK - 5;
        const m1 = f.statePT(pe, T1);
        const m3 = f.statePT(pc, T3);
        const m2 = f.statePS(pc, m1.sJkgK);
        const r1 = ref(pe, T1, false).h;
        const r3 = ref(pc, T3, true).h;
        const T2 = tAtS(pc, sAt(pe, T1), m2.tK);
        const r2 = ref(pc, T2, false).h;
        const copModel = (m1.hJkg - m3.hJkg) / (m2.hJkg - m1.hJkg);
        const copRef = (r1 - r3) / (r2 - r1);
        expect(rel(copModel, copRef)).toBeLessThan(0.003);
        expect(Math.abs(m2.tK - T2)).toBeLessThan(0.2);
      }
    }
  });

  it("subcooled liquid: ρ within 0.15 %, liquid-to-vapour Δh within 1 kJ/kg, cp and w within 2.5 %", () => {
    for (const P of [10e5, 25e5]) {
      for (const tC of [-40, 0, 30]) {
        const T = tC + C;
        if (T > f.saturationAtP(P).tBubbleK - 2) continue;
        const m = f.statePT(P, T);
        const r = ref(P, T, true);
        expect(rel(m.densityKgM3, r.rho)).toBeLessThan(1.5e-3);
        expect(Math.abs(m.hJkg - h0 - (r.h - h0ref))).toBeLessThan(1000);
        expect(rel(m.cpJkgK!, r.cp)).toBeLessThan(0.025);
        expect(rel(m.speedOfSoundMs!, r.w)).toBeLessThan(0.025);
      }
    }
  });
});

describe("blend metadata against published data", () => {
  it("GWP100 (AR4, mass-weighted per Regulation (EU) 517/2014 Annex IV) and safety groups", () => {
    // GWP: Regulation (EU) No 517/2014 Annex I/IV method with AR4 component values; the
    // blends' published AR4 figures (from memory): R404A 3922, R507A 3985, R448A 1387,
    // R449A 1397, R513A 631, R454C 148, R455A 148. Safety groups ASHRAE 34 / ISO 817.
    const want: Record<string, [number, string]> = {
      R404A: [3922, "A1"],
      R507A: [3985, "A1"],
      R448A: [1387, "A1"],
      R449A: [1397, "A1"],
      R513A: [631, "A1"],
      R454C: [148, "A2L"],
      R455A: [148, "A2L"],
    };
    for (const m of blendMeta) {
      expect(m.gwp100).toBe(want[m.id][0]);
      expect(m.safetyGroup).toBe(want[m.id][1]);
    }
    expect(blendMeta.map((m) => m.id).sort()).toEqual(Object.keys(want).sort());
  });

  it("normal boiling (bubble) points within 0.5 K of the published values", () => {
    // ASHRAE 34 / manufacturers' data sheets (from memory): R404A −46.2 °C, R507A −46.7 °C,
    // R448A (Solstice N40) −46.1 °C, R449A (Opteon XP40) −46.0 °C, R513A (Opteon XP10)
    // −29.2 °C, R454C (Opteon XL20) −45.9 °C, R455A (Solstice L40X) −52 °C.
    const nbp: Record<string, number> = { R404A: -46.2, R507A: -46.7, R448A: -46.1, R449A: -46.0, R513A: -29.2, R454C: -45.9, R455A: -52.0 };
    for (const m of blendMeta) expect(Math.abs(m.normalBoilingPointK - C - nbp[m.id])).toBeLessThan(0.5);
  });

  it("glide: R507A and R513A are near-azeotropic, R455A glides most", () => {
    const glide = (id: FluidId) => createBlend(id).saturationAtP(3e5).glideK;
    expect(glide("R507A")).toBeLessThan(0.05);
    expect(glide("R513A")).toBeLessThan(0.2);
    // R448A/R449A glide about 4–6 K, R454C about 7 K, R455A about 12 K at evaporator
    // pressures (manufacturers' data sheets, from memory)
    expect(glide("R449A")).toBeGreaterThan(4);
    expect(glide("R449A")).toBeLessThan(7);
    expect(glide("R454C")).toBeGreaterThan(6);
    expect(glide("R455A")).toBeGreaterThan(10);
    expect(glide("R455A")).toBeLessThan(15);
  });
});

describe("single-stage cycle from −40 to +45 °C, dew and mean conventions", () => {
  const ideal: CompressorInput = { type: "reciprocating", isentropic: 1, volumetric: 1, motorEfficiency: 1, units: 1, standbyUnits: 0 };
  it.each(BLEND_IDS.flatMap((id) => (["dew", "mean"] as TempConvention[]).map((c) => [id, c] as const)))("%s (%s)", (id, convention) => {
    const fluid = createBlend(id);
    for (const [te, tc] of [
      [-40, 45],
      [-10, 40],
    ]) {
      const r = singleStageCycle({
        fluid,
        convention,
        evaporatingK: te + C,
        condensingK: tc + C,
        superheatK: 5,
        subcoolingK: 0,
        compressor: ideal,
        loadW: 10_000,
        coldReservoirs: [{ heatW: 10_000, tK: te + 10 + C }],
        sinkK: tc - 10 + C,
      });
      const cop = r.loadW / r.shaftPowerW;
      const carnot = (te + C) / (tc - te);
      expect(cop).toBeGreaterThan(0.35 * carnot);
      expect(cop).toBeLessThan(carnot);
      // first law over the cycle
      expect(Math.abs(r.condenserHeatW - r.loadW - r.shaftPowerW)).toBeLessThan(1e-6 * r.condenserHeatW);
      expect(r.dischargeTempK).toBeGreaterThan(tc + C);
    }
  });

  it("at −35 / +40 °C R448A and R449A beat R404A, as the manufacturers publish", () => {
    // Honeywell and Chemours literature (from memory): R448A / R449A give a higher COP than
    // R404A in low- and medium-temperature refrigeration, by several per cent.
    const cop = (id: FluidId) => {
      const r = singleStageCycle({
        fluid: createBlend(id),
        convention: "dew",
        evaporatingK: C - 35,
        condensingK: C + 40,
        superheatK: 5,
        subcoolingK: 0,
        compressor: ideal,
        loadW: 10_000,
        coldReservoirs: [{ heatW: 10_000, tK: C - 25 }],
        sinkK: C + 30,
      });
      return r.loadW / r.shaftPowerW;
    };
    expect(cop("R448A")).toBeGreaterThan(1.03 * cop("R404A"));
    expect(cop("R449A")).toBeGreaterThan(1.03 * cop("R404A"));
  });
});
