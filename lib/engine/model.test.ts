import { readFileSync } from "node:fs";
import path from "node:path";
import { beforeAll, describe, expect, it } from "vitest";
import { loadFluid } from "./thermo";
import { computeLedger, LoadInputError } from "./loads";
import {
  buildSchedule,
  computeFacility,
  createFacilityEngine,
  facilityModelSchema,
  parseFacilityModel,
  rerateInstalled,
  stullWetBulbC,
  type FacilityModel,
} from "./model";
import { PlantError } from "./plant/errors";

const root = path.resolve(__dirname, "../..");
const ledger = JSON.parse(readFileSync(path.join(root, "seeds/data/example-facility.json"), "utf8"));
const plantFixture = JSON.parse(readFileSync(path.join(__dirname, "plant/fixtures/harrowfield-plant.json"), "utf8"));

beforeAll(async () => {
  await Promise.all([loadFluid("R717"), loadFluid("R744")]);
});

function model(plant: unknown = plantFixture): FacilityModel {
  const { $comment, ...rest } = ledger;
  void $comment;
  return facilityModelSchema.parse({ schemaVersion: 1, ...rest, plant });
}

function thrown(fn: () => unknown): PlantError {
  try {
    fn();
  } catch (e) {
    if (e instanceof PlantError) return e;
    throw e;
  }
  throw new Error("expected a PlantError");
}

describe("facility model schema", () => {
  it("names the field and the allowed range of a bad input", () => {
    const bad = structuredClone(plantFixture);
    bad.evaporators[0].tdK = 50;
    bad.evaporators[1].circuitId = "nope";
    bad.evaporators[2].roomId = "nowhere";
    const r = facilityModelSchema.safeParse({ schemaVersion: 1, ...ledger, plant: bad });
    expect(r.success).toBe(false);
    const issues = r.error!.issues.map((i) => [i.path.join("."), i.message]);
    expect(issues).toContainEqual(["plant.evaporators.0.tdK", "must be between 1 and 20 K"]);
    expect(issues).toContainEqual(["plant.evaporators.1.circuitId", 'no circuit "nope"']);
    expect(issues).toContainEqual(["plant.evaporators.2.roomId", 'no room with id "nowhere"']);
  });

  it("throws the ledger's input error type, field by field, from parseFacilityModel", () => {
    const bad = structuredClone(plantFixture);
    bad.circuits[0].subcoolingK = -1;
    let err: unknown;
    try {
      parseFacilityModel({ schemaVersion: 1, ...ledger, plant: bad });
    } catch (e) {
      err = e;
    }
    expect(err).toBeInstanceOf(LoadInputError);
    expect((err as LoadInputError).field).toBe("plant.circuits.0.subcoolingK");
  });

  it("refuses a cascade loop and a transcritical ammonia circuit", () => {
    const bad = structuredClone(plantFixture);
    bad.circuits[0].heatRejection = { to: "circuit", circuitId: "mt" };
    bad.circuits[1].heatRejection = { to: "circuit", circuitId: "lt" };
    bad.circuits[1].arrangement = "transcritical";
    const r = facilityModelSchema.safeParse({ schemaVersion: 1, ...ledger, plant: bad });
    const msgs = r.error!.issues.map((i) => `${i.path.join(".")}: ${i.message}`);
    expect(msgs.some((m) => m.startsWith("plant.circuits.0.heatRejection.circuitId: cascade loop"))).toBe(true);
    expect(msgs).toContain("plant.circuits.1.arrangement: transcritical is allowed for R744 only");
  });
});

describe("computeFacility without a plant", () => {
  it("gives the ledger's own result and an empty plant", () => {
    const { $comment, ...rest } = ledger;
    void $comment;
    const m = facilityModelSchema.parse({ schemaVersion: 1, ...rest });
    const res = computeFacility(m);
    expect(res.ledger.rooms).toEqual(computeLedger(rest).rooms);
    expect(res.ledger.totals).toEqual(computeLedger(rest).totals);
    expect(res.plant.circuits).toEqual([]);
    expect(res.plant.warnings).toEqual([]);
  });
});

