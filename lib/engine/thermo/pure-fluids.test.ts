import fc from "fast-check";
import { describe, expect, it } from "vitest";
import type { HelmholtzFluid } from "./helmholtz/pure-fluid";
import { loadFluid, ThermoRangeError, type FluidId } from "./index";

const C = 273.15;
const rel = (a: number, b: number) => Math.abs(a / b - 1);
const load = async (id: FluidId) => (await loadFluid(id)) as HelmholtzFluid;

describe("R744 (Span & Wagner 1996)", async () => {
  const co2 = await load("R744");

  it("saturation pressures within 0.5 %", () => {
    // NIST Chemistry WebBook, CO2 saturation table (from memory): −40 °C 1.0045 MPa,
    // −20 °C 1.9696 MPa, 0 °C 3.4851 MPa, +20 °C 5.7291 MPa.
    const table: [number, number][] = [
      [-40, 1.0045e6],
      [-20, 1.9696e6],
      [0, 3.4851e6],
      [20, 5.7291e6],
    ];
    for (const [tC, p] of table) expect(rel(co2.saturationAtT(C + tC).pDewPa, p)).toBeLessThan(0.005);
    // Triple point 216.592 K, 0.51795 MPa (Span & Wagner 1996, Table 3).
    expect(rel(co2.saturationAtT(216.592).pDewPa, 0.51795e6)).toBeLessThan(0.005);
    // Saturation pressure runs into the critical pressure 7.3773 MPa (Span & Wagner 1996).
    expect(rel(co2.saturationAtT(co2.tSatMaxK).pDewPa, 7.3773e6)).toBeLessThan(0.005);
  });

  it("latent heat within 1 %", () => {
    // NIST Chemistry WebBook (from memory): h_fg = 230.89 kJ/kg at 0 °C.
    const s0 = co2.saturationAtT(C);
    expect(rel(s0.vapour.hJkg - s0.liquid.hJkg, 230.89e3)).toBeLessThan(0.01);
    // CoolProp's fluid file dev/fluids/CarbonDioxide.json, STATES.triple_liquid / triple_vapor
    // (computed by CoolProp from the same equation): h'' − h' = (18942.529 − 3522.347) J/mol.
    const st = co2.saturationAtT(216.592);
    expect(rel(st.vapour.hJkg - st.liquid.hJkg, (18942.529431708266 - 3522.347496266107) / 0.0440098)).toBeLessThan(1e-5);
    expect(rel(st.liquid.densityKgM3, 26777.277860217495 * 0.0440098)).toBeLessThan(1e-6);
  });

  it("saturation and superheated states against the NIST-derived R744 tables", () => {
    // Ohio University R744 property tables (source: NIST Chemistry WebBook), saturation
    // table −20…5 °C: −20 °C 1.9696 MPa, h_f 154.45, h_fg 282.44, s_g 1.9485;
    // −10 °C 2.6487 MPa, h_f 176.52, h_fg 258.62, s_g 1.8985 (kJ/kg, kJ/(kg·K), IIR).
    for (const [tC, p, hf, hfg, sg] of [
      [-20, 1.9696e6, 154.45e3, 282.44e3, 1948.5],
      [-10, 2.6487e6, 176.52e3, 258.62e3, 1898.5],
    ]) {
      const s = co2.saturationAtT(C + tC);
      expect(rel(s.pDewPa, p)).toBeLessThan(0.005);
      expect(rel(s.liquid.hJkg, hf)).toBeLessThan(0.01);
      expect(rel(s.vapour.hJkg - s.liquid.hJkg, hfg)).toBeLessThan(0.01);
      expect(rel(s.vapour.sJkgK, sg)).toBeLessThan(0.01);
    }
    // Same tables, superheated vapour: 2 MPa 0 °C h 460.00 s 2.0341; 3 MPa 10 °C h 455.98
    // s 1.9567; 5 MPa 40 °C h 467.13 s 1.9200.
    for (const [p, tC, h, sv] of [
      [2e6, 0, 460.0e3, 2034.1],
      [3e6, 10, 455.98e3, 1956.7],
      [5e6, 40, 467.13e3, 1920.0],
    ]) {
      const st = co2.statePT(p, C + tC);
      expect(Math.abs(st.hJkg - h)).toBeLessThan(0.001 * h);
      expect(Math.abs(st.sJkgK - sv)).toBeLessThan(0.001 * sv);
    }
  });

  it("cascade low stage 2 → 3 MPa and compression to 5 MPa: isentropic rise and COP within 1 %", () => {
    // NIST-derived R744 superheated table (as reproduced in "CO2 - Superheated vapor",
    // 2/3/5 MPa): saturated vapour at 2 MPa h1 = 436.85, s1 = 1.9461; at 3 MPa the
    // 0/10/20 °C rows (h 442.22/455.98/468.46, s 1.9072/1.9567/2.0001); at 5 MPa the
    // 30/40/50 °C rows (h 451.44/467.13/481.15, s 1.8691/1.9200/1.9641). Ohio University
    // saturation table: h_f −6 °C 185.71 (2.9632 MPa), −5 °C 188.05 (3.0459 MPa).
    // h2s is read off the published rows by quadratic interpolation in s at s1, h3 by linear
    // interpolation in pressure at 3 MPa.
    const quad = (x: number, xs: number[], ys: number[]) =>
      ys.reduce((acc, y, i) => {
        let w = 1;
        for (let j = 0; j < xs.length; j++) if (j !== i) w *= (x - xs[j]) / (xs[i] - xs[j]);
        return acc + w * y;
      }, 0);
    const h1Pub = 436.85e3;
    const s1Pub = 1946.1;
    const h2s3Pub = quad(s1Pub, [1907.2, 1956.7, 2000.1], [442.22e3, 455.98e3, 468.46e3]);
    const h2s5Pub = quad(s1Pub, [1869.1, 1920.0, 1964.1], [451.44e3, 467.13e3, 481.15e3]);
    const h3Pub = 185.71e3 + ((188.05e3 - 185.71e3) * (3.0 - 2.9632)) / (3.0459 - 2.9632);
    const s1 = co2.saturationAtP(2e6).vapour;
    const h3 = co2.saturationAtP(3e6).liquid.hJkg;
    const h2s3 = co2.statePS(3e6, s1.sJkgK).hJkg;
    const h2s5 = co2.statePS(5e6, s1.sJkgK).hJkg;
    expect(rel(s1.hJkg, h1Pub)).toBeLessThan(0.001);
    expect(rel(h2s3 - s1.hJkg, h2s3Pub - h1Pub)).toBeLessThan(0.01);
    expect(rel(h2s5 - s1.hJkg, h2s5Pub - h1Pub)).toBeLessThan(0.01);
    expect(rel((s1.hJkg - h3) / (h2s3 - s1.hJkg), (h1Pub - h3Pub) / (h2s3Pub - h1Pub))).toBeLessThan(0.01);
  });

  it("supercritical state with the non-analytic terms (CoolProp hs_anchor point)", () => {
    // dev/fluids/CarbonDioxide.json EOS[0].STATES.hs_anchor: T = 334.54102 K,
    // ρ = 9562.41567 mol/m³, p = 12.034846936 MPa.
    const s = co2.statePT(12034846.936049871, 334.54102);
    expect(rel(s.densityKgM3, 9562.41567 * 0.0440098)).toBeLessThan(1e-7);
    expect(s.phase).toBe("supercritical");
  });

  it("gas-cooler states up to 140 bar / 150 °C flash back to their temperature", () => {
    // Round trip only (no external value): (P,T) → h → (P,h) and s → (P,s).
    for (const [pPa, tK] of [
      [140e5, C + 150],
      [100e5, C + 35],
      [90e5, C + 40],
      [75e5, C + 32],
      [140e5, C + 20],
    ]) {
      const s = co2.statePT(pPa, tK);
      expect(Math.abs(co2.statePH(pPa, s.hJkg).tK - tK)).toBeLessThan(1e-6);
      expect(Math.abs(co2.statePS(pPa, s.sJkgK).tK - tK)).toBeLessThan(1e-6);
    }
  });
});

