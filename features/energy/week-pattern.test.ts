import { describe, expect, it } from "vitest";
import { patternFromWeek, weekFromPattern } from "./week-pattern";

describe("weekly patterns of multipliers", () => {
  it("builds 7 × 24 multipliers: open hours on weekdays, the closed multiplier outside them, weekend factors", () => {
    const w = weekFromPattern({ from: 6, to: 22, open: 1.5, closed: 0.2, sat: 0.5, sun: 0 });
    expect(w).toHaveLength(7);
    expect(w.every((d) => d.length === 24)).toBe(true);
    expect([w[0][5], w[0][6], w[0][21], w[0][22]]).toEqual([0.2, 1.5, 1.5, 0.2]);
    expect([w[5][12], w[5][3], w[6][12]]).toEqual([0.75, 0.1, 0]);
  });

  it("reads back the pattern a week was made from, and says null for a week it cannot express", () => {
    const p = { from: 7, to: 19, open: 1, closed: 0.3, sat: 0.4, sun: 0.1 };
    expect(patternFromWeek(weekFromPattern(p))).toEqual(p);
    const flat = weekFromPattern({ from: 0, to: 24, open: 1, closed: 1, sat: 1, sun: 1 });
    expect(patternFromWeek(flat)).toEqual({ from: 0, to: 24, open: 1, closed: 1, sat: 1, sun: 1 });
    const custom = weekFromPattern(p).map((d) => [...d]);
    custom[2][10] = 0.9; // Wednesday differs from Monday
    expect(patternFromWeek(custom)).toBeNull();
  });
});
