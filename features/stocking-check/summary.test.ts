import { describe, expect, it } from "vitest";
import type { CapacityCheck, StockingCheckResult } from "@/lib/engine/stocking";
import { checkLine, emailText, verdictLine } from "./summary";

const check = (requiredW: number, availableW: number, verdict: CapacityCheck["verdict"]): CapacityCheck => ({
  item: { kind: "room-evaporators", id: "apples", label: "Apples room evaporators", tags: ["EV-3"] },
  basis: "daily",
  quantity: "refrigeration",
  requiredW,
  availableW,
  headroomW: availableW - requiredW,
  headroomFraction: (availableW - requiredW) / requiredW,
  verdict,
});

function result(c: CapacityCheck): StockingCheckResult {
  return {
    verdict: c.verdict,
    limiting: c,
    checks: [c],
    safetyFactor: { placement: "load", statement: "The safety factor is inside the required load." },
    tightHeadroomFraction: 0.1,
    rooms: [],
    notes: [],
    solves: [{ roomId: "apples", maxTonnesPerDay: { value: 21.5, status: "boundary", tolerance: 0.01, range: [0, 100000], iterations: 14 }, minPullDownHours: { value: null, status: "none", tolerance: 0.05, range: [0.5, 168], iterations: 1 } }],
  };
}

describe("stocking check in words", () => {
  it("states the verdict, the kW short and the limiting item", () => {
    // Hand-worked: 37.6 kW required, 34.0 kW available → 3.6 kW short.
    const r = result(check(37_600, 34_000, "shortfall"));
    expect(verdictLine(r, "SI")).toBe("Shortfall: 3.60 kW(r) short at Apples room evaporators (daily load), the limiting item");
    expect(checkLine(r.checks[0], "SI")).toBe("Apples room evaporators (daily load): needs 37.6 kW(r), has 34.0 kW(r) — 3.60 kW(r) short");
    // 1 Btu/h = 0.29307107 W (NIST SP 811): 3600 W ≈ 12 284 Btu/h.
    expect(verdictLine(r, "IP")).toMatch(/^Shortfall: 12,284 Btu\/h short/);
  });

  it("e-mails a summary with the link, the solver and the codes notice", () => {
    const r = result(check(30_000, 34_000, "fits"));
    const m = emailText({ name: "Autumn", facilityName: "North store", author: "Oscar", result: r, unitSystem: "SI", roomNames: { apples: "Apples room" }, link: "http://localhost/w/x/f/y/stocking?s=z" });
    expect(m.subject).toBe('Stocking check "Autumn" — Fits');
    expect(m.text).toContain("Fits: 4.00 kW(r) headroom at Apples room evaporators (daily load)");
    expect(m.text).toContain("Apples room: largest intake that fits 21.50 t/day (±0.01 t/day); shortest pull-down that fits no pull-down up to 168 h fits");
    expect(m.text).toContain("Open it in Rimeplan: http://localhost/w/x/f/y/stocking?s=z");
    expect(m.text).toMatch(/licensed practice/);
  });
});
