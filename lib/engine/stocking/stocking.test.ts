import { coilDrivingTdK } from "../plant/rerate";
import { sitePressurePa } from "../loads/psychro";
import { readFileSync } from "node:fs";
import path from "node:path";
import { beforeAll, describe, expect, it } from "vitest";
import { loadFluid } from "../thermo";
import { facilityModelSchema, type FacilityModel } from "../model";
import {
  applyStockingChanges,
  runStockingCheck,
  scenarioChangesSchema,
  StockingError,
  TONNES_TOLERANCE,
  PULLDOWN_TOLERANCE_H,
  verdictOf,
  worstVerdict,
  type ScenarioChangesInput,
} from "./index";

const root = path.resolve(__dirname, "../../..");
const read = (p: string) => {
  const { $comment, ...rest } = JSON.parse(readFileSync(path.join(root, p), "utf8"));
  void $comment;
  return rest;
};
const ledger = read("seeds/data/example-facility.json");
const plant = read("lib/engine/plant/fixtures/harrowfield-plant.json");
const installed = read("lib/engine/stocking/fixtures/harrowfield-installed.json");

function model(withInstalled = true): FacilityModel {
  return facilityModelSchema.parse({ schemaVersion: 1, ...ledger, plant: withInstalled ? { ...plant, installed } : plant });
}
const changes = (c: ScenarioChangesInput) => scenarioChangesSchema.parse(c);

beforeAll(async () => {
  await loadFluid("R717");
});

describe("verdict rule", () => {
  it("fits with 10 % headroom or more, tight below, shortfall when required exceeds available", () => {
    // Hand-worked: required 100 kW.
    expect(verdictOf(100_000, 115_000)).toBe("fits"); // headroom 15 kW = 15 % of 100 kW
    expect(verdictOf(100_000, 110_000)).toBe("fits"); // exactly 10 %: not under 10 %
    expect(verdictOf(100_000, 105_000)).toBe("tight"); // 5 kW = 5 % < 10 %
    expect(verdictOf(100_000, 100_000)).toBe("tight"); // 0 kW headroom, still no shortfall
    expect(verdictOf(100_000, 95_000)).toBe("shortfall"); // −5 kW
    expect(worstVerdict(["fits", "tight", "fits"])).toBe("tight");
    expect(worstVerdict(["tight", "shortfall"])).toBe("shortfall");
  });
});

describe("applying a scenario's changes", () => {
  it("changes the first product stream and stored stock, leaving the input untouched", () => {
    const m = model();
    const next = applyStockingChanges(m, changes({ rooms: [{ roomId: "apples", tonnesPerDay: 22.5, enteringTempC: 20, pullDownHours: 18, storedMassKg: 120_000 }] }));
    const apples = next.rooms.find((r) => r.id === "apples")!;
    expect(apples.products[0].massKgPerDay).toBe(22_500); // 22.5 t × 1000 kg/t
    expect(apples.products[0].enteringTempC).toBe(20);
    expect(apples.products[0].pullDownHours).toBe(18);
    expect(apples.storedProduce[0]).toEqual({ commodityId: "apples", massKg: 120_000 });
    expect(m.rooms.find((r) => r.id === "apples")!.products[0].massKgPerDay).toBe(15_000);
  });

  it("names the field that is missing or wrong", () => {
    const m = model();
    const err = (c: ScenarioChangesInput) => {
      try {
        applyStockingChanges(m, changes(c));
      } catch (e) {
        if (e instanceof StockingError) return [e.code, e.field];
        throw e;
      }
      return null;
    };
    expect(err({ rooms: [{ roomId: "nowhere", tonnesPerDay: 1 }] })).toEqual(["UNKNOWN_ROOM", "rooms.0.roomId"]);
    expect(err({ rooms: [{ roomId: "apples", commodityId: "moon-cheese" }] })).toEqual(["UNKNOWN_COMMODITY", "rooms.0.commodityId"]);
    // The dock has no product intake: a new one needs its commodity, t/day, entering temperature and pull-down.
    expect(err({ rooms: [{ roomId: "dock", commodityId: "apples", enteringTempC: 15, pullDownHours: 24 }] })).toEqual(["MISSING_INPUT", "rooms.0.tonnesPerDay"]);
    expect(err({ rooms: [{ roomId: "dock", tonnesPerDay: 5, enteringTempC: 15, pullDownHours: 24 }] })).toEqual(["MISSING_INPUT", "rooms.0.commodityId"]);
  });

  it("refuses a room listed twice and a room with nothing changed", () => {
    const r = scenarioChangesSchema.safeParse({ rooms: [{ roomId: "apples", tonnesPerDay: 1 }, { roomId: "apples", tonnesPerDay: 2 }, { roomId: "dock" }] });
    const issues = r.error!.issues.map((i) => i.path.join("."));
    expect(issues).toContain("rooms.1.roomId");
    expect(issues).toContain("rooms.2.roomId");
  });
});

