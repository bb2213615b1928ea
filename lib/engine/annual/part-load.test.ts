import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { leadPowerFraction, powerFraction, SLIDE_VALVE_CURVE } from "./part-load";
import type { CapacityControl } from "./schema";

// Sources of the rules checked here are named in part-load.ts: the cycling degradation form
// PLF = 1 − C_d·(1 − PLR) (AHRI Standard 210/240), the slide-valve curve shape after Stoecker's
// Industrial Refrigeration Handbook (from memory), the variable-speed rule as stated.
describe("part load by capacity control", () => {
  it("on/off cycling: PLR / (1 − C_d·(1 − PLR)), worked by hand", () => {
    expect(leadPowerFraction(0.5, { type: "onoff", cyclingLossCd: 0.25 })).toBeCloseTo(0.5 / 0.875, 12);
    expect(leadPowerFraction(1, { type: "onoff", cyclingLossCd: 0.25 })).toBe(1);
    expect(leadPowerFraction(0, { type: "onoff", cyclingLossCd: 0.25 })).toBe(0);
  });
  it("slide valve: the curve, and cycling at the lowest step below it", () => {
    const sv = { type: "slide-valve" as const, cyclingLossCd: 0.25 };
    expect(leadPowerFraction(0.5, sv)).toBeCloseTo(0.66, 12);
    expect(leadPowerFraction(0.625, sv)).toBeCloseTo((0.66 + 0.84) / 2, 12);
    // 0.05 is half the lowest step (0.1 at 0.33 of full power): 0.33·0.5 / (1 − 0.25·0.5).
    expect(leadPowerFraction(0.05, sv)).toBeCloseTo((SLIDE_VALVE_CURVE[0][1] * 0.5) / 0.875, 12);
    // A user curve replaces the default.
    expect(leadPowerFraction(0.5, { ...sv, curve: [[0.2, 0.4], [1, 1]] })).toBeCloseTo(0.4 + (0.6 * 0.3) / 0.8, 12);
  });
  it("variable speed: PLR / (η_rel(speed)·η_drive), cycling below the lowest speed", () => {
    const v = { type: "variable-speed" as const, minSpeed: 0.3, driveEfficiency: 0.97, cyclingLossCd: 0.25 };
    expect(leadPowerFraction(0.5, v)).toBeCloseTo(0.5 / (0.97 * 0.97), 12);
    expect(leadPowerFraction(1, v)).toBeCloseTo(1 / 0.97, 12);
    const atMin = 0.3 / (0.88 * 0.97);
    expect(leadPowerFraction(0.15, v)).toBeCloseTo((atMin * 0.5) / 0.875, 12);
  });
  it("staged: n − 1 machines at full load, the lead one trimming", () => {
    const st: CapacityControl = { type: "staged", compressors: 3, lead: { type: "slide-valve", cyclingLossCd: 0.25 } };
    expect(powerFraction(0.5, st, 3)).toBeCloseTo((1 + 0.66) / 3, 12);
    expect(powerFraction(2 / 3, st, 3)).toBeCloseTo(2 / 3, 12);
    expect(powerFraction(1, st, 3)).toBeCloseTo(1, 12);
    // The set size defaults to the circuit's running units.
    expect(powerFraction(0.5, { type: "staged", lead: { type: "onoff", cyclingLossCd: 0 } }, 2)).toBeCloseTo(0.5, 12);
  });
  it("never better than ideal, never decreasing with load, never above full load (fixed speed)", () => {
    const controls: CapacityControl[] = [
      { type: "onoff", cyclingLossCd: 0.2 },
      { type: "slide-valve", cyclingLossCd: 0.25 },
      { type: "variable-speed", minSpeed: 0.25, driveEfficiency: 0.96, cyclingLossCd: 0.25 },
      { type: "staged", compressors: 4, lead: { type: "slide-valve", cyclingLossCd: 0.25 } },
    ];
    fc.assert(
      fc.property(fc.double({ min: 0.001, max: 0.999, noNaN: true }), fc.double({ min: 0, max: 0.05, noNaN: true }), (plr, d) => {
        for (const c of controls) {
          const p = powerFraction(plr, c, 4);
          expect(p).toBeGreaterThanOrEqual(plr - 1e-12);
          expect(powerFraction(Math.min(1, plr + d), c, 4)).toBeGreaterThanOrEqual(p - 1e-12);
          if (c.type !== "variable-speed") expect(p).toBeLessThanOrEqual(1 + 1e-12);
        }
      }),
      { numRuns: 300 },
    );
  });
});
