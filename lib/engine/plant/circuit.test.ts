import { beforeAll, describe, expect, it } from "vitest";
import fc from "fast-check";
import { getFluid, loadFluid } from "../thermo";
import { computeCircuits } from "./circuit";
import { PlantError } from "./errors";
import { sizeRoomEvaporators } from "./evaporator";
import { plantInputSchema, type PlantInputRaw } from "./schema";

beforeAll(async () => {
  await Promise.all([loadFluid("R717"), loadFluid("R449A")]);
});

const rooms = new Map([
  ["cold", { setPointC: -25, rhPct: 80 }],
  ["fresh", { setPointC: 2, rhPct: 92 }],
]);
const roomGeom = (id: string) => ({ id, ...rooms.get(id)!, lengthM: 30, widthM: 20 });

function run(raw: PlantInputRaw, duties: Record<string, number> = { cold: 100_000, fresh: 50_000 }) {
  const plant = plantInputSchema.parse(raw);
  const sized = [...rooms.keys()].flatMap((id) =>
    sizeRoomEvaporators(roomGeom(id), plant.evaporators.filter((e) => e.roomId === id), duties[id] ?? 0),
  );
  return computeCircuits(sized, { plant, ambient: { dryBulbC: 32, wetBulbC: 23 }, rooms, getFluid });
}

const oneCircuit = (over: Record<string, unknown> = {}, evOver: Record<string, unknown> = {}): PlantInputRaw => ({
  evaporators: [{ id: "e1", tag: "EV-1", roomId: "cold", circuitId: "c1", ...evOver }],
  circuits: [{ id: "c1", tag: "C-1", refrigerant: "R717", heatRejection: { to: "condenser", condenserId: "cd" }, ...over }],
  condensers: [{ id: "cd", tag: "CD-1", type: "air-cooled" }],
});

describe("circuit temperatures", () => {
  it("takes suction from the coldest evaporator less the allowance, condensing from the condenser", () => {
    const { circuits } = run(oneCircuit({ suctionLineAllowanceK: 2 }, { tdK: 6 }));
    const c = circuits[0];
    // −25 °C room − 6 K TD − 2 K allowance; air-cooled 32 °C dry bulb + 12 K (common practice).
    expect(c.suctionC).toBe(-33);
    expect(c.condensingC).toBe(44);
    expect(c.sinkKind).toBe("dry-bulb");
    // Suction superheat follows the DX feed's default of 6 K (common practice 4–8 K).
    expect(c.superheatK).toBe(6);
  });

  it("gives the low-side design pressure for standstill at 32 °C", () => {
    // Ammonia saturation pressure at 32 °C: 1238 kPa (ASHRAE Fundamentals R717 table, from memory).
    const { circuits } = run(oneCircuit());
    expect(circuits[0].designPressures.lowSide.pPa / 1000).toBeCloseTo(1238, -1);
    // High side of an air-cooled condenser at 55 °C: 2311 kPa (same table, from memory).
    expect(Math.abs(circuits[0].designPressures.highSide.pPa / 1000 - 2311) / 2311).toBeLessThan(0.005);
  });

  it("adds the liquid pump's input for pumped recirculation", () => {
    // P = CR·(Q/h_fg)·Δp/(ρ_l·η) with ammonia at −30 °C: h_fg 1359.7 kJ/kg, ρ_l 677.8 kg/m³
    // (ASHRAE Fundamentals R717 table, from memory): 4 × 100 kW / 1359.7 kJ/kg × 200 kPa /
    // (677.8 × 0.45) = 192.9 W. The suction here is −30 °C: room −25, TD 4, allowance 1.
    const { circuits } = run(oneCircuit({}, { tdK: 4, feed: { type: "pumped", circulationRatio: 4 } }));
    expect(circuits[0].suctionC).toBe(-30);
    expect(circuits[0].pumpPowerW).toBeCloseTo(192.9, 0);
    expect(circuits[0].superheatK).toBe(0);
  });
});

