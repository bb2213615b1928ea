import { readFileSync } from "node:fs";
import path from "node:path";
import { beforeAll, describe, expect, it } from "vitest";
import { getFluid, loadFluid } from "./thermo";
import { facilityModelSchema } from "./model";
import { addOption } from "./options";
import { bestOf, compareOptions, optionFluidsNeeded } from "./compare-options";

const root = path.resolve(__dirname, "../..");
const { $comment, ...ledger } = JSON.parse(readFileSync(path.join(root, "seeds/data/example-facility.json"), "utf8"));
void $comment;
const { $comment: c2, ...plant } = JSON.parse(readFileSync(path.join(__dirname, "plant/fixtures/harrowfield-plant.json"), "utf8"));
void c2;

/** The design (ammonia two-stage pumped + single-stage) and a CO2/ammonia cascade option. */
function model() {
  let d: Record<string, unknown> = { schemaVersion: 1, ...structuredClone(ledger), plant: structuredClone(plant) };
  d = addOption(d, { id: "cascade", name: "CO2/NH3 cascade" });
  const o = (d.plantOptions as { plant: typeof plant }[])[0].plant;
  o.circuits[0] = { ...o.circuits[0], refrigerant: "R744", arrangement: "single-stage", heatRejection: { to: "circuit", circuitId: "mt", condensingC: -5, approachK: 5 } };
  return facilityModelSchema.parse(d);
}

beforeAll(async () => {
  await Promise.all(["R717", "R744"].map((id) => loadFluid(id as "R717")));
});

describe("options comparison", () => {
  it("computes every plant on the same rooms, with charge, GWP, safety group, TEWI and the code aid", () => {
    const m = model();
    expect(optionFluidsNeeded(m).sort()).toEqual(["R717", "R744"]);
    const annual = new Map([
      ["design", { kWh: 1_000_000, monthly: [], peakKWe: 300, seasonalCOP: 2.5, cost: { energy: 150_000, demand: 10_000, total: 160_000 } }],
      ["cascade", { kWh: 1_100_000, monthly: [], peakKWe: 320, seasonalCOP: 2.3 }],
    ]);
    const c = compareOptions(m, { getFluid, annual });
    expect(c.options.map((o) => o.id)).toEqual(["design", "cascade"]);
    const [d, k] = c.options;
    expect(d.error).toBeUndefined();
    expect(k.error).toBeUndefined();
    // Same rooms: the same room duty is served by both plants.
    expect(d.installedRefrigerationW).toBeGreaterThan(0);
    expect(k.installedRefrigerationW).toBeGreaterThan(0);
    expect(d.refrigerants!.map((f) => [f.id, f.safetyGroup, f.gwp100])).toEqual([["R717", "B2L", 0]]);
    expect(k.refrigerants!.map((f) => f.id).sort()).toEqual(["R717", "R744"]);
    // Ammonia only: no direct TEWI; indirect = n·E·β = 15 × 1e6 × 0.25.
    expect(d.tewi!.directKg).toBe(0);
    expect(d.tewi!.indirectKg).toBeCloseTo(15 * 1_000_000 * 0.25, 6);
    // The cascade's R744 charge leaks with GWP 1 (IPCC AR4): direct = m·(0.05·15 + 0.2).
    const co2 = k.refrigerants!.find((f) => f.id === "R744")!.chargeKg;
    expect(k.tewi!.directKg).toBeCloseTo(co2 * (0.05 * 15 + 0.2), 6);
    expect(d.costOverYears!.at(-1)).toBeCloseTo(15 * 160_000, 6);
    expect(k.costOverYears).toBeUndefined();
    // Code aid per circuit: the low-temperature ammonia circuit serves the occupied frozen store (12 000 m³).
    const lt = d.codeAid!.find((x) => x.circuitId === "lt")!;
    expect(lt.room?.id).toBe("frozen-store");
    expect(lt.chargePerVolumeKgM3).toBeCloseTo(d.charge!.circuits.find((x) => x.circuitId === "lt")!.chargeKg / 12_000, 12);
  });

  it("reports a plant that cannot be computed without losing the others", () => {
    const m = model();
    m.plantOptions[0].plant = { ...m.plantOptions[0].plant, circuits: [] , evaporators: [] };
    const c = compareOptions(m, { getFluid });
    expect(c.options[0].error).toBeUndefined();
    expect(c.options[1].error?.message).toMatch(/no circuits/);
  });

  it("marks the best of a row, lower or higher, ignoring missing values", () => {
    expect(bestOf([3, 1, 2], "lower")).toEqual([1]);
    expect(bestOf([3, undefined, 5], "higher")).toEqual([2]);
    expect(bestOf([2, 2, 3], "lower")).toEqual([0, 1]);
    expect(bestOf([2, undefined], "lower")).toEqual([]);
    // Every plant the same (e.g. all ammonia, B2L): nothing is marked best.
    expect(bestOf([4, 4, 4], "lower")).toEqual([]);
    expect(bestOf([4, undefined, 4], "higher")).toEqual([]);
  });
});

