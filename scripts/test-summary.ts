/** Sums the vitest and Playwright JSON reports into one "N passed, N failed" line. */
import { existsSync, readFileSync } from "node:fs";
import path from "node:path";

const dir = process.argv[2];
let passed = 0;
let failed = 0;
let skipped = 0;
const parts: string[] = [];
for (const suite of ["unit", "integration"]) {
  const f = path.join(dir, `${suite}.json`);
  if (!existsSync(f)) { parts.push(`${suite}: no report`); failed++; continue; }
  const r = JSON.parse(readFileSync(f, "utf8"));
  passed += r.numPassedTests; failed += r.numFailedTests; skipped += r.numPendingTests + (r.numTodoTests ?? 0);
  parts.push(`${suite} ${r.numPassedTests}/${r.numTotalTests}`);
}
const e2e = path.join(dir, "e2e.json");
if (existsSync(e2e)) {
  const s = JSON.parse(readFileSync(e2e, "utf8")).stats;
  passed += s.expected; failed += s.unexpected + s.flaky; skipped += s.skipped;
  parts.push(`e2e ${s.expected}/${s.expected + s.unexpected + s.flaky + s.skipped}`);
} else { parts.push("e2e: no report"); failed++; }
console.log(`\n${passed} passed, ${failed} failed, ${skipped} skipped (${parts.join(", ")})`);
