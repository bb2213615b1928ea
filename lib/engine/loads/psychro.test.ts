import { describe, expect, it } from "vitest";
import { airFromRH, airFromWetBulb, sitePressurePa } from "./psychro";
import { LoadInputError } from "./errors";

describe("site pressure from elevation", () => {
  it("matches the standard-atmosphere table", () => {
    // ASHRAE Handbook—Fundamentals, psychrometrics chapter, standard atmospheric data table
    // (from memory): 0 m 101.325 kPa, 500 m 95.461 kPa, 1000 m 89.875 kPa.
    expect(sitePressurePa(0)).toBeCloseTo(101325, 0);
    expect(sitePressurePa(500) / 1000).toBeCloseTo(95.461, 2);
    expect(sitePressurePa(1000) / 1000).toBeCloseTo(89.875, 2);
  });
});

describe("moist air states", () => {
  it("saturated air at 20 °C", () => {
    // Hand calculation: p_ws(20 °C) = 2339.3 Pa (IAPWS steam tables),
    // W = 0.621945·p_ws/(p − p_ws) = 0.621945·2339.3/(101325 − 2339.3) = 0.014698;
    // h = 1.006·20 + 0.014698·(2501 + 1.86·20) = 57.43 kJ/kg. (The ASHRAE table lists
    // W_s = 0.014758, 57.55 kJ/kg, including the enhancement factor — within 0.5 %.)
    const a = airFromRH(20, 100, 101325);
    expect(a.humRatio).toBeCloseTo(0.014698, 5);
    expect(a.enthalpyJkg / 1000).toBeCloseTo(57.43, 1);
    expect(Math.abs(a.humRatio / 0.014758 - 1)).toBeLessThan(0.005);
  });

  it("freezer air over ice at −20 °C, 90 % RH", () => {
    // Hand calculation: p_ws,ice(−20 °C) = 103.26 Pa (ASHRAE Fundamentals table, from memory),
    // p_w = 92.93 Pa, W = 0.621945·92.93/(101325 − 92.93) = 0.000571;
    // h = 1.006·(−20) + 0.000571·(2501 − 37.2) = −18.71 kJ/kg;
    // ρ = p/(287.042·253.15·(1 + 1.607858·W))·(1 + W) = 1.3939 kg/m³.
    const a = airFromRH(-20, 90, 101325);
    expect(a.humRatio).toBeCloseTo(0.000571, 5);
    expect(a.enthalpyJkg / 1000).toBeCloseTo(-18.71, 1);
    expect(a.densityKgM3).toBeCloseTo(1.3939, 3);
  });

  it("wet bulb gives the humidity of the psychrometric chart", () => {
    // ASHRAE psychrometric chart No. 1 (from memory): 32 °C dry bulb, 23 °C wet bulb at
    // sea level ≈ 0.0142 kg/kg, ≈ 69 kJ/kg, about 47 % RH.
    const a = airFromWetBulb(32, 23, 101325);
    expect(a.humRatio).toBeGreaterThan(0.0135);
    expect(a.humRatio).toBeLessThan(0.0150);
    expect(a.enthalpyJkg / 1000).toBeGreaterThan(67);
    expect(a.enthalpyJkg / 1000).toBeLessThan(71);
  });

  it("rejects RH outside 0–100 % with the field named", () => {
    expect(() => airFromRH(5, 120, 101325, "rooms.0.rhPct")).toThrow(LoadInputError);
    try {
      airFromRH(5, -1, 101325, "rooms.0.rhPct");
    } catch (e) {
      expect((e as LoadInputError).field).toBe("rooms.0.rhPct");
    }
  });
});
