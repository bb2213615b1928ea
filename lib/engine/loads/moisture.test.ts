import { describe, expect, it } from "vitest";
import { getCommodity } from "./commodities";
import { computeLedger, type LedgerInputRaw } from "./index";
import { evaporationHeatKJkg, surfaceVapourPressurePa } from "./moisture";

const site = { designDryBulbC: 30, designRH: 50, groundTempC: 10, elevationM: 0 };
type RawRoom = LedgerInputRaw["rooms"][number];
const store = (extra: Partial<RawRoom>): RawRoom => ({ id: "s", name: "Apple store", kind: "storage", lengthM: 20, widthM: 10, heightM: 6, setPointC: 0, rhPct: 90, ...extra });

describe("produce moisture loss (transpiration)", () => {
  it("saturation vapour pressure over water against the ASHRAE Fundamentals steam table", () => {
    // ASHRAE Handbook—Fundamentals, psychrometrics, table of saturation properties (from
    // memory): 0 °C 0.6112 kPa, 5 °C 0.8726 kPa, 10 °C 1.2282 kPa, 20 °C 2.3392 kPa.
    for (const [t, kPa] of [[0, 0.6112], [5, 0.8726], [10, 1.2282], [20, 2.3392]] as const) {
      expect(Math.abs(surfaceVapourPressurePa(t) / 1000 / kPa - 1)).toBeLessThan(0.001);
    }
    // h_fg: 2501 kJ/kg at 0 °C, 2477 at 10 °C (steam tables, from memory).
    expect(evaporationHeatKJkg(0)).toBe(2501);
    expect(Math.abs(evaporationHeatKJkg(10) - 2477.7)).toBeLessThan(1);
  });

  it("100 t of apples at 0 °C, 90 % RH: loss and latent load by hand from the handbook's model", () => {
    // ṁ = k_t·m·(p_s − p_a), k_t(apples) = 42 ng/(kg·s·Pa) (ASHRAE transpiration-coefficient
    // table, from memory). p_s = 611.2 Pa (water at 0 °C); the room air at 0 °C, 90 % RH holds
    // 0.9 × 611.15 Pa (saturation over ice at 0 °C, psychrolib) = 550.0 Pa → Δp ≈ 61.2 Pa.
    // ṁ = 42e-12 × 1e5 × 61.2 = 2.57e-4 kg/s = 22.2 kg/day (0.022 %/day, about 0.7 % a
    // month — the order of the weight loss reported for apples in cold storage, USDA
    // Agriculture Handbook 66, from memory); latent 2.57e-4 × 2501 kJ/kg ≈ 643 W.
    expect(getCommodity("apples")!.transpirationNgKgSPa).toBe(42);
    const r = computeLedger({ site, rooms: [store({ storedProduce: [{ commodityId: "apples", massKg: 100_000 }] })] }).rooms[0];
    const m = r.components.find((c) => c.kind === "moisture")!;
    const dp = Number(m.trace.inputs.surfaceVapourPressurePa) - Number(m.trace.inputs.airVapourPressurePa);
    expect(dp).toBeGreaterThan(60.5);
    expect(dp).toBeLessThan(62);
    expect(Number(m.trace.inputs.moistureLossKgPerDay)).toBeCloseTo(42e-12 * 1e5 * dp * 86400, 9);
    expect(m.latentW).toBeCloseTo((42e-12 * 1e5 * dp * 2501e3), 6);
    expect(m.latentW).toBeGreaterThan(630);
    expect(m.latentW).toBeLessThan(655);
    // It moves heat from sensible to latent: the line's total is zero, the room's latent rises.
    expect(m.powerW).toBe(0);
    expect(m.sensibleW).toBeCloseTo(-m.latentW, 9);
    const monthlyPct = Number(m.trace.inputs.weightLossPctPerDay) * 30;
    expect(monthlyPct).toBeGreaterThan(0.3);
    expect(monthlyPct).toBeLessThan(1.5);
    const without = computeLedger({ site, rooms: [store({ storedProduce: [{ commodityId: "apples", massKg: 100_000 }], rhPct: 100 })] }).rooms[0];
    // Saturated air: only the tiny water-over-ice difference at 0 °C is left (< 1 W for 100 t).
    expect(without.components.find((c) => c.kind === "moisture")!.latentW).toBeLessThan(1);
  });

  it("carrots (k_t 1207) lose far more than apples at the same state; meat has no line", () => {
    const r = computeLedger({
      site,
      rooms: [store({ storedProduce: [{ commodityId: "carrots", massKg: 1000 }, { commodityId: "apples", massKg: 1000 }, { commodityId: "beef-lean", massKg: 1000 }] })],
    }).rooms[0];
    const lines = r.components.filter((c) => c.kind === "moisture");
    expect(lines).toHaveLength(2);
    expect(lines[0].latentW / lines[1].latentW).toBeCloseTo(1207 / 42, 6);
  });

  it("the natural input computes: warm produce arriving adds its excess loss during pull-down; a custom commodity's k_t is used", () => {
    const r = computeLedger({
      site,
      commodities: [{ id: "kale", name: "Kale", group: "vegetable", waterFraction: 0.84, proteinFraction: 0.033, initialFreezingPointC: -0.5, respiration: { points: [[0, 40], [10, 120]] }, transpirationNgKgSPa: 5000, source: "grower's trial 2025" }],
      rooms: [
        store({
          rhPct: 95,
          products: [{ commodityId: "apples", massKgPerDay: 20_000, enteringTempC: 18, pullDownHours: 12 }],
          storedProduce: [{ commodityId: "apples", massKg: 200_000 }, { commodityId: "kale", massKg: 5000 }],
        }),
      ],
    }).rooms[0];
    const pd = r.components.find((c) => c.kind === "moisture" && c.label.includes("pull-down"))!;
    expect(pd.latentW).toBeGreaterThan(0);
    expect(pd.trace.inputs.productTempC).toBe(9);
    const kale = r.components.find((c) => c.kind === "moisture" && c.label.startsWith("Kale"))!;
    expect(kale.trace.source).toMatch(/user data: grower's trial 2025/);
    expect(r.sensibleHeatRatio).toBeLessThan(1);
    expect(r.latentW).toBeCloseTo(r.components.reduce((a, c) => a + c.latentW, 0), 9);
  });
});
