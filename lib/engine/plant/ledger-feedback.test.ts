import { readFileSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { computeRoomLoad, contextFromParsed, parseLedgerInput, type LedgerInput } from "../loads";
import { generateFacility } from "../loads/generate";
import { designCapacityWithFeedback, NO_FEEDBACK, withFeedback } from "./ledger-feedback";
import type { RoomFeedback } from "./evaporator";

// The shortcut must give exactly what the ledger gives for the same fan and defrost inputs:
// the reference here is the ledger's own computeRoomLoad, not a number of ours.
const example = JSON.parse(readFileSync(path.resolve(__dirname, "../../../seeds/data/example-facility.json"), "utf8"));
const facilities: LedgerInput[] = [parseLedgerInput(example), parseLedgerInput(generateFacility(30))];

const feedback = fc.record({
  evaporatorFans: fc.record({ powerW: fc.double({ min: 0, max: 50_000, noNaN: true }), hoursPerDay: fc.double({ min: 0, max: 24, noNaN: true }) }),
  defrost: fc.record({
    heaterW: fc.double({ min: 0, max: 100_000, noNaN: true }),
    minutesPerDefrost: fc.double({ min: 0, max: 120, noNaN: true }),
    defrostsPerDay: fc.double({ min: 0, max: 24, noNaN: true }),
    fractionToRoom: fc.double({ min: 0, max: 1, noNaN: true }),
  }),
}) satisfies fc.Arbitrary<RoomFeedback>;

describe("plant fan and defrost lines added to a ledger", () => {
  it("equal the ledger's own result for the same inputs, field by field", () => {
    for (const input of facilities) {
      const ctx = contextFromParsed(input);
      fc.assert(
        fc.property(fc.integer({ min: 0, max: input.rooms.length - 1 }), feedback, (i, fb) => {
          const room = input.rooms[i];
          const base = computeRoomLoad({ ...room, ...NO_FEEDBACK }, ctx);
          const ledger = computeRoomLoad({ ...room, ...fb }, ctx);
          const ours = withFeedback(base, fb);
          expect(ours).toEqual(ledger);
          const d = designCapacityWithFeedback(base, fb);
          expect(Math.abs(d - ledger.designCapacityW)).toBeLessThanOrEqual(1e-9 * Math.max(1, ledger.designCapacityW));
        }),
        { seed: 42, numRuns: 60 },
      );
    }
  });
});