describe("the year of every plant", () => {
  it("runs the annual engine on each plant with the shared rooms and weather; a copy of the design gives the design's year exactly", async () => {
    const { runAnnual, sineDayYear } = await import("./annual");
    const { runOptionsAnnual } = await import("./compare-options");
    // Invented temperate monthly climate (not a real site), sine-day year of the annual engine.
    const weather = sineDayYear({ label: "invented temperate", meanDryBulbC: [3, 4, 7, 10, 14, 17, 19, 19, 16, 12, 7, 4], dailyRangeK: [6, 7, 8, 9, 10, 10, 10, 10, 9, 8, 6, 5], meanRhPct: [85, 82, 78, 74, 72, 72, 72, 74, 78, 82, 85, 86] }, 2025);
    let d: Record<string, unknown> = { schemaVersion: 1, ...structuredClone(ledger), plant: structuredClone(plant) };
    d = addOption(d, { id: "copy", name: "Copy" });
    d = addOption(d, { id: "cascade", name: "CO2/NH3 cascade" });
    const o = (d.plantOptions as { plant: typeof plant }[])[1].plant;
    o.circuits[0] = { ...o.circuits[0], refrigerant: "R744", arrangement: "single-stage", heatRejection: { to: "circuit", circuitId: "mt", condensingC: -5, approachK: 5 } };
    const m = facilityModelSchema.parse(d);
    const r = runOptionsAnnual(m, weather, { getFluid });
    expect([...r.errors]).toEqual([]);
    const direct = runAnnual(m, weather, { getFluid }).facility;
    expect(r.byPlant.get("design")!.kWh).toBe(direct.kWh);
    expect(r.byPlant.get("copy")!.kWh).toBe(direct.kWh);
    expect(r.byPlant.get("copy")!.monthly.map((x) => x.kWh)).toEqual(direct.monthly.map((x) => x.kWh));
    const cascade = r.byPlant.get("cascade")!;
    expect(cascade.kWh).toBeGreaterThan(0);
    expect(cascade.kWh).not.toBe(direct.kWh);
    expect(cascade.monthly).toHaveLength(12);
    // Second law over the year: the seasonal COP never exceeds the seasonal Carnot COP.
    for (const a of r.byPlant.values()) expect(a.seasonalCOP!).toBeLessThan(a.seasonalCarnotCOP!);
    // Fed into the comparison, TEWI's indirect part is n·E·β of each plant's own year.
    const c = compareOptions(m, { getFluid, annual: r.byPlant });
    const k = c.options.find((x) => x.id === "cascade")!;
    expect(k.tewi!.indirectKnown).toBe(true);
    expect(k.tewi!.indirectKg).toBeCloseTo(15 * cascade.kWh * 0.25, 6);
    console.log(`annual per plant, ms: ${[...r.ms].map(([id, t]) => `${id} ${t}`).join(", ")}`);
  }, 120_000);
});