describe("R134a (Tillner-Roth & Baehr 1994)", async () => {
  const r = await load("R134a");

  it("saturation pressure and latent heat against the NIST WebBook table", () => {
    // NIST Chemistry WebBook, R134a saturation (IIR reference; from memory):
    // −20 °C: 132.73 kPa, h' 173.64, h'' 386.55 kJ/kg; 0 °C: 292.80 kPa, h'' 398.60 kJ/kg;
    // +40 °C: 1016.6 kPa, h' 256.41, h'' 419.43 kJ/kg.
    const rows: [number, number, number, number][] = [
      [-20, 132.73e3, 173.64e3, 386.55e3],
      [0, 292.8e3, 200e3, 398.6e3],
      [40, 1016.6e3, 256.41e3, 419.43e3],
    ];
    for (const [tC, p, hl, hv] of rows) {
      const s = r.saturationAtT(C + tC);
      expect(rel(s.pDewPa, p)).toBeLessThan(0.005);
      expect(rel(s.vapour.hJkg - s.liquid.hJkg, hv - hl)).toBeLessThan(0.01);
    }
    // Normal boiling point −26.07 °C (ASHRAE Handbook—Fundamentals, from memory).
    expect(Math.abs(r.saturationAtP(101325).tDewK - (C - 26.07))).toBeLessThan(0.03);
    // Triple point 169.85 K, 389.56 Pa: CoolProp dev/fluids/R134a.json STATES.triple_liquid.
    expect(rel(r.saturationAtT(169.85).pDewPa, 389.56378856198955)).toBeLessThan(1e-6);
  });

  it("single-stage cycle 0.14/0.8 MPa: isentropic rise and COP within 1 %", () => {
    // Çengel & Boles, Thermodynamics: An Engineering Approach, Example 11-1 (ideal
    // vapour-compression cycle, R134a, 0.14 and 0.8 MPa; from memory): h1 = 239.16,
    // h2 = 275.39, h3 = h4 = 95.47 kJ/kg, COP = 3.97 (their tables use another reference
    // state, so only differences are compared).
    const s1 = r.saturationAtP(0.14e6).vapour;
    const h3 = r.saturationAtP(0.8e6).liquid.hJkg;
    const h2 = r.statePS(0.8e6, s1.sJkgK).hJkg;
    expect(rel(h2 - s1.hJkg, (275.39 - 239.16) * 1e3)).toBeLessThan(0.01);
    expect(rel(s1.hJkg - h3, (239.16 - 95.47) * 1e3)).toBeLessThan(0.01);
    expect(rel((s1.hJkg - h3) / (h2 - s1.hJkg), 3.97)).toBeLessThan(0.01);
  });

  it("supercritical state (CoolProp hs_anchor point)", () => {
    // dev/fluids/R134a.json EOS[0].STATES.hs_anchor: T = 411.598 K, ρ = 4480.9471539 mol/m³,
    // p = 6.858750808 MPa.
    const s = r.statePT(6858750.808053112, 411.598);
    expect(rel(s.densityKgM3, 4480.9471539 * 0.102032)).toBeLessThan(1e-7);
  });
});

