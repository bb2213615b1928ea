import { describe, expect, it } from "vitest";
import { getCommodity } from "./commodities";
import { respirationWPerKg } from "./respiration";
import { LoadInputError } from "./errors";

describe("heat of respiration", () => {
  it("apples at 0 °C by the Becker–Fricke fit", () => {
    // Hand calculation: f = 5.6871e-4, g = 2.5977 (Becker & Fricke, from memory);
    // W/kg = (10.7·5.6871e-4/3600)·32^2.5977 = 1.6903e-6·8127 = 0.013737 W/kg,
    // so 10 t of apples release 137.4 W. Tabulated handbook values for apples at 0 °C are of
    // the order of 10 mW/kg (from memory), which the fit matches in magnitude.
    const w = respirationWPerKg(getCommodity("apples")!, 0, "x");
    expect(w).toBeCloseTo(0.013737, 5);
    expect(w * 10000).toBeCloseTo(137.4, 0);
    expect(w).toBeGreaterThan(0.005);
    expect(w).toBeLessThan(0.03);
  });

  it("strawberries at 5 °C", () => {
    // Hand calculation: f = 3.6683e-4, g = 3.0330: (10.7·3.6683e-4/3600)·41^3.033 = 0.08494 W/kg.
    expect(respirationWPerKg(getCommodity("strawberries")!, 5, "x")).toBeCloseTo(0.08494, 4);
  });

  it("tabulated data interpolate log-linearly and never extrapolate", () => {
    // Geometric mean of the 13 °C (60 mW/kg) and 15 °C (75 mW/kg) library points at 14 °C:
    // √(60·75) = 67.08 mW/kg.
    const bananas = getCommodity("bananas")!;
    expect(respirationWPerKg(bananas, 14, "x") * 1000).toBeCloseTo(67.08, 1);
    expect(() => respirationWPerKg(bananas, 5, "rooms.0.storedProduce.0.commodityId")).toThrow(LoadInputError);
  });
});
