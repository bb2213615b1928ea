import { readFileSync } from "node:fs";
import path from "node:path";
import { beforeAll, describe, expect, it } from "vitest";
import { buildSchedule, computeFacility, facilityModelSchema, type FacilityModel } from "../model";
import { loadFluid } from "../thermo";

const root = path.resolve(__dirname, "../../..");
const ledger = JSON.parse(readFileSync(path.join(root, "seeds/data/example-facility.json"), "utf8"));
const plantFixture = JSON.parse(readFileSync(path.join(__dirname, "fixtures/harrowfield-plant.json"), "utf8"));

beforeAll(async () => {
  await loadFluid("R717");
});

function model(plant: unknown): FacilityModel {
  const { $comment, ...rest } = ledger;
  void $comment;
  return facilityModelSchema.parse({ schemaVersion: 1, ...rest, plant });
}

/** The frozen store's and blast freezer's coils defrosted by `type`, 20 min × 4 a day, 40 % to the room. */
function withDefrost(type: "electric" | "hot-gas") {
  const p = structuredClone(plantFixture);
  for (const e of p.evaporators.filter((x: { circuitId: string }) => x.circuitId === "lt")) {
    e.defrost = { type, minutesPerDefrost: 20, defrostsPerDay: 4, fractionToRoom: 0.4 };
  }
  return computeFacility(model(p));
}

describe("hot-gas defrost counted on the circuit that supplies it", () => {
  it("the compressors carry the defrost heat; the rooms carry only their share, as with electric heaters", () => {
    // The hot gas comes from the circuit's own discharge; the gas condensed in the coil goes back
    // to the low side and is pumped again (ASHRAE Handbook—Refrigeration, industrial systems,
    // hot-gas defrost, from memory), so the set supplying it carries the defrost heat
    // P·(min/60)·n/24 as a load at its suction — by hand for each coil below.
    const elec = withDefrost("electric");
    const hot = withDefrost("hot-gas");
    const lt = (r: ReturnType<typeof computeFacility>) => r.plant.circuits.find((c) => c.id === "lt")!;
    // The rooms see the same defrost share either way.
    for (const id of ["frozen-store", "blast"]) {
      const a = elec.ledger.rooms.find((r) => r.roomId === id)!.designCapacityW;
      const b = hot.ledger.rooms.find((r) => r.roomId === id)!.designCapacityW;
      expect(b).toBeCloseTo(a, 6);
    }
    const h = lt(hot).hotGasDefrost;
    const byHand = hot.plant.evaporators.filter((e) => e.circuitId === "lt").reduce((a, e) => a + (e.defrost.heaterW * (20 / 60) * 4) / 24, 0);
    expect(h.heatW).toBeCloseTo(byHand, 6);
    expect(h.byEvaporator.map((e) => e.tag).sort()).toEqual(["EV-1", "EV-2"]);
    expect(lt(elec).hotGasDefrost.heatW).toBe(0);
    // At the same suction and condensing, the cycle is linear in its load: the shaft power grows
    // by (Q + pump + q_hg)/(Q + pump); refrigeration (and so COP's numerator) stays the rooms'.
    const e = lt(elec);
    const g = lt(hot);
    expect(g.suctionC).toBeCloseTo(e.suctionC, 9);
    expect(g.refrigerationW).toBeCloseTo(e.refrigerationW, 6);
    expect(g.shaftPowerW / e.shaftPowerW).toBeCloseTo((g.refrigerationW + g.pumpPowerW + h.heatW) / (e.refrigerationW + e.pumpPowerW), 4);
    expect(g.cop).toBeLessThan(e.cop);
    // First and second law still close for the circuit and its chain.
    expect(g.energyBalance.relativeError).toBeLessThan(1e-3);
    expect(g.heatRejectedW).toBeCloseTo(g.refrigerationW + g.pumpPowerW + h.heatW + g.shaftPowerW, 0);
    for (const s of hot.plant.systems) expect(s.clausiusW_K).toBeGreaterThanOrEqual(0);
    // Electric defrost is electrical input, not a compressor load.
    expect(hot.plant.totals.electricDefrostW).toBe(0);
    expect(elec.plant.totals.electricDefrostW).toBeGreaterThan(0);
  });

  it("the schedule's compressor set states the hot gas it supplies (the natural input: defrost type hot-gas)", () => {
    const hot = withDefrost("hot-gas");
    const row = buildSchedule(hot.plant).find((r) => r.kind === "compressor-set" && r.circuitId === "lt")!;
    const c = hot.plant.circuits.find((x) => x.id === "lt")!;
    expect(row.dutyW).toBeCloseTo(c.refrigerationW + c.hotGasDefrost.heatW, 6);
    expect(row.ratingConditions).toMatch(/hot-gas defrost \(24-h mean\) for EV-1, EV-2/);
  });
});
