/**
 * Writes an invented hourly weather year (fictional: see seeds/invented-weather.ts) as the
 * plain CSV Rimeplan reads. Usage: `npx tsx scripts/invent-weather.ts out.csv [year] [seed]`.
 */
import { writeFileSync } from "node:fs";
import { HARROWFIELD_CLIMATE, inventYear, yearToCsv } from "../seeds/invented-weather";

const [out, year, seed] = process.argv.slice(2);
if (!out) {
  console.error("usage: npx tsx scripts/invent-weather.ts out.csv [year] [seed]");
  process.exit(2);
}
const y = inventYear(HARROWFIELD_CLIMATE, { year: year ? Number(year) : 2025, seed: seed ? Number(seed) : 1 });
writeFileSync(out, yearToCsv(y));
console.log(`wrote ${out}: ${y.dryBulbC.length} hours of an invented year ${y.year}, ${Math.min(...y.dryBulbC)} to ${Math.max(...y.dryBulbC)} °C`);
