import { readFileSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { z } from "zod";
import { computeLedger, ledgerInputSchema } from "./index";

describe("input schema", () => {
  it("converts to JSON Schema for the OpenAPI document, bounds included", () => {
    const json = z.toJSONSchema(ledgerInputSchema, { io: "input" }) as unknown as {
      properties: { rooms: { items: { properties: Record<string, { exclusiveMinimum?: number; maximum?: number; minimum?: number }> } } };
    };
    const lengthM = json.properties.rooms.items.properties.lengthM;
    expect(lengthM.exclusiveMinimum).toBe(0);
    expect(lengthM.maximum).toBe(1000);
    expect(json.properties.rooms.items.properties.rhPct.minimum).toBe(0);
    expect(json.properties.rooms.items.properties.rhPct.maximum).toBe(100);
  });
});

describe("example facility (seeds/data/example-facility.json, invented)", () => {
  const file = path.resolve(__dirname, "../../../seeds/data/example-facility.json");
  const result = computeLedger(JSON.parse(readFileSync(file, "utf8")));

  it("computes every room with finite numbers and states its options", () => {
    expect(result.rooms.map((r) => r.roomId)).toEqual(["frozen-store", "blast", "apples", "ripening", "dock"]);
    for (const r of result.rooms) {
      for (const v of [r.averageLoadW, r.requiredCapacityW, r.peakHourW, r.latentW, ...r.hourly]) expect(Number.isFinite(v)).toBe(true);
      expect(r.components.length).toBeGreaterThan(0);
      for (const c of r.components) {
        expect(c.trace.method.length).toBeGreaterThan(0);
        expect(c.trace.source.length).toBeGreaterThan(0);
      }
    }
    expect(result.options.statements.length).toBeGreaterThanOrEqual(2);
  });

  it("facility totals are the sums of the rooms", () => {
    // Definition of the totals: Σ rooms.
    const sum = (f: (r: (typeof result.rooms)[number]) => number) => result.rooms.reduce((a, r) => a + f(r), 0);
    expect(result.totals.requiredCapacityW).toBeCloseTo(sum((r) => r.requiredCapacityW), 6);
    expect(result.totals.totalEnergyKWhPerDay).toBeCloseTo(sum((r) => r.totalEnergyKWhPerDay), 6);
    for (let h = 0; h < 24; h++) expect(result.totals.hourly[h]).toBeCloseTo(sum((r) => r.hourly[h]), 6);
  });

  it("site pressure at 150 m from the standard atmosphere", () => {
    // 101325·(1 − 2.25577e-5·150)^5.2559 = 99 536 Pa (ASHRAE Fundamentals standard-atmosphere formula, by hand).
    expect(result.site.pressurePa).toBeCloseTo(99536, -1);
  });
});
