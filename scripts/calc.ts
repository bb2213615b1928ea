/**
 * `npx tsx scripts/calc.ts path/to/facility.json [--compact]`: computes the heat ledger of a
 * facility model (lib/engine/loads input format, see lib/engine/loads/README.md) and prints
 * the result as JSON on stdout. Invalid input prints the field-named issues as JSON on stderr
 * and exits with status 1; an unreadable file exits with status 2.
 */
import { readFileSync } from "node:fs";
import { LoadInputError, computeLedger } from "../lib/engine/loads";

const args = process.argv.slice(2).filter((a) => a !== "--");
const compact = args.includes("--compact");
const file = args.find((a) => !a.startsWith("--"));

if (!file) {
  process.stderr.write("usage: npx tsx scripts/calc.ts path/to/facility.json [--compact]\n");
  process.exit(2);
}

let raw: unknown;
try {
  raw = JSON.parse(readFileSync(file, "utf8"));
} catch (e) {
  process.stderr.write(`cannot read ${file}: ${(e as Error).message}\n`);
  process.exit(2);
}

try {
  const result = computeLedger(raw as Parameters<typeof computeLedger>[0]);
  process.stdout.write(JSON.stringify(result, null, compact ? 0 : 2) + "\n");
} catch (e) {
  if (e instanceof LoadInputError) {
    process.stderr.write(JSON.stringify({ error: e.code, message: e.message, issues: e.issues }, null, 2) + "\n");
    process.exit(1);
  }
  throw e;
}