describe("computeFacility: ledger and plant together", () => {
  it("feeds the sized evaporators' fan and defrost heat back into each room's ledger", () => {
    const m = model();
    const res = computeFacility(m);
    for (const fp of res.fixedPoint.rooms) expect(fp.residual).toBeLessThanOrEqual(res.fixedPoint.tolerance);
    for (const room of res.ledger.rooms) {
      const evs = res.plant.evaporators.filter((e) => e.roomId === room.roomId);
      const duty = evs.reduce((a, e) => a + e.dutyW, 0);
      // The evaporators serve exactly the room's converged design capacity …
      expect(Math.abs(duty - room.designCapacityW) / room.designCapacityW).toBeLessThan(1e-6);
      // … and the ledger carries their fans: Σ P·h/24 (the ledger's q = P·h/24).
      const fans = room.components.find((c) => c.kind === "evaporatorFans")?.powerW ?? 0;
      const expected = evs.reduce((a, e) => a + (e.fanPowerW * e.fanHoursPerDay) / 24, 0);
      expect(Math.abs(fans - expected) / expected).toBeLessThan(1e-9);
    }
  });

  it("checks every circuit by the first and second law and ties the systems together", () => {
    const res = computeFacility(model());
    expect(res.plant.circuits).toHaveLength(2);
    for (const c of res.plant.circuits) {
      expect(c.energyBalance.relativeError).toBeLessThan(1e-3);
      expect(c.cop).toBeLessThan(c.copCarnot!);
      expect(c.entropyGeneration.totalW_K).toBeGreaterThan(0);
      expect(Math.abs(c.entropyGeneration.totalW_K - c.entropyGeneration.clausiusW_K) / c.entropyGeneration.clausiusW_K).toBeLessThan(1e-6);
      expect(c.electricalW).toBeGreaterThan(c.shaftPowerW);
    }
    const lt = res.plant.circuits.find((c) => c.id === "lt")!;
    expect(lt.stages.map((s) => s.name)).toEqual(["low", "high"]);
    // Ammonia below −33.3 °C (its normal boiling point, any NH3 table) runs in vacuum.
    expect(res.plant.warnings.some((w) => w.code === "SUCTION_BELOW_ATMOSPHERIC" && w.ref.id === "lt")).toBe(true);
    expect(res.plant.cautions.map((c) => c.safetyGroup)).toEqual(["B2L"]);
  });

  it("reports a fixed point that cannot converge as an error naming the room", () => {
    const p = structuredClone(plantFixture);
    // Heaters of 3 W per W of duty, 12 h of defrost a day, all of it into the room: the defrost
    // heat alone outgrows the duty it would need (gain ≈ 3·12/24·1.1·24/20 ≈ 2).
    p.evaporators[0].defrost = { type: "electric", heaterWPerWDuty: 3, minutesPerDefrost: 60, defrostsPerDay: 12, fractionToRoom: 1 };
    const e = thrown(() => computeFacility(model(p)));
    expect(e.code).toBe("NO_CONVERGENCE");
    expect(e.field).toBe("rooms.0");
  });

  it("rejects a condensing temperature below the ambient sink as a second-law violation naming it", () => {
    const p = structuredClone(plantFixture);
    p.condensers[0] = { id: "cd1", tag: "CD-1", type: "user-set", condensingC: 20 };
    // 20 °C condensing with a 32 °C dry-bulb sink: heat would flow from cold to hot.
    const e = thrown(() => computeFacility(model(p)));
    expect(e.code).toBe("SECOND_LAW_VIOLATION");
    expect(e.field).toBe("plant.condensers.0.condensingC");
  });

  it("refuses a suction temperature below the fluid's range, naming the evaporator", () => {
    const p = structuredClone(plantFixture);
    p.circuits[0].refrigerant = "R744";
    p.circuits[0].arrangement = "single-stage";
    p.circuits[0].heatRejection = { to: "circuit", circuitId: "mt", condensingC: -5, approachK: 5 };
    p.circuits[0].suctionLineAllowanceK = 3;
    p.evaporators[1].tdK = 20;
    // The blast freezer at −35 °C, TD 20 K, 3 K suction allowance → −58 °C, below CO2's triple
    // point −56.56 °C (Span & Wagner 1996).
    const e = thrown(() => computeFacility(model(p)));
    expect(e.code).toBe("INPUT_OUT_OF_RANGE");
    expect(e.field).toBe("plant.evaporators.1.tdK");
  });
});

