import { describe, expect, it } from "vitest";
import fx from "./fixtures/r717-iapws.json";
import { loadFluid, ThermoRangeError } from "./index";

// Reference: lib/engine/thermo/fixtures/r717-iapws.json, written by
// scripts/fixtures/ammonia_iapws.py with Debian's python3-iapws (iapws.ammonia.NH3, the
// Tillner-Roth, Harms-Watzenberg & Baehr 1993 equation). iapws's reference state sits within
// 1e-4 J/kg of IIR; the exact offsets come from the fixture's own 0 °C saturated liquid.
const dh = fx.iir_anchor.hL_273_15 - 200e3;
const ds = fx.iir_anchor.sL_273_15 - 1e3;

function rel(a: number, b: number): number {
  return Math.abs(a / b - 1);
}

describe("R717 against python3-iapws (same equation of state)", async () => {
  const nh3 = await loadFluid("R717");

  it("saturation −60…+60 °C: P, ρ', ρ'', h', h'', s', s'' within 1e-6", () => {
    for (const ref of fx.saturation) {
      const s = nh3.saturationAtT(ref.tK);
      expect(rel(s.pDewPa, ref.pPa)).toBeLessThan(1e-6);
      expect(rel(s.liquid.densityKgM3, ref.rhoL)).toBeLessThan(1e-6);
      expect(rel(s.vapour.densityKgM3, ref.rhoV)).toBeLessThan(1e-6);
      expect(Math.abs(s.liquid.hJkg + dh - ref.hL)).toBeLessThan(1e-6 * Math.abs(ref.hV));
      expect(Math.abs(s.vapour.hJkg + dh - ref.hV)).toBeLessThan(1e-6 * ref.hV);
      expect(Math.abs(s.liquid.sJkgK + ds - ref.sL)).toBeLessThan(1e-6 * ref.sV);
      expect(Math.abs(s.vapour.sJkgK + ds - ref.sV)).toBeLessThan(1e-6 * ref.sV);
    }
  });

  it("saturation at P inverts saturation at T (fixture pressures)", () => {
    for (const ref of fx.saturation) {
      const s = nh3.saturationAtP(ref.pPa);
      expect(Math.abs(s.tDewK - ref.tK)).toBeLessThan(1e-5);
    }
  });

  it("single-phase (P,T) states: ρ, h, s, cp, w within 1e-6", () => {
    expect(fx.states.length).toBeGreaterThan(50);
    for (const ref of fx.states) {
      const s = nh3.statePT(ref.pPa, ref.tK);
      expect(rel(s.densityKgM3, ref.rho)).toBeLessThan(1e-6);
      expect(Math.abs(s.hJkg + dh - ref.h)).toBeLessThan(1e-6 * 1.5e6);
      expect(Math.abs(s.sJkgK + ds - ref.s)).toBeLessThan(1e-6 * 6e3);
      expect(rel(s.cpJkgK!, ref.cp)).toBeLessThan(1e-6);
      expect(rel(s.speedOfSoundMs!, ref.w)).toBeLessThan(1e-6);
      expect(s.phase === "liquid").toBe(ref.phase === "Liquid");
    }
  });

  it("single-stage cycle −30/+35 °C: isentropic discharge and COP within 1e-6", () => {
    const c = fx.cycle;
    const h1 = nh3.saturationAtT(c.evapTK).vapour.hJkg + dh;
    const s1 = nh3.saturationAtT(c.evapTK).vapour.sJkgK + ds;
    const h3 = nh3.saturationAtT(c.condTK).liquid.hJkg + dh;
    expect(Math.abs(h1 - c.h1)).toBeLessThan(1e-6 * c.h1);
    expect(Math.abs(s1 - c.s1)).toBeLessThan(1e-6 * c.s1);
    const out = nh3.statePS(c.pCondPa, c.s1 - ds);
    expect(Math.abs(out.tK - c.t2sK)).toBeLessThan(1e-4);
    expect(Math.abs(out.hJkg + dh - c.h2s)).toBeLessThan(1e-6 * c.h2s);
    const cop = (h1 - h3) / (out.hJkg + dh - h1);
    expect(rel(cop, c.cop)).toBeLessThan(1e-6);
  });
});

describe("R717 against published table values (looser)", async () => {
  const nh3 = await loadFluid("R717");

  it("saturation pressures within 0.5 %", () => {
    // ASHRAE Handbook—Fundamentals, refrigerant tables, ammonia (from memory):
    // −40 °C 71.7 kPa, −20 °C 190.2 kPa, 0 °C 429.4 kPa, +20 °C 857.5 kPa, +40 °C 1555 kPa.
    const table: [number, number][] = [
      [-40, 71.7e3],
      [-20, 190.2e3],
      [0, 429.4e3],
      [20, 857.5e3],
      [40, 1555e3],
    ];
    for (const [tC, pPa] of table) expect(rel(nh3.saturationAtT(273.15 + tC).pDewPa, pPa)).toBeLessThan(0.005);
  });

  it("latent heat within 1 %", () => {
    // ASHRAE Handbook—Fundamentals, ammonia table (from memory): h_fg 1262.2 kJ/kg at 0 °C,
    // 1369.5 kJ/kg at the normal boiling point −33.3 °C.
    const s0 = nh3.saturationAtT(273.15);
    expect(rel(s0.vapour.hJkg - s0.liquid.hJkg, 1262.2e3)).toBeLessThan(0.01);
    const nb = nh3.saturationAtP(101325);
    expect(rel(nb.vapour.hJkg - nb.liquid.hJkg, 1369.5e3)).toBeLessThan(0.01);
  });

  it("normal boiling point and IIR reference state", () => {
    // Normal boiling point −33.33 °C = 239.82 K (ASHRAE Handbook—Fundamentals, from memory).
    expect(Math.abs(nh3.saturationAtP(101325).tDewK - 239.82)).toBeLessThan(0.02);
    // IIR convention (DOMAIN.md §3): h = 200 kJ/kg, s = 1 kJ/(kg·K), saturated liquid at 0 °C.
    const s0 = nh3.saturationAtT(273.15);
    expect(Math.abs(s0.liquid.hJkg - 200e3)).toBeLessThan(1e-3);
    expect(Math.abs(s0.liquid.sJkgK - 1e3)).toBeLessThan(1e-6);
  });

  it("rejects out-of-range inputs with a field-named ThermoRangeError", () => {
    const cases: [() => unknown, string][] = [
      [() => nh3.saturationAtT(150), "tK"],
      [() => nh3.saturationAtT(Number.NaN), "tK"],
      [() => nh3.saturationAtT(420), "tK"],
      [() => nh3.saturationAtP(20e6), "pPa"],
      [() => nh3.statePT(-1, 300), "pPa"],
      [() => nh3.statePT(1e5, 800), "tK"],
      [() => nh3.statePH(1e5, 1e8), "hJkg"],
      [() => nh3.statePH(1e5, Number.NaN), "hJkg"],
      [() => nh3.statePS(1e5, -1e5), "sJkgK"],
    ];
    for (const [fn, field] of cases) {
      let err: unknown;
      try {
        fn();
      } catch (e) {
        err = e;
      }
      expect(err).toBeInstanceOf(ThermoRangeError);
      expect((err as ThermoRangeError).field).toBe(field);
    }
  });
});
