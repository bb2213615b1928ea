import { describe, expect, it } from "vitest";
import { airSurfaceCoefficientWm2K, effectiveSurfaceCoefficientWm2K, phamFreezingTimeS, plankFreezingTimeS } from "./freezing";

describe("freezing time", () => {
  // A stated slab: lean beef 120 mm thick, ρ = 1050 kg/m³, L = 333.6·(0.73 − 0.088) = 214.17
  // kJ/kg, t_f = −1.7 °C, air −35 °C, h = 20 W/(m²·K), k_frozen = 1.35 W/(m·K).
  it("Plank's equation for a slab", () => {
    // Hand calculation from t = (ρ·L/ΔT)·(P·a/h + R·a²/k), P = 1/2, R = 1/8 (Plank 1913, ASHRAE):
    // (1050·214171/33.3)·(0.5·0.12/20 + 0.125·0.0144/1.35) = 6.7531e6·(0.003 + 0.0013333)
    // = 29264 s = 8.13 h.
    const t = plankFreezingTimeS({
      densityKgM3: 1050,
      latentHeatJkg: 214171.2,
      freezingPointC: -1.7,
      airTempC: -35,
      thicknessM: 0.12,
      hWm2K: 20,
      frozenConductivityWmK: 1.35,
      shape: "slab",
    });
    expect(t).toBeCloseTo(29264, -1);
  });

  it("Plank's shape factors: a sphere of diameter a freezes in a third of the slab time", () => {
    // Plank shape factors (P, R): slab 1/2, 1/8; sphere 1/6, 1/24 — exactly a third each.
    const base = { densityKgM3: 1000, latentHeatJkg: 250000, freezingPointC: -1, airTempC: -30, thicknessM: 0.05, hWm2K: 25, frozenConductivityWmK: 1.5 };
    const slab = plankFreezingTimeS({ ...base, shape: "slab" });
    const sphere = plankFreezingTimeS({ ...base, shape: "sphere" });
    expect(sphere / slab).toBeCloseTo(1 / 3, 9);
  });

  it("Pham's method for the same slab from +5 °C to a −18 °C centre", () => {
    // Hand calculation from Pham (1986) as presented by Singh & Heldman (from memory):
    // T_fm = 1.8 + 0.263·(−18) + 0.105·(−35) = −6.609 °C;
    // ΔH1 = 1050·3556.6·(5 + 6.609) = 4.3353e7 J/m³, ΔT1 = (5 − 6.609)/2 + 35 = 34.196 K;
    // ΔH2 = 1050·(214171 + 1890.2·(−6.609 + 18)) = 2.4749e8 J/m³, ΔT2 = 28.391 K;
    // Bi = 20·0.06/1.35 = 0.8889; t = (0.06/20)·(ΔH1/ΔT1 + ΔH2/ΔT2)·(1 + Bi/2) = 43268 s = 12.02 h.
    const r = phamFreezingTimeS({
      densityKgM3: 1050,
      latentHeatJkg: 214171.2,
      cpUnfrozenJkgK: 3556.639,
      cpFrozenJkgK: 1890.2,
      initialTempC: 5,
      finalCentreTempC: -18,
      airTempC: -35,
      thicknessM: 0.12,
      hWm2K: 20,
      frozenConductivityWmK: 1.35,
      shape: "slab",
    });
    expect(r.meanFreezingTempC).toBeCloseTo(-6.609, 3);
    expect(r.timeS).toBeCloseTo(43268, -1);
  });

  it("surface coefficient from air velocity", () => {
    // Jürges / McAdams (from memory): 5.6 + 4·4 = 21.6 W/(m²·K) at 4 m/s; 7.2·8^0.78 = 36.45 at 8 m/s.
    expect(airSurfaceCoefficientWm2K(4)).toBeCloseTo(21.6, 6);
    expect(airSurfaceCoefficientWm2K(8)).toBeCloseTo(36.45, 2);
  });

  it("packaging resistance in series with the air film", () => {
    // Series resistances: 1/(1/21.6 + 0.01) = 17.763 W/(m²·K).
    expect(effectiveSurfaceCoefficientWm2K(21.6, 0.01)).toBeCloseTo(17.763, 3);
  });
});
