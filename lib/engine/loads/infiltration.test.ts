import { describe, expect, it } from "vitest";
import { doorwayOpenTimeFactor, gosneyOlamaFullyOpen, splitAirExchange } from "./infiltration";
import { airFromRH } from "./psychro";

describe("Gosney–Olama door infiltration", () => {
  // A stated door: 3 m wide × 4 m high, outdoor air 25 °C / 50 % RH into a −20 °C / 90 % RH
  // freezer at 101.325 kPa.
  // Hand calculation from the published formula (ASHRAE Handbook—Refrigeration, Gosney & Olama
  // 1975) with moist-air properties from the ASHRAE Fundamentals equations and steam-table
  // saturation pressures (25 °C: 3169.9 Pa over water; −20 °C: 103.26 Pa over ice):
  //   W_i = 0.621945·1584.95/(101325 − 1584.95) = 0.009883, h_i = 50.327 kJ/kg,
  //   ρ_i = 1.17696 kg/m³; W_r = 0.000571, h_r = −18.713 kJ/kg, ρ_r = 1.39394 kg/m³;
  //   F_m = (2/(1 + (1.39394/1.17696)^(1/3)))^1.5 = 0.95801;
  //   q_t = 0.221·12·(50.327 + 18.713)·1.39394·(1 − 1.17696/1.39394)^0.5·(9.80665·4)^0.5·0.95801
  //       = 604.2 kW.
  // With 100 passages/day at 20 s each: D_t = 100·20/(3600·24) = 0.023148; D_f = 0.8, E = 0
  //   → q = 604.2·0.023148·0.8 = 11.19 kW.
  const warm = airFromRH(25, 50, 101325);
  const cold = airFromRH(-20, 90, 101325);

  it("fully open door, q_t", () => {
    const r = gosneyOlamaFullyOpen(3, 4, warm, cold);
    expect(r.densityFactor).toBeCloseTo(0.95801, 3);
    expect(r.qtW / 1000).toBeCloseTo(604.2, 0);
  });

  it("with the open-time and flow factors", () => {
    const dt = doorwayOpenTimeFactor(100, 20, 0, 24);
    expect(dt).toBeCloseTo(0.023148, 6);
    const q = gosneyOlamaFullyOpen(3, 4, warm, cold).qtW * dt * 0.8;
    expect(q / 1000).toBeCloseTo(11.19, 1);
  });

  it("open-time factor counts held-open minutes", () => {
    // D_t = (P·θp + 60·θo)/(3600·θd): 0 passages, 30 min open in 24 h → 1800/86400 = 0.020833.
    expect(doorwayOpenTimeFactor(0, 20, 30, 24)).toBeCloseTo(0.020833, 6);
  });

  it("no temperature difference, no exchange", () => {
    // Density-driven flow vanishes when both sides are the same air (the formula's (1 − ρi/ρr) term).
    expect(gosneyOlamaFullyOpen(3, 4, cold, cold).qtW).toBe(0);
  });

  it("sensible and latent parts add up to the enthalpy flow", () => {
    // Identity of the ASHRAE enthalpy h = 1.006·t + W·(2501 + 1.86·t): ṁ·Δh = sensible + latent.
    const r = gosneyOlamaFullyOpen(3, 4, warm, cold);
    const s = splitAirExchange(r.dryAirKgS, warm, cold);
    expect(s.sensibleW + s.latentW).toBeCloseTo(r.qtW, 3);
    // Latent share by hand: ṁ·(W_i − W_r)·(2501 − 37.2) / (ṁ·Δh) = 0.009312·2463.8/69.04 = 0.332.
    expect(s.latentW / r.qtW).toBeCloseTo(0.332, 2);
  });
});
