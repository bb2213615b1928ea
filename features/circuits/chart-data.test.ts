import { readFileSync } from "node:fs";
import path from "node:path";
import { beforeAll, describe, expect, it } from "vitest";
import { computeFacility, type FacilityResult } from "@/lib/engine/model";
import { getFluid, loadFluid } from "@/lib/engine/thermo";
import { parseEngineModel } from "@/features/facilities/engine-model";
import { circuitChart, logTicks } from "./chart-data";

const raw = JSON.parse(readFileSync(path.resolve(__dirname, "../../seeds/data/harrowfield-model.json"), "utf8"));
let res: FacilityResult;
beforeAll(async () => {
  await loadFluid("R717");
  res = computeFacility(parseEngineModel(raw, { designDryBulbC: 32, coincidentWetBulbC: 23, designRhPct: null, groundTempC: 12, elevationM: 150 }).data!);
});

describe("p–h chart data", () => {
  it("puts every state point inside the drawn pressure range, numbered in order", () => {
    for (const c of res.plant.circuits) {
      const ch = circuitChart(getFluid("R717"), c);
      expect(ch.cycle.map((p) => p.id)).toEqual(c.statePoints.map((_, i) => String(i + 1)));
      for (const p of ch.cycle) {
        expect(p.p).toBeGreaterThanOrEqual(ch.pMinPa);
        expect(p.p).toBeLessThanOrEqual(ch.pMaxPa);
      }
      // The dome closes: it starts and ends at the lowest pressure drawn.
      const d = ch.dome.points;
      expect(d[0].p).toBeCloseTo(d[d.length - 1].p, 6);
      expect(d[0].h).toBeLessThan(d[d.length - 1].h);
    }
  });

  it("gives 1-2-5 ticks per decade", () => {
    expect(logTicks(0.5e5, 30e5)).toEqual([0.5e5, 1e5, 2e5, 5e5, 10e5, 20e5]);
    expect(logTicks(1.1e5, 1.9e5)).toEqual([]);
  });
});