describe("R290 (Lemmon, McLinden & Wagner 2009)", async () => {
  const r = await load("R290");

  it("saturation pressure and latent heat", () => {
    // NIST Chemistry WebBook, propane saturation (from memory): −20 °C 244.5 kPa,
    // 0 °C 474.5 kPa, +40 °C 1369 kPa; h_fg 374.9 kJ/kg at 0 °C and 425.6 kJ/kg at the
    // normal boiling point 231.04 K (Lemmon et al. 2009).
    const rows: [number, number][] = [
      [-20, 244.5e3],
      [0, 474.5e3],
      [40, 1369e3],
    ];
    for (const [tC, p] of rows) expect(rel(r.saturationAtT(C + tC).pDewPa, p)).toBeLessThan(0.005);
    const s0 = r.saturationAtT(C);
    expect(rel(s0.vapour.hJkg - s0.liquid.hJkg, 374.9e3)).toBeLessThan(0.01);
    const nb = r.saturationAtP(101325);
    expect(Math.abs(nb.tDewK - 231.04)).toBeLessThan(0.02);
    expect(rel(nb.vapour.hJkg - nb.liquid.hJkg, 425.6e3)).toBeLessThan(0.01);
    // Critical point 369.89 K, 4.2512 MPa (Lemmon et al. 2009).
    expect(rel(r.saturationAtT(r.tSatMaxK).pDewPa, 4.2512e6)).toBeLessThan(0.005);
    // Triple point: p = 1.720461815e-4 Pa at 85.525 K (CoolProp dev/fluids/n-Propane.json).
    expect(rel(r.saturationAtT(85.525).pDewPa, 1.720461815e-4)).toBeLessThan(1e-5);
  });
});