describe("stocking check against the installed plant", () => {
  it("refuses a facility without an installed plant, naming it", () => {
    expect(() => runStockingCheck(model(false), changes({ rooms: [{ roomId: "apples", tonnesPerDay: 15 }] }))).toThrow(StockingError);
  });

  it("the design intake fits; 20 t/day is tight and 25 t/day short at the apples room's evaporator", () => {
    const fits = runStockingCheck(model(), changes({ rooms: [{ roomId: "apples", tonnesPerDay: 15 }] }), { solve: false });
    expect(fits.verdict).toBe("fits");
    const tight = runStockingCheck(model(), changes({ rooms: [{ roomId: "apples", tonnesPerDay: 20 }] }), { solve: false });
    expect(tight.verdict).toBe("tight");
    const short = runStockingCheck(model(), changes({ rooms: [{ roomId: "apples", tonnesPerDay: 25 }] }), { solve: false });
    expect(short.verdict).toBe("shortfall");
    const lim = short.limiting!;
    expect(lim.item).toMatchObject({ kind: "room-evaporators", id: "apples", tags: ["EV-3"] });
    // One installed unit rated 37.8 kW clean at its room's own state (+2 °C, 90 %, TD 5 K),
    // running at that TD (coil at −3 °C): Q = UA·TD gives the rating back (DOMAIN.md §2), less
    // the 10 % mean frost loss of a coil below 0 °C (common practice): 34.02 kW; the site's
    // 150 m elevation adds a little latent capacity (same RH, lower pressure: higher W).
    const elevation = coilDrivingTdK(2, 90, -3, sitePressurePa(150)).drivingK / coilDrivingTdK(2, 90, -3, 101_325).drivingK;
    expect(elevation).toBeGreaterThan(1);
    expect(elevation).toBeLessThan(1.01);
    expect(lim.availableW).toBeCloseTo(34_020 * elevation, 6);
    expect(lim.headroomW).toBeCloseTo(lim.availableW - lim.requiredW, 9);
    expect(lim.headroomW).toBeLessThan(0);
    // Every item is checked on both bases.
    const kinds = new Set(short.checks.map((c) => `${c.item.kind}/${c.basis}`));
    expect(kinds).toEqual(new Set(["room-evaporators/daily", "room-evaporators/peak", "compressors/daily", "compressors/peak", "condenser/daily", "condenser/peak"]));
    // Loads before and after are reported for the changed room, and grow with the intake.
    expect(short.rooms[0].after.dailyW).toBeGreaterThan(short.rooms[0].before.dailyW);
  });

  it("puts the safety factor in the load or in the headroom, never both", () => {
    const inLoad = runStockingCheck(model(), changes({ rooms: [{ roomId: "apples", tonnesPerDay: 18 }] }), { solve: false });
    const inHeadroom = runStockingCheck(model(), changes({ rooms: [{ roomId: "apples", tonnesPerDay: 18 }], safetyFactorPlacement: "headroom" }), { solve: false });
    const pick = (r: typeof inLoad) => r.checks.find((c) => c.item.id === "apples" && c.basis === "daily")!;
    // Default safety factor 0.1 (lib/engine/loads/schema.ts): required(load) = required(headroom) × 1.1.
    expect(pick(inLoad).requiredW).toBeCloseTo(pick(inHeadroom).requiredW * 1.1, 6);
    expect(inLoad.safetyFactor.placement).toBe("load");
    expect(inHeadroom.safetyFactor.statement).toMatch(/part of the headroom/);
  });

  it("re-purposes a room: the ripening room at +2 °C with apples re-rates its evaporator at the new TD", () => {
    const r = runStockingCheck(model(), changes({ rooms: [{ roomId: "ripening", setPointC: 2, commodityId: "apples" }] }), { solve: false });
    const ev = r.checks.find((c) => c.item.id === "ripening")!;
    // Medium-temperature coils at the new set points: apples 2 − 5 = −3 °C, ripening 2 − 5 = −3 °C,
    // dock 5 − 7 = −2 °C → suction −3 − 1 (allowance) = −4 °C; the ripening coil runs at
    // max(−4 + 1, 2 − 5) = −3 °C, TD 5 K = its rating TD, so 12 kW × 5/5 = 12 kW by UA·TD alone.
    // Rated at +14 °C / 90 % air on, its wet coil had a larger latent part than it has frosting
    // at +2 °C, and it now frosts (−10 %): the driving-TD ratio and frost loss lower it.
    const drive = coilDrivingTdK(2, 90, -3, sitePressurePa(150)).drivingK / coilDrivingTdK(14, 90, 9, 101_325).drivingK;
    expect(drive).toBeLessThan(1);
    expect(ev.availableW).toBeCloseTo(12_000 * drive * 0.9, 6);
    expect(r.rooms[0].after.setPointC).toBe(2);
  });

  it("solves the largest intake that fits: it fits, and a little more does not", () => {
    const base = model();
    const r = runStockingCheck(base, changes({ rooms: [{ roomId: "apples", tonnesPerDay: 18 }] }));
    const s = r.solves.find((x) => x.roomId === "apples")!;
    expect(s.maxTonnesPerDay.status).toBe("boundary");
    expect(s.maxTonnesPerDay.tolerance).toBe(TONNES_TOLERANCE);
    const t = s.maxTonnesPerDay.value!;
    const at = runStockingCheck(base, changes({ rooms: [{ roomId: "apples", tonnesPerDay: t }] }), { solve: false });
    expect(at.verdict).not.toBe("shortfall");
    const over = runStockingCheck(base, changes({ rooms: [{ roomId: "apples", tonnesPerDay: t + 2 * TONNES_TOLERANCE }] }), { solve: false });
    expect(over.verdict).toBe("shortfall");
  });

  it("solves the shortest pull-down that fits: it fits, and a little shorter does not", () => {
    const base = model();
    const r = runStockingCheck(base, changes({ rooms: [{ roomId: "apples", tonnesPerDay: 18 }] }));
    const s = r.solves.find((x) => x.roomId === "apples")!.minPullDownHours;
    expect(s.status).toBe("boundary");
    const h = s.value!;
    const at = runStockingCheck(base, changes({ rooms: [{ roomId: "apples", tonnesPerDay: 18, pullDownHours: h }] }), { solve: false });
    expect(at.verdict).not.toBe("shortfall");
    const under = runStockingCheck(base, changes({ rooms: [{ roomId: "apples", tonnesPerDay: 18, pullDownHours: h - 2 * PULLDOWN_TOLERANCE_H }] }), { solve: false });
    expect(under.verdict).toBe("shortfall");
  });

  it("says when no pull-down fits at all", () => {
    const r = runStockingCheck(model(), changes({ rooms: [{ roomId: "apples", tonnesPerDay: 40 }] }));
    expect(r.solves[0].minPullDownHours).toMatchObject({ value: null, status: "none" });
  });
});