describe("cascade input errors", () => {
  it("names the cascade condensing temperature when it is not above the low stage's suction", () => {
    const p = structuredClone(plantFixture);
    p.circuits[0] = {
      id: "lt",
      tag: "C-1",
      refrigerant: "R744",
      compressor: { type: "reciprocating" },
      // −45 °C condensing against a −43 °C suction (blast freezer −35 °C, TD 7 K, 1 K allowance).
      heatRejection: { to: "circuit", circuitId: "mt", condensingC: -45, approachK: 5 },
    };
    const e = thrown(() => computeFacility(model(p)));
    expect(e.code).toBe("INPUT_OUT_OF_RANGE");
    expect(e.field).toBe("plant.circuits.0.heatRejection.condensingC");
  });
});

describe("cascade and transcritical CO2", () => {
  it("runs a CO2 low stage into the ammonia high stage through a cascade exchanger", () => {
    const p = structuredClone(plantFixture);
    p.circuits[0] = {
      id: "lt",
      tag: "C-1",
      refrigerant: "R744",
      compressor: { type: "reciprocating" },
      heatRejection: { to: "circuit", circuitId: "mt", condensingC: -5, approachK: 5 },
    };
    const res = computeFacility(model(p));
    const lt = res.plant.circuits.find((c) => c.id === "lt")!;
    const mt = res.plant.circuits.find((c) => c.id === "mt")!;
    expect(lt.sinkKind).toBe("cascade");
    // The high stage evaporates at −5 °C condensing − 5 K approach = −10 °C, and its suction
    // is that less its 1 K suction-line allowance (hand arithmetic on the inputs).
    expect(lt.sinkC).toBe(-10);
    expect(mt.cascadeFromCircuitIds).toEqual(["lt"]);
    // The high stage takes the low stage's whole rejected heat as load.
    expect(Math.abs(mt.refrigerationW - mt.evaporatorRoomDutyW - lt.heatRejectedW)).toBeLessThan(1e-6 * lt.heatRejectedW);
    expect(mt.suctionC).toBeLessThanOrEqual(-11);
    const sys = res.plant.systems.find((s) => s.circuitId === "mt")!;
    expect(sys.circuitIds.sort()).toEqual(["lt", "mt"]);
    // Whole chain, room air to ambient: entropy sums and the Clausius form agree, COP < Carnot.
    expect(Math.abs(sys.entropyGenerationW_K - sys.clausiusW_K) / sys.clausiusW_K).toBeLessThan(1e-6);
    // First law over the chain: rooms + all work in = heat rejected to ambient, to 0.1 %.
    expect(sys.energyBalance.relativeError).toBeLessThan(1e-3);
    expect(sys.cop).toBeLessThan(sys.copCarnot!);
    const schedule = buildSchedule(res.plant);
    expect(schedule.some((r) => r.kind === "cascade-hx" && r.tag === "CHX-C-1")).toBe(true);
    expect(res.plant.cautions.map((c) => c.refrigerant).sort()).toEqual(["R717", "R744"]);
  });

  it("flags transcritical operation and the CO2 standstill pressure", () => {
    const p = structuredClone(plantFixture);
    p.circuits[1] = {
      id: "mt",
      tag: "C-2",
      refrigerant: "R744",
      arrangement: "transcritical",
      compressor: { type: "reciprocating" },
      heatRejection: { to: "condenser", condenserId: "gc" },
    };
    p.condensers.push({ id: "gc", tag: "GC-1", type: "air-cooled" });
    const res = computeFacility(model(p));
    const mt = res.plant.circuits.find((c) => c.id === "mt")!;
    expect(mt.cycle).toBe("transcritical");
    // CO2 critical pressure 7.3773 MPa (Span & Wagner 1996): the gas cooler runs above it.
    expect(mt.gasCoolerPa!).toBeGreaterThan(7.3773e6);
    const codes = res.plant.warnings.filter((w) => w.ref.id === "mt").map((w) => w.code);
    expect(codes).toContain("TRANSCRITICAL_OPERATION");
    expect(codes).toContain("CO2_STANDSTILL_SUPERCRITICAL");
    expect(mt.designPressures.standstill.lowerBoundOnly).toBe(true);
  });
});