describe("R1234ze(E) (Thol & Lemmon 2016)", async () => {
  const r = await load("R1234zeE");

  it("saturation pressure, boiling point and latent heat", () => {
    // Thol & Lemmon (2016): normal boiling point 254.177 K, critical pressure 3.6349 MPa.
    expect(Math.abs(r.saturationAtP(101325).tDewK - 254.177)).toBeLessThan(0.01);
    expect(rel(r.saturationAtT(r.tSatMaxK).pDewPa, 3.6349e6)).toBeLessThan(0.005);
    // NIST Chemistry WebBook (from memory): 0 °C 216.6 kPa, +40 °C 766.5 kPa;
    // h_fg 184.2 kJ/kg at 0 °C, 195.6 kJ/kg at the normal boiling point.
    expect(rel(r.saturationAtT(C).pDewPa, 216.6e3)).toBeLessThan(0.005);
    expect(rel(r.saturationAtT(C + 40).pDewPa, 766.5e3)).toBeLessThan(0.005);
    const s0 = r.saturationAtT(C);
    expect(rel(s0.vapour.hJkg - s0.liquid.hJkg, 184.2e3)).toBeLessThan(0.01);
    const nb = r.saturationAtP(101325);
    expect(rel(nb.vapour.hJkg - nb.liquid.hJkg, 195.6e3)).toBeLessThan(0.01);
  });
});

const ALL: FluidId[] = ["R717", "R744", "R134a", "R290", "R1234zeE"];

