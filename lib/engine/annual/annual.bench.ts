import { readFileSync } from "node:fs";
import path from "node:path";
import type { BenchCase } from "@/scripts/bench-harness";
import { generateFacility } from "../loads/generate";
import { facilityModelSchema, type FacilityModel } from "../model";
import { generatePlant } from "../plant/plant.bench";
import { loadFluid } from "../thermo";
import { runAnnual, sineDayYear, type MonthlyClimateRaw } from ".";

/** An invented temperate climate (monthly means), for the benchmark year. */
export const BENCH_CLIMATE: MonthlyClimateRaw = {
  label: "invented temperate inland site",
  meanDryBulbC: [2, 3, 6, 9, 13, 16, 19, 18, 15, 11, 6, 3],
  dailyRangeK: [6, 7, 8, 10, 11, 11, 12, 11, 10, 8, 6, 6],
  meanRhPct: [85, 82, 78, 74, 72, 70, 68, 70, 75, 80, 85, 87],
};

/** The demo facility (seeds/data/harrowfield-model.json) with the demo site's design conditions. */
export function demoModel(): FacilityModel {
  const raw = JSON.parse(readFileSync(path.resolve(import.meta.dirname, "../../../seeds/data/harrowfield-model.json"), "utf8"));
  raw.site = { ...raw.site, designDryBulbC: 32, coincidentWetBulbC: 23, groundTempC: 12, elevationM: 150 };
  return facilityModelSchema.parse(raw);
}

export default async function cases(): Promise<BenchCase[]> {
  await Promise.all([loadFluid("R717"), loadFluid("R744"), loadFluid("R449A")]);
  const year = sineDayYear(BENCH_CLIMATE, 2025);
  const demo = demoModel();
  const ledger = generateFacility(200);
  const big: FacilityModel = facilityModelSchema.parse({
    schemaVersion: 1,
    ...ledger,
    plant: generatePlant(ledger.rooms.map((r) => ({ id: r.id, setPointC: r.setPointC }))),
  });
  return [
    { name: "annual: demo facility, a full year (fast method)", fn: () => runAnnual(demo, year), batch: 1, samples: 15, targetMedianUs: 1_000_000 },
    { name: "annual: 200 rooms + 20 circuits, a full year (fast method)", fn: () => runAnnual(big, year), batch: 1, samples: 5, targetMedianUs: 5_000_000 },
  ];
}