describe("incremental engine", () => {
  it("recomputes only the edited room and its circuit, with the same results as a full compute", () => {
    const eng = createFacilityEngine();
    const m = model();
    eng.compute(m);
    expect(eng.lastStats).toEqual({ roomsComputed: 5, circuitsComputed: 2 });
    eng.compute(m);
    expect(eng.lastStats).toEqual({ roomsComputed: 0, circuitsComputed: 0 });
    // Run hours are the room's own: no neighbour sees them (set point and RH would reach the
    // rooms sharing a wall or door with it).
    const rooms = m.rooms.map((r) => (r.id === "apples" ? { ...r, runHoursPerDay: 18 } : r));
    const edited: FacilityModel = { ...m, rooms };
    const inc = eng.compute(edited);
    expect(eng.lastStats).toEqual({ roomsComputed: 1, circuitsComputed: 1 });
    const full = computeFacility(edited);
    expect(inc.ledger.totals).toEqual(full.ledger.totals);
    expect(inc.plant.circuits).toEqual(full.plant.circuits);
    expect(inc.plant.totals).toEqual(full.plant.totals);
  });
});

describe("incremental engine reach", () => {
  it("recomputes the rooms facing an edited set point, and matches a full compute", () => {
    const eng = createFacilityEngine();
    const m = model();
    eng.compute(m);
    const rooms = m.rooms.map((r) => (r.id === "apples" ? { ...r, setPointC: 1 } : r));
    const edited: FacilityModel = { ...m, rooms };
    const inc = eng.compute(edited);
    const facing = m.doors.filter((d) => d.sides.includes("apples")).length + m.rooms.filter((r) => r.surfaces.some((s) => typeof s.otherSide === "object" && s.otherSide.roomId === "apples")).length;
    expect(eng.lastStats.roomsComputed).toBeGreaterThanOrEqual(1 + Math.min(facing, 1));
    const full = computeFacility(edited);
    expect(inc.ledger.rooms).toEqual(full.ledger.rooms);
    expect(inc.plant.circuits).toEqual(full.plant.circuits);
    expect(inc.plant.warnings).toEqual(full.plant.warnings);
  });
});

describe("incremental engine and shared surfaces", () => {
  it("an edit to a shared wall recomputes the neighbour that counts it too, matching a full compute", () => {
    const eng = createFacilityEngine();
    const m = model();
    eng.compute(m);
    const owner = m.rooms.find((r) => r.surfaces.some((s) => typeof s.otherSide === "object"))!;
    const j = owner.surfaces.findIndex((s) => typeof s.otherSide === "object");
    const neighbourId = (owner.surfaces[j].otherSide as { roomId: string }).roomId;
    const surfaces = owner.surfaces.map((s, k) => (k === j ? { ...s, uValueWm2K: 0.5, layers: undefined } : s));
    const edited: FacilityModel = { ...m, rooms: m.rooms.map((r) => (r === owner ? { ...owner, surfaces } : r)) };
    const inc = eng.compute(edited);
    expect(eng.lastStats.roomsComputed).toBeGreaterThanOrEqual(2);
    const full = computeFacility(edited);
    expect(inc.ledger.rooms).toEqual(full.ledger.rooms);
    const n = full.ledger.rooms.find((r) => r.roomId === neighbourId)!;
    expect(n.components.some((c) => c.label.includes(`shared with room ${owner.id}`))).toBe(true);
  });
});

describe("equipment schedule", () => {
  it("lists every item with its stored tag, and removing one renumbers nothing", () => {
    const rows = buildSchedule(computeFacility(model()).plant);
    expect(rows.map((r) => r.tag)).toEqual(["EV-1", "EV-2", "EV-3", "EV-4", "EV-5", "CP-C-1", "IC-C-1", "LPR-C-1", "CP-C-2", "CD-1"]);
    const cp = rows.find((r) => r.tag === "CP-C-1")!;
    expect(cp.quantity).toBe(3);
    expect(cp.standbyQuantity).toBe(1);
    const p = structuredClone(plantFixture);
    p.evaporators.splice(2, 1);
    p.evaporators.push({ id: "ev-apples-2", tag: "EV-9", roomId: "apples", circuitId: "mt" });
    p.options = { electricalSupply: "400 V 3~ 50 Hz" };
    const withSupply = buildSchedule(computeFacility(model(p)).plant);
    expect(withSupply.find((r) => r.tag === "CP-C-2")!.supply).toBe("400 V 3~ 50 Hz");
    const again = withSupply.map((r) => r.tag);
    expect(again.filter((t) => t.startsWith("EV"))).toEqual(["EV-1", "EV-2", "EV-9", "EV-4", "EV-5"]);
  });
});