describe("designer warnings", () => {
  it("flags a high single-stage pressure ratio and discharge temperature", () => {
    // Single reciprocating stage, −30 °C suction to 33 °C condensing (evaporative, 23 °C wet
    // bulb + 10 K): ratio about 10.7 (above about 8, common practice), discharge above 130 °C
    // (above 150 °C the warning is the stronger DISCHARGE_TEMP_EXTREME).
    const raw = oneCircuit({ compressor: { type: "reciprocating" } }, { tdK: 4 });
    raw.condensers = [{ id: "cd", tag: "CD-1", type: "evaporative" }];
    const { warnings, circuits } = run(raw, { cold: 100_000 });
    expect(circuits[0].pressureRatio).toBeGreaterThan(8);
    const codes = warnings.map((w) => w.code);
    expect(codes).toContain("PRESSURE_RATIO_HIGH");
    expect(circuits[0].dischargeTempC).toBeGreaterThan(130);
    expect(codes).toContain(circuits[0].dischargeTempC > 150 ? "DISCHARGE_TEMP_EXTREME" : "DISCHARGE_TEMP_HIGH");
    expect(warnings.find((w) => w.code === "PRESSURE_RATIO_HIGH")!.message).toMatch(/two-stage|cascade/);
  });

  it("flags a TD too large for a high-humidity room", () => {
    const raw: PlantInputRaw = {
      ...oneCircuit(),
      evaporators: [{ id: "e2", tag: "EV-2", roomId: "fresh", circuitId: "c1", tdK: 9 }],
    };
    const { warnings } = run(raw, { fresh: 50_000 });
    expect(warnings.find((w) => w.code === "TD_HIGH_FOR_HUMIDITY")?.ref).toEqual({ kind: "evaporator", id: "e2", tag: "EV-2" });
  });

  it("notes a warm evaporator held above the circuit's suction", () => {
    const raw: PlantInputRaw = {
      ...oneCircuit(),
      evaporators: [
        { id: "e1", tag: "EV-1", roomId: "cold", circuitId: "c1" },
        { id: "e2", tag: "EV-2", roomId: "fresh", circuitId: "c1" },
      ],
    };
    const { warnings } = run(raw);
    expect(warnings.some((w) => w.code === "SUCTION_BELOW_EVAPORATOR" && w.ref.id === "e2")).toBe(true);
  });
});

describe("zeotropic blends", () => {
  it("uses the dew point for suction and condensing by default", () => {
    const { circuits } = run(oneCircuit({ refrigerant: "R449A", compressor: { type: "scroll" } }));
    const c = circuits[0];
    const f = getFluid("R449A");
    const satE = f.saturationAtP(c.stages[0].suctionPa);
    // Dew convention (EN 12900): the suction pressure's dew point is the suction temperature.
    expect(satE.tDewK - 273.15).toBeCloseTo(c.suctionC, 6);
    // R449A glides several kelvin (ASHRAE 34 lists it as zeotropic; about 4–6 K, from memory).
    expect(satE.glideK).toBeGreaterThan(2);
    expect(c.energyBalance.relativeError).toBeLessThan(1e-3);
    expect(c.cop).toBeLessThan(c.copCarnot!);
  });
});

describe("random valid circuits", () => {
  it("either satisfy both laws or fail with a typed error naming an input — never NaN", () => {
    const arb = fc.record({
      refrigerant: fc.constantFrom("R717", "R449A"),
      arrangement: fc.constantFrom("single-stage", "two-stage"),
      type: fc.constantFrom("reciprocating", "screw", "scroll"),
      tdK: fc.double({ min: 3, max: 12, noNaN: true }),
      roomId: fc.constantFrom("cold", "fresh"),
      condenser: fc.constantFrom("air-cooled", "evaporative", "water-cooled"),
      subcoolingK: fc.double({ min: 0, max: 8, noNaN: true }),
      feed: fc.constantFrom("dx", "pumped"),
    });
    let computed = 0;
    fc.assert(
      fc.property(arb, (a) => {
        const raw: PlantInputRaw = {
          evaporators: [{ id: "e", tag: "EV-1", roomId: a.roomId, circuitId: "c1", tdK: a.tdK, feed: { type: a.feed } }],
          circuits: [
            {
              id: "c1",
              tag: "C-1",
              refrigerant: a.refrigerant,
              arrangement: a.arrangement,
              compressor: { type: a.type },
              subcoolingK: a.subcoolingK,
              heatRejection: { to: "condenser", condenserId: "cd" },
            },
          ],
          condensers: [{ id: "cd", tag: "CD-1", type: a.condenser }],
        };
        let out: ReturnType<typeof run> | undefined;
        try {
          out = run(raw);
        } catch (e) {
          expect(e).toBeInstanceOf(PlantError);
          expect((e as PlantError).field).toMatch(/^plant\./);
          return;
        }
        const c = out.circuits[0];
        for (const v of [c.cop, c.shaftPowerW, c.massFlowKgS, c.heatRejectedW, c.dischargeTempC]) expect(Number.isFinite(v)).toBe(true);
        expect(c.energyBalance.relativeError).toBeLessThan(1e-3);
        expect(c.cop).toBeLessThan(c.copCarnot!);
        for (const v of Object.values(c.entropyGeneration.byComponentW_K)) expect(v).toBeGreaterThanOrEqual(0);
        computed++;
      }),
      { seed: 42, numRuns: 40 },
    );
    // The generator mostly yields computable circuits; errors are the exception.
    expect(computed).toBeGreaterThan(30);
  });
});
