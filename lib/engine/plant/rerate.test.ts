import { readFileSync } from "node:fs";
import path from "node:path";
import { beforeAll, describe, expect, it } from "vitest";
import { facilityModelSchema, rerateInstalled, type FacilityModel } from "../model";
import { loadFluid } from "../thermo";
import { coilDrivingTdK, rerateEvaporator } from "./rerate";

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

const P = 101_325;
const rated = (extra: object = {}) => ({
  id: "e",
  tag: "EV-1",
  roomId: "r",
  circuitId: "c",
  units: 1,
  standbyUnits: 0,
  ratedCapacityWPerUnit: 10_000,
  rating: { airOnC: 10, tdK: 10, feed: "dx" as const, rhPct: 85 },
  ...extra,
});

describe("unit-cooler re-rating: air-on state, feed and frost", () => {
  it("the driving TD of a wet coil against the ASHRAE moist-air table", () => {
    // EN 328 standard condition SC1 (from memory): air on 10 °C, 85 % RH, evaporating 0 °C.
    // ASHRAE Handbook—Fundamentals, psychrometrics, moist-air table (from memory): p_ws(10 °C)
    // = 1.2282 kPa, W_s(0 °C) = 0.003789 kg/kg. W_on = 0.621945·0.85·1228.2/(101325 −
    // 0.85·1228.2) = 0.006475; latent part (0.006475 − 0.003789)·2501/(1.006 + 1.86·0.006475)
    // = 6.60 K; driving TD 16.60 K.
    const sc1 = coilDrivingTdK(10, 85, 0, P);
    expect(sc1.tdK).toBe(10);
    expect(Math.abs(sc1.latentK - 6.6) / 6.6).toBeLessThan(0.01);
    // Below 0 °C the water deposits as frost: W_s(−10 °C, over ice) = 0.001606 (table, from
    // memory); air on −2 °C, 90 % RH: W = 0.621945·0.9·517.7/(101325 − 466) = 0.002871 →
    // (0.002871 − 0.001606)·2834/1.0113 = 3.54 K on top of the 8 K TD.
    const frosting = coilDrivingTdK(-2, 90, -10, P);
    expect(Math.abs(frosting.latentK - 3.54) / 3.54).toBeLessThan(0.02);
    // Dry air has no latent part.
    expect(coilDrivingTdK(-25, 0, -31, P).latentK).toBe(0);
  });

  it("scales a rating to the site by driving TD, feed and frost, each shown", () => {
    // A DX-rated coil (SC1) used pumped on site (×1.15, common practice) in a +2 °C, 90 % room
    // at −4 °C evaporating (frosting: −10 %).
    const site = { setPointC: 2, rhPct: 90, evaporatingC: -4, pressurePa: P, designFeed: "pumped" as const };
    const t = rerateEvaporator(rated(), site);
    const expected = 10_000 * (coilDrivingTdK(2, 90, -4, P).drivingK / coilDrivingTdK(10, 85, 0, P).drivingK) * 1.15 * 0.9;
    expect(t.capacityW).toBeCloseTo(expected, 6);
    expect(t.feedFactor).toBeCloseTo(1.15, 12);
    expect(t.frostCapacityLoss).toBe(0.1);
    // At its own rating state, DX, above 0 °C: the rating itself.
    expect(rerateEvaporator(rated(), { setPointC: 10, rhPct: 85, evaporatingC: 0, pressurePa: P }).capacityW).toBeCloseTo(10_000, 6);
    // A pumped rating used DX loses the same factor; a stated frost loss replaces the default.
    const back = rerateEvaporator(rated({ rating: { airOnC: 10, tdK: 10, feed: "pumped", rhPct: 85 }, siteFeed: "dx", frostCapacityLoss: 0.2 }), { ...site, evaporatingC: 0 });
    expect(back.feedFactor).toBeCloseTo(1 / 1.15, 12);
    expect(back.frostCapacityLoss).toBe(0.2);
  });

  it("the natural input computes: a freezer's coils rated at SC3-like conditions re-rated on the site, with a schema error naming a bad frost loss", () => {
    const p = structuredClone(plantFixture);
    p.installed = {
      evaporators: [
        { id: "i1", tag: "EV-1", roomId: "frozen-store", circuitId: "lt", units: 2, ratedCapacityWPerUnit: 60_000, rating: { airOnC: -18, tdK: 7, feed: "dx", rhPct: 95 }, frostCapacityLoss: 0.15 },
      ],
      compressors: [],
      condensers: [],
    };
    const r = rerateInstalled(model(p));
    const e = r.evaporators[0];
    expect(e.siteFeed).toBe("pumped");
    expect(e.frostCapacityLoss).toBe(0.15);
    expect(e.capacityW).toBeGreaterThan(0);
    expect(r.rooms.find((x) => x.roomId === "frozen-store")!.evaporatorCapacityW).toBeCloseTo(e.capacityW, 9);
    p.installed.evaporators[0].frostCapacityLoss = 0.9;
    const bad = facilityModelSchema.safeParse({ schemaVersion: 1, ...ledger, plant: p });
    expect(bad.success).toBe(false);
    expect(bad.error!.issues.map((i) => [i.path.join("."), i.message])).toContainEqual(["plant.installed.evaporators.0.frostCapacityLoss", "must be between 0 and 0.5"]);
  });
});

