import { describe, expect, it } from "vitest";
import { LATENT_HEAT_WATER_KJKG, getCommodity, listCommodities } from "./commodities";
import { respirationWPerKg } from "./respiration";

const c = (id: string) => getCommodity(id)!;
const fToC = (f: number) => ((f - 32) * 5) / 9;

describe("commodity library re-checked against published tables", () => {
  it("vegetables: water, protein and initial freezing point as in ASHRAE Refrigeration (2006) ch. 9, Table 3", () => {
    // ASHRAE Handbook—Refrigeration (2006), "Thermal properties of foods", Table 3 (unfrozen
    // composition data, initial freezing point), read from a published copy of the table:
    // [id, water %, protein %, t_f °C or null where the copy read did not show it].
    const table: Array<[string, number, number, number | null]> = [
      ["snap-beans", 90.27, 1.82, -0.7],
      ["lima-beans", 70.24, 6.84, -0.6],
      ["brussels-sprouts", 86.0, 3.38, -0.8],
      ["cabbage", 92.15, 1.44, -0.9],
      ["carrots", 87.79, 1.03, -1.4],
      ["onions", 89.68, 1.16, null],
      ["green-peas", 78.86, 5.42, null],
      ["green-peppers", 92.19, 0.89, null],
      ["potatoes", 78.96, 2.07, null],
      ["rutabagas", 89.66, 1.2, null],
      ["tomatoes", 93.0, 1.2, null],
    ];
    for (const [id, water, protein, tf] of table) {
      expect(c(id).waterFraction).toBeCloseTo(water / 100, 6);
      expect(c(id).proteinFraction).toBeCloseTo(protein / 100, 6);
      if (tf !== null) expect(c(id).initialFreezingPointC).toBe(tf);
      expect(c(id).sources.waterFraction).toMatch(/Table 3 .*: water and protein as tabulated/);
    }
  });

  it("fruit, fish and beef: initial freezing points and latent heats of the I-P edition of the table", () => {
    // The same ASHRAE table in I-P units (published copy): [id, t_f °F, latent heat Btu/lb].
    // The handbook's latent heat is 333.6 kJ/kg × water content; 1 Btu/lb = 2.326 kJ/kg, and
    // the table rounds to 1 Btu/lb, so the water content must match within ±0.5 Btu/lb
    // (±0.35 point), except where the library keeps the USDA value and says so.
    const ip: Array<[string, number, number, boolean]> = [
      ["apples", 30.0, 120, true],
      ["pears", 29.1, 120, true],
      ["bananas", 30.6, 107, true],
      ["oranges", 30.6, 118, true],
      ["peaches", 30.4, 126, true],
      ["cod", 28.0, 117, false],
      ["beef-carcass", 28.0, 82, true],
      ["beef-lean", 28.9, 103, true],
      ["green-peas", 30.9, 113, true],
      ["strawberries", 30.6, 132, false],
      ["blueberries", 29.1, 122, false],
    ];
    for (const [id, tfF, btu, matches] of ip) {
      expect(c(id).initialFreezingPointC).toBeCloseTo(fToC(tfF), 1);
      const impliedWater = (btu * 2.326) / LATENT_HEAT_WATER_KJKG;
      if (matches) expect(Math.abs(c(id).waterFraction - impliedWater)).toBeLessThan((0.5 * 2.326) / LATENT_HEAT_WATER_KJKG + 1e-9);
      else {
        expect(Math.abs(c(id).waterFraction - impliedWater)).toBeLessThan(0.01);
        expect(c(id).sources.waterFraction).toMatch(/above the value kept/);
      }
    }
  });

  it("every value still from memory says that no published table could be reached", () => {
    for (const k of listCommodities()) {
      for (const [field, src] of Object.entries(k.sources)) {
        if (/from memory/.test(src) && field !== "transpirationNgKgSPa") expect(src, `${k.id}.${field}`).toMatch(/no published copy of the table could be reached|agree with USDA/);
      }
    }
    // The transpiration coefficients are marked from memory, to be checked against the table.
    expect(c("carrots").sources.transpirationNgKgSPa).toMatch(/from memory/);
  });

  it("respiration near 0 °C against USDA Agriculture Handbook 66 (Hardenburg et al. 1986)", () => {
    // USDA Agriculture Handbook 66 heats of respiration at cool storage, as tabulated by a
    // state extension service (Btu/lb·h): cabbage 0.023, strawberries 0.069, peaches 0.023;
    // 1 Btu/(lb·h) = 0.6461 W/kg. The Becker–Fricke fits give them within 30 %.
    const btuLbH = 0.6461;
    for (const [id, hb66] of [["cabbage", 0.023], ["strawberries", 0.069], ["peaches", 0.023]] as const) {
      const ours = respirationWPerKg(c(id), 0, "t");
      expect(Math.abs(ours / (hb66 * btuLbH) - 1), id).toBeLessThan(0.3);
    }
  });
});
