/** `npm run bench [filter]`: runs every lib/**\/*.bench.ts and prints median / p90 per case. */
import { readdirSync, statSync } from "node:fs";
import path from "node:path";
import { pathToFileURL } from "node:url";
import { formatResult, runCase, type BenchCase } from "./bench-harness";

function find(dir: string, out: string[] = []): string[] {
  for (const name of readdirSync(dir)) {
    const p = path.join(dir, name);
    if (statSync(p).isDirectory()) find(p, out);
    else if (name.endsWith(".bench.ts")) out.push(p);
  }
  return out;
}

const filter = process.argv[2];
const root = path.resolve(import.meta.dirname, "..");
const files = find(path.join(root, "lib")).sort();
console.log(`Rimeplan benchmarks — Node ${process.version}, ${files.length} file(s)`);
for (const file of files) {
  const mod = (await import(pathToFileURL(file).href)) as { default: BenchCase[] | (() => Promise<BenchCase[]>) };
  const cases = typeof mod.default === "function" ? await mod.default() : mod.default;
  console.log(`\n${path.relative(root, file)}`);
  for (const c of cases) {
    if (filter && !c.name.includes(filter) && !file.includes(filter)) continue;
    console.log("  " + formatResult(runCase(c)));
  }
}