describe("installed plant re-rating", () => {
  const installed = {
    evaporators: [
      // 3 units, 1 standby, 20 kW each at TD 8 K.
      { id: "i-ev", tag: "EV-1", roomId: "apples", circuitId: "mt", units: 3, standbyUnits: 1, ratedCapacityWPerUnit: 20_000, rating: { airOnC: 2, tdK: 8, feed: "dx" } },
    ],
    compressors: [
      { id: "i-cp", tag: "CP-1", circuitId: "mt", type: "screw", units: 2, standbyUnits: 1, rating: { by: "swept-volume", sweptVolumeM3sPerUnit: 0.1 } },
    ],
    condensers: [{ id: "i-cd", tag: "CD-1", condenserId: "cd1", units: 1, ratedHeatRejectionWPerUnit: 1_000_000, ratingApproachK: 10 }],
  };

  it("re-rates evaporators by UA·TD with standby units excluded", () => {
    const p = structuredClone(plantFixture);
    p.installed = installed;
    const m = model(p);
    // Apples room at +2 °C on a circuit whose suction we set to −4 °C (allowance 1 K → coil at −3 °C):
    // TD = 5 K. By Q = UA·TD (DOMAIN.md §2) 2 running × 20 kW × 5/8 = 25 kW for a dry coil; the
    // re-rating adds each state's latent driving part (rated at 85 % RH by default, the room's RH
    // on site), and the coil below 0 °C loses 10 % to frost (common practice).
    const r = rerateInstalled(m, { circuits: { mt: { suctionC: -4, condensingC: 30 } } });
    const room = r.rooms.find((x) => x.roomId === "apples")!;
    const ev = r.evaporators.find((x) => x.id === "i-ev")!;
    expect(ev.siteTdK).toBeCloseTo(5, 9);
    expect(ev.runningUnits).toBe(2);
    expect(ev.frostCapacityLoss).toBe(0.1);
    expect(room.evaporatorCapacityW).toBeCloseTo(2 * 20_000 * (ev.siteDrivingK / ev.ratingDrivingK) * 0.9, 6);
    // Dry states on both sides give back UA·TD exactly.
    const dry = structuredClone(p);
    dry.installed.evaporators[0] = { ...installed.evaporators[0], rating: { airOnC: 2, tdK: 8, feed: "dx", rhPct: 0 }, frostCapacityLoss: 0 };
    const dm = model(dry);
    dm.rooms.find((x) => x.id === "apples")!.rhPct = 0;
    const d = rerateInstalled(dm, { circuits: { mt: { suctionC: -4, condensingC: 30 } } });
    expect(d.rooms.find((x) => x.roomId === "apples")!.evaporatorCapacityW).toBeCloseTo(25_000, 6);
  });

  it("gives a swept-volume compressor's capacity from suction density and refrigerating effect", () => {
    const p = structuredClone(plantFixture);
    p.installed = installed;
    p.circuits[1].compressor = { type: "screw", volumetric: 1, units: 2, standbyUnits: 1 };
    p.circuits[1].superheatK = 0;
    p.circuits[1].subcoolingK = 0;
    const m = model(p);
    const r = rerateInstalled(m, { circuits: { mt: { suctionC: -15, condensingC: 30 } } });
    const c = r.circuits.find((x) => x.circuitId === "mt")!;
    // Ammonia at −15 °C: saturated-vapour specific volume 0.5088 m³/kg (ASHRAE Fundamentals
    // R717 table, from memory) and refrigerating effect 1103 kJ/kg for −15/+30 °C (Stoecker &
    // Jones standard-cycle table, from memory). One running unit of 0.1 m³/s at η_v = 1:
    // 0.1 / 0.5088 × 1103 = 216.8 kW.
    expect(Math.abs(c.compressorCapacityW - 216_800) / 216_800).toBeLessThan(0.005);
  });

  it("refuses a rated compressor whose COP beats Carnot, naming the rating", () => {
    const p = structuredClone(plantFixture);
    p.installed = {
      ...installed,
      compressors: [
        {
          id: "i-cp",
          tag: "CP-1",
          circuitId: "mt",
          type: "screw",
          units: 1,
          // −10 °C / +35 °C: Carnot COP = 263.15 / 45 = 5.85; a rated COP of 8 is impossible.
          rating: { by: "rated", capacityWPerUnit: 400_000, shaftPowerWPerUnit: 50_000, evaporatingC: -10, condensingC: 35 },
        },
      ],
    };
    const e = thrown(() => rerateInstalled(model(p)));
    expect(e.code).toBe("SECOND_LAW_VIOLATION");
    expect(e.field).toBe("plant.installed.compressors.0.rating.shaftPowerWPerUnit");
  });

  it("reproduces a rated compressor at its own rating point and scales condensers with approach", () => {
    const p = structuredClone(plantFixture);
    p.installed = {
      ...installed,
      compressors: [
        {
          id: "i-cp",
          tag: "CP-1",
          circuitId: "mt",
          type: "screw",
          units: 3,
          standbyUnits: 1,
          rating: { by: "rated", capacityWPerUnit: 300_000, shaftPowerWPerUnit: 75_000, evaporatingC: -10, condensingC: 35, superheatK: 6, subcoolingK: 3 },
        },
      ],
    };
    const m = model(p);
    const r = rerateInstalled(m, { circuits: { mt: { suctionC: -10, condensingC: 35 } } });
    const c = r.circuits.find((x) => x.circuitId === "mt")!;
    // At its own rating point a machine delivers its rating: 2 running × 300 kW, 2 × 75 kW shaft.
    expect(c.compressorCapacityW).toBeCloseTo(600_000, 3);
    expect(c.compressorShaftPowerW).toBeCloseTo(150_000, 3);
    // Condenser Q = UA·ΔT: rated 1 MW at 10 K approach; 35 °C condensing over the 23 °C wet
    // bulb is a 12 K approach → 1.2 MW (hand calculation).
    const rejectPerW = 1 + c.compressorShaftPowerW / c.compressorCapacityW;
    expect(c.condenserLimitW! * rejectPerW).toBeCloseTo(1_200_000, 3);
    const lt = r.circuits.find((x) => x.circuitId === "lt");
    expect(lt).toBeUndefined();
  });
});

