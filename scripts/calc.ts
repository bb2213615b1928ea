/**
 * `npm run calc -- path/to/facility.json [--compact]`: computes a facility model (ledger and
 * plant; a document with schemaVersion) or a heat-ledger input (ledger only) and prints the
 * result as JSON — the same function POST /api/v1/calculate runs, so both give the same
 * numbers. Invalid input prints the field-named issues as JSON on stderr and exits 1; an
 * unreadable file exits 2.
 */
import { readFileSync } from "node:fs";
import { calculate, CalcError } from "../features/calculate/run";

const args = process.argv.slice(2).filter((a) => a !== "--");
const compact = args.includes("--compact");
const file = args.find((a) => !a.startsWith("--"));

if (!file) {
  process.stderr.write("usage: npm run calc -- path/to/facility.json [--compact]\n");
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
  const out = await calculate(raw);
  process.stdout.write(JSON.stringify(out, null, compact ? 0 : 2) + "\n");
} catch (e) {
  if (e instanceof CalcError) {
    process.stderr.write(JSON.stringify({ error: e.kind, message: e.message, issues: e.issues }, null, 2) + "\n");
    process.exit(1);
  }
  throw e;
}