describe.each(ALL)("%s: model consistency", async (id) => {
  const f = await load(id);

  it("IIR reference state: h = 200 kJ/kg, s = 1 kJ/(kg·K) for saturated liquid at 0 °C", () => {
    // IIR convention (DOMAIN.md §3).
    const s = f.saturationAtT(C);
    expect(Math.abs(s.liquid.hJkg - 200e3)).toBeLessThan(1e-3);
    expect(Math.abs(s.liquid.sJkgK - 1e3)).toBeLessThan(1e-6);
  });

  it("saturation table matches the full Maxwell solve (p, ρ within 1e-6; h within 0.01 J/kg)", () => {
    const tHi = f.meta.criticalTempK - 1;
    for (let k = 0; k < 97; k++) {
      const t = f.range.tMinK + ((tHi - f.range.tMinK) * (k + 0.5)) / 97;
      const m = f.maxwellAtT(t);
      const s = f.saturationAtT(t);
      expect(rel(s.pDewPa, m.pPa)).toBeLessThan(1e-6);
      expect(rel(s.liquid.densityKgM3, m.rhoL)).toBeLessThan(1e-6);
      expect(rel(s.vapour.densityKgM3, m.rhoV)).toBeLessThan(1e-6);
      const l = f.raw(m.rhoL, t);
      const v = f.raw(m.rhoV, t);
      expect(Math.abs(s.liquid.hJkg - f.hOffsetJkg - l.hJkg)).toBeLessThan(0.01);
      expect(Math.abs(s.vapour.hJkg - f.hOffsetJkg - v.hJkg)).toBeLessThan(0.01);
      expect(Math.abs(s.vapour.sJkgK - f.sOffsetJkgK - v.sJkgK)).toBeLessThan(1e-3);
      // both phases at the tabulated pressure and equal Gibbs energy
      // (the liquid-side pressure is a small difference of terms of order ρ'RT)
      expect(Math.abs(f.pressure(m.rhoL, t) - m.pPa)).toBeLessThan(1e-7 * m.pPa + 1e-10 * m.rhoL * f.eos.r * t);
      const gl = l.hJkg - t * l.sJkgK;
      const gv = v.hJkg - t * v.sJkgK;
      expect(Math.abs(gl - gv)).toBeLessThan(1e-6 * Math.abs(v.hJkg - l.hJkg) + 1e-3);
    }
  });

  it("saturationAtP inverts saturationAtT", () => {
    fc.assert(
      fc.property(fc.double({ min: f.range.tMinK + 0.01, max: f.tSatMaxK - 0.01, noNaN: true }), (t) => {
        const p = f.saturationAtT(t).pDewPa;
        expect(Math.abs(f.saturationAtP(p).tDewK - t)).toBeLessThan(1e-6 * t);
      }),
      { seed: 42, numRuns: 200 },
    );
  });

  it("flash round trips: (P,T) → h → (P,h) and s → (P,s) give T back", () => {
    const lnPmin = Math.log(Math.max(f.pSatMinPa * 2, 1e3));
    const lnPmax = Math.log(f.range.pMaxPa);
    fc.assert(
      fc.property(
        fc.double({ min: lnPmin, max: lnPmax, noNaN: true }),
        fc.double({ min: f.range.tMinK, max: f.range.tMaxK, noNaN: true }),
        (lnP, t) => {
          const p = Math.min(Math.exp(lnP), f.range.pMaxPa);
          if (p < f.pSatMaxPa && Math.abs(f.saturationAtP(p).tDewK - t) < 1e-3) return; // on the dome
          const s = f.statePT(p, t);
          expect(Number.isFinite(s.hJkg) && Number.isFinite(s.sJkgK) && Number.isFinite(s.densityKgM3)).toBe(true);
          const ph = f.statePH(p, s.hJkg);
          const ps = f.statePS(p, s.sJkgK);
          expect(Math.abs(ph.tK - t)).toBeLessThan(1e-6 * t);
          expect(Math.abs(ps.tK - t)).toBeLessThan(1e-6 * t);
          expect(rel(ph.densityKgM3, s.densityKgM3)).toBeLessThan(1e-6);
        },
      ),
      { seed: 42, numRuns: 300 },
    );
  });

  it("two-phase flashes return the quality", () => {
    fc.assert(
      fc.property(
        fc.double({ min: f.range.tMinK + 0.5, max: f.meta.criticalTempK - 2, noNaN: true }),
        fc.double({ min: 0, max: 1, noNaN: true }),
        (t, x) => {
          const sat = f.saturationAtT(t);
          const h = sat.liquid.hJkg + x * (sat.vapour.hJkg - sat.liquid.hJkg);
          const s = sat.liquid.sJkgK + x * (sat.vapour.sJkgK - sat.liquid.sJkgK);
          const a = f.statePH(sat.pDewPa, h);
          const b = f.statePS(sat.pDewPa, s);
          expect(a.phase).toBe("two-phase");
          expect(Math.abs(a.quality! - x)).toBeLessThan(1e-6);
          expect(Math.abs(b.quality! - x)).toBeLessThan(1e-6);
          expect(Math.abs(a.tK - t)).toBeLessThan(1e-6 * t);
        },
      ),
      { seed: 42, numRuns: 200 },
    );
  });

  it("out-of-range inputs throw ThermoRangeError naming the field, never NaN", () => {
    const r = f.range;
    const cases: [() => unknown, string][] = [
      [() => f.saturationAtT(r.tMinK - 1), "tK"],
      [() => f.saturationAtT(f.meta.criticalTempK + 1), "tK"],
      [() => f.saturationAtT(Number.NaN), "tK"],
      [() => f.saturationAtP(f.meta.criticalPressurePa * 1.01), "pPa"],
      [() => f.saturationAtP(Number.POSITIVE_INFINITY), "pPa"],
      [() => f.statePT(r.pMaxPa * 1.01, 300), "pPa"],
      [() => f.statePT(0, 300), "pPa"],
      [() => f.statePT(1e5, r.tMaxK + 1), "tK"],
      [() => f.statePT(1e5, r.tMinK - 1), "tK"],
      [() => f.statePH(1e5, 1e9), "hJkg"],
      [() => f.statePH(1e5, -1e9), "hJkg"],
      [() => f.statePS(1e5, 1e6), "sJkgK"],
      [() => f.statePS(Number.NaN, 1e3), "pPa"],
    ];
    for (const [fn, field] of cases) {
      let err: unknown;
      try {
        fn();
      } catch (e) {
        err = e;
      }
      expect(err, `${id} ${field}`).toBeInstanceOf(ThermoRangeError);
      expect((err as ThermoRangeError).field).toBe(field);
    }
  });
});