describe("installed cascade re-rating", () => {
  it("lets a small high stage limit its CO2 low stage, and uses all of the high stage", () => {
    const p = structuredClone(plantFixture);
    p.circuits[0] = {
      id: "lt",
      tag: "C-1",
      refrigerant: "R744",
      compressor: { type: "reciprocating" },
      heatRejection: { to: "circuit", circuitId: "mt", condensingC: -5, approachK: 5 },
    };
    p.installed = {
      evaporators: [
        { id: "i1", tag: "EV-1", roomId: "frozen-store", circuitId: "lt", units: 2, ratedCapacityWPerUnit: 60_000, rating: { airOnC: -25, tdK: 6, feed: "pumped" } },
        { id: "i3", tag: "EV-3", roomId: "apples", circuitId: "mt", units: 1, ratedCapacityWPerUnit: 30_000, rating: { airOnC: 2, tdK: 5, feed: "dx" } },
      ],
      compressors: [
        { id: "c-lt", tag: "CP-1", circuitId: "lt", type: "reciprocating", units: 1, rating: { by: "swept-volume", sweptVolumeM3sPerUnit: 0.05 } },
        // Rated at the very point it is re-rated at, so it delivers exactly 50 kW.
        { id: "c-mt", tag: "CP-2", circuitId: "mt", type: "screw", units: 1, rating: { by: "rated", capacityWPerUnit: 50_000, shaftPowerWPerUnit: 12_000, evaporatingC: -11, condensingC: 33, superheatK: 6, subcoolingK: 3 } },
      ],
      condensers: [],
    };
    const r = rerateInstalled(model(p), { circuits: { mt: { suctionC: -11, condensingC: 33 } } });
    const lt = r.circuits.find((c) => c.circuitId === "lt")!;
    const mt = r.circuits.find((c) => c.circuitId === "mt")!;
    expect(mt.compressorCapacityW).toBeCloseTo(50_000, 3);
    expect(lt.limitedBy).toBe("high-stage");
    // Energy bookkeeping (first law): the high stage's 50 kW goes to the low stage's rejected
    // heat plus its own room; nothing is lost or double counted.
    const apples = r.rooms.find((x) => x.roomId === "apples")!;
    expect(mt.cascadeLoadW + apples.availableW).toBeCloseTo(50_000, 3);
    const lowReject = lt.availableW * (1 + lt.compressorShaftPowerW / lt.compressorCapacityW);
    expect(lowReject).toBeCloseTo(mt.cascadeLoadW, 3);
  });
});

describe("site wet bulb from RH", () => {
  it("matches Stull's published check value", () => {
    // Stull (2011), J. Appl. Meteor. Climatol. 50: T = 20 °C, RH = 50 % → Tw = 13.7 °C.
    expect(stullWetBulbC(20, 50)).toBeCloseTo(13.7, 1);
  });
});