describe("two-stage circuits: installed compressors by stage", () => {
  const sets = (low: number, high?: number) => [
    { id: "lo", tag: "CP-L", circuitId: "lt", stage: "low", type: "screw", units: 1, rating: { by: "swept-volume", sweptVolumeM3sPerUnit: low } },
    ...(high === undefined ? [] : [{ id: "hi", tag: "CP-H", circuitId: "lt", stage: "high", type: "screw", units: 1, rating: { by: "swept-volume", sweptVolumeM3sPerUnit: high } }]),
  ];
  const at = { circuits: { lt: { suctionC: -35, condensingC: 35 } } };
  const run = (compressors: object[]) => {
    const p = structuredClone(plantFixture);
    p.installed = { evaporators: [], compressors, condensers: [] };
    return rerateInstalled(model(p), at).circuits.find((c) => c.circuitId === "lt")!;
  };

  it("rates each stage at its own conditions, the intermediate at the geometric-mean pressure", () => {
    // Ammonia (ASHRAE Fundamentals R717 table, from memory): 93.2 kPa at −35 °C, 1350 kPa at
    // +35 °C → √(93.2·1350) = 354.7 kPa, the saturation pressure at about −5 °C.
    const lowOnly = run(sets(0.2));
    const both = run(sets(0.2, 0.05));
    expect(both.stages).toBeDefined();
    expect(Math.abs(both.stages!.intermediateC - -5)).toBeLessThan(0.4);
    // The booster's capacity is the same whether or not a high stage is recorded.
    expect(both.stages!.lowW).toBeCloseTo(lowOnly.compressorCapacityW, 6);
    // A small high stage limits the circuit; a large one leaves the booster in charge.
    expect(both.stages!.limitedBy).toBe("high");
    expect(both.compressorCapacityW).toBeCloseTo(both.stages!.highW, 6);
    const big = run(sets(0.2, 0.5));
    expect(big.stages!.limitedBy).toBe("low");
    expect(big.compressorCapacityW).toBeCloseTo(lowOnly.compressorCapacityW, 6);
    // The high stage pumps the booster's gas plus the intercooler's flash at a much smaller
    // specific volume: per W, its swept volume is a fraction of the booster's (here about 0.25–0.45).
    const ratio = (0.05 / both.stages!.highW) / (0.2 / both.stages!.lowW);
    expect(ratio).toBeGreaterThan(0.2);
    expect(ratio).toBeLessThan(0.5);
  });

  it("a rated high-stage machine is rated from the intermediate to the condensing temperature; a stage on a single-stage circuit is refused", () => {
    const r = run([
      ...sets(0.2),
      {
        id: "hi",
        tag: "CP-H",
        circuitId: "lt",
        stage: "high",
        type: "screw",
        units: 2,
        standbyUnits: 1,
        rating: { by: "rated", capacityWPerUnit: 400_000, shaftPowerWPerUnit: 100_000, evaporatingC: -5, condensingC: 35, superheatK: 0, subcoolingK: 0 },
      },
    ]);
    expect(r.stages!.highW).toBeGreaterThan(0);
    expect(Number.isFinite(r.compressorShaftPowerW)).toBe(true);
    const p = structuredClone(plantFixture);
    p.installed = { evaporators: [], compressors: [{ ...sets(0.1)[0], circuitId: "mt", stage: "high" }], condensers: [] };
    const bad = facilityModelSchema.safeParse({ schemaVersion: 1, ...ledger, plant: p });
    expect(bad.success).toBe(false);
    expect(bad.error!.issues[0].path.join(".")).toBe("plant.installed.compressors.0.stage");
  });
});
