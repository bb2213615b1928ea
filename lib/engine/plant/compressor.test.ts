import { describe, expect, it } from "vitest";
import { isentropicEfficiency, volumetricEfficiency } from "./compressor";

describe("compressor efficiency curves", () => {
  it("stay inside the common-practice ranges over the usual pressure ratios", () => {
    // DOMAIN.md §5 (common practice): isentropic about 0.65–0.75 reciprocating and 0.60–0.78
    // screw across their range.
    for (let pr = 2; pr <= 9; pr += 0.5) {
      const eta = isentropicEfficiency({ type: "reciprocating" }, pr);
      expect(eta).toBeGreaterThanOrEqual(0.65);
      expect(eta).toBeLessThanOrEqual(0.75);
    }
    for (let pr = 2; pr <= 12; pr += 0.5) {
      const eta = isentropicEfficiency({ type: "screw" }, pr);
      expect(eta).toBeGreaterThanOrEqual(0.6);
      expect(eta).toBeLessThanOrEqual(0.78);
    }
  });

  it("lets volumetric efficiency fall with pressure ratio (clearance re-expansion)", () => {
    // Ideal reciprocating compressor: η_v = 1 − C·(PR^(1/n) − 1) (any applied-thermodynamics
    // text); with C = 0.05, n = 1.3 at PR 4: 1 − 0.05·(4^(1/1.3) − 1) = 0.9145, × 0.97 leakage.
    expect(volumetricEfficiency({ type: "reciprocating" }, 4)).toBeCloseTo(0.97 * (1 - 0.05 * (Math.pow(4, 1 / 1.3) - 1)), 12);
    let prev = 1;
    for (let pr = 1.5; pr <= 15; pr += 0.5) {
      const v = volumetricEfficiency({ type: "reciprocating" }, pr);
      expect(v).toBeLessThan(prev);
      prev = v;
    }
  });

  it("honours a user's fixed value or curve", () => {
    expect(isentropicEfficiency({ type: "screw", isentropic: 0.7 }, 20)).toBe(0.7);
    expect(isentropicEfficiency({ type: "screw", isentropic: { peak: 0.8, designRatio: 3, curvature: 0 } }, 9)).toBe(0.8);
    expect(volumetricEfficiency({ type: "scroll", volumetric: 0.9 }, 5)).toBe(0.9);
  });
});
