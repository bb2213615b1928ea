import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { convert, fmt, STANDARD_ATMOSPHERE_PA } from "./index";

// Conversion factors: NIST Special Publication 811 (2008), Appendix B.
describe("units", () => {
  it("converts temperatures with the offset and differences without it", () => {
    expect(convert.tempToDisplay(0, "IP")).toBeCloseTo(32, 10); // definition of °F
    expect(convert.tempToDisplay(-40, "IP")).toBeCloseTo(-40, 10); // −40 °C = −40 °F
    expect(convert.tempDiffToDisplay(6, "IP")).toBeCloseTo(10.8, 10); // 1 K = 1.8 °R (NIST SP 811)
    expect(fmt.tempDiff(5, "IP")).toBe("9.0 Δ°F");
    expect(fmt.temp(-25, "SI")).toBe("\u221225.0 °C");
  });

  it("converts power: Btu/h and tons of refrigeration", () => {
    // 1 Btu_IT/h = 0.2930711 W (NIST SP 811); 1 TR = 12 000 Btu/h = 3516.853 W
    expect(convert.powerToDisplay(1000, "IP")).toBeCloseTo(1000 / 0.29307107, 2);
    expect(convert.powerToTR(3516.853)).toBeCloseTo(1, 5);
    // electrical power stays in kW in both systems, and is labelled apart
    expect(fmt.power(15_000, "IP", "electrical")).toBe("15.0 kW(e)");
    expect(fmt.power(15_000, "SI", "refrigeration")).toBe("15.0 kW(r)");
  });

  it("labels pressures absolute or gauge", () => {
    // 1 psi = 6894.757 Pa (NIST SP 811); standard atmosphere 101 325 Pa (ISO 2533)
    expect(convert.pressureToDisplay(6894.757 + STANDARD_ATMOSPHERE_PA, "IP", "gauge")).toBeCloseTo(1, 5);
    expect(fmt.pressure(1_190_000, "SI", "abs")).toBe("11.90 bar(a)");
    expect(fmt.pressure(1_190_000, "SI", "gauge")).toBe("10.89 bar(g)");
  });

  it("lengths: 1 ft = 0.3048 m exactly (international foot)", () => {
    expect(convert.lengthToDisplay(0.3048, "IP")).toBeCloseTo(1, 12);
  });

  it("round-trips every quantity through display units", () => {
    fc.assert(
      fc.property(fc.double({ min: -1e6, max: 1e6, noNaN: true }), fc.constantFrom("SI" as const, "IP" as const), (v, s) => {
        const tol = Math.max(1e-9, Math.abs(v) * 1e-9);
        expect(Math.abs(convert.tempFromDisplay(convert.tempToDisplay(v, s), s) - v)).toBeLessThan(tol + 1e-6);
        expect(Math.abs(convert.tempDiffFromDisplay(convert.tempDiffToDisplay(v, s), s) - v)).toBeLessThan(tol);
        expect(Math.abs(convert.powerFromDisplay(convert.powerToDisplay(v, s), s) - v)).toBeLessThan(tol);
        expect(Math.abs(convert.pressureFromDisplay(convert.pressureToDisplay(v, s, "gauge"), s, "gauge") - v)).toBeLessThan(tol + 1e-6);
        expect(Math.abs(convert.lengthFromDisplay(convert.lengthToDisplay(v, s), s) - v)).toBeLessThan(tol);
        expect(Math.abs(convert.massFromDisplay(convert.massToDisplay(v, s), s) - v)).toBeLessThan(tol);
      }),
      { seed: 42, numRuns: 300 },
    );
  });

  it("formats the year's energy, its intensities and money", () => {
    // 1 ton·h = 12 000 Btu_IT = 3.516853 kWh; 1 m³ = 35.31467 ft³; 1 short ton = 907.18474 kg (NIST SP 811)
    expect(convert.coolingEnergyToDisplay(3.516853, "IP")).toBeCloseTo(1, 5);
    expect(convert.perVolumeToDisplay(35.31467, "IP")).toBeCloseTo(1, 5);
    expect(convert.perMassToDisplay(100, "IP")).toBeCloseTo(90.718474, 5);
    expect(fmt.energyElectrical(9_999)).toBe("9,999 kWh(e)");
    expect(fmt.energyElectrical(1_234_567)).toBe("1,234.6 MWh(e)");
    expect(fmt.energyCooling(3516.853, "IP")).toBe("1,000 ton·h");
    expect(fmt.energyPerVolume(12.345, "SI")).toBe("12.3 kWh(e)/m³·yr");
    expect(fmt.energyPerMass(100, "IP")).toBe("90.7 kWh(e)/ton");
    expect(fmt.money(12_345.678, "EUR")).toBe("€12,346");
    expect(fmt.money(-12.5, "USD")).toBe("\u2212US$12.50");
    expect(fmt.money(5, "GBP")).toBe("£5.00");
  });
});
