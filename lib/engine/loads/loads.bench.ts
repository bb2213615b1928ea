import type { BenchCase } from "@/scripts/bench-harness";
import { computeRoomLoad, contextFromParsed, ledgerFromContext, parseLedgerInput, computeLedger } from "./ledger";
import { generateFacility } from "./generate";

const raw = generateFacility(200);
const parsed = parseLedgerInput(raw);
const ctx = contextFromParsed(parsed);
const oneRoom = parsed.rooms[10];

export default [
  { name: "loads: 200-room facility, validate + compute (computeLedger)", fn: () => computeLedger(raw), targetMedianUs: 5000 },
  { name: "loads: 200-room facility, recompute from a built context", fn: () => ledgerFromContext(ctx), targetMedianUs: 5000 },
  { name: "loads: one room recomputed (plant-loop step)", fn: () => computeRoomLoad(oneRoom, ctx), targetMedianUs: 25 },
] satisfies BenchCase[];
