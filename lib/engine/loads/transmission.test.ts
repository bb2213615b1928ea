import { describe, expect, it } from "vitest";
import { solarAllowanceK, transmissionW, uValue } from "./transmission";
import { surfaceSchema } from "./schema";

describe("layered wall transmission", () => {
  it("150 mm PIR panel with steel skins, north wall, −25 °C store at 32 °C design", () => {
    // Hand calculation from q = U·A·ΔT, U = 1/(R_si + ΣL/λ + R_se) (ASHRAE Fundamentals):
    // R = 0.12 + 0.15/0.023 + 2·0.0005/50 + 0.04 = 6.6818 m²·K/W → U = 0.14966 W/(m²·K);
    // A = 40 m × 10 m = 400 m², ΔT = 32 − (−25) = 57 K (north wall: no sun allowance)
    // → q = 0.14966·400·57 = 3412 W.
    const layers = [
      { thicknessM: 0.0005, conductivityWmK: 50 },
      { thicknessM: 0.15, conductivityWmK: 0.023 },
      { thicknessM: 0.0005, conductivityWmK: 50 },
    ];
    const u = uValue(layers, 0.12, 0.04);
    expect(u.uValueWm2K).toBeCloseTo(0.14966, 4);
    expect(transmissionW(u.uValueWm2K, 400, 32, -25)).toBeCloseTo(3412.3, 0);
  });

  it("a given U-value is used as is", () => {
    // Definition: U given already includes the surface films.
    expect(uValue(undefined, 0.12, 0.04, 0.2).uValueWm2K).toBe(0.2);
  });
});

describe("solar allowance", () => {
  it("follows the sun-effect table by colour and facing", () => {
    // ASHRAE Handbook—Refrigeration, allowance for sun effect (from memory): light E wall 3 K,
    // dark flat roof 11 K, medium S wall 3 K, north walls 0.
    const s = (o: object) => surfaceSchema.parse({ kind: "wall", areaM2: 1, uValueWm2K: 0.2, otherSide: "outdoors", ...o });
    expect(solarAllowanceK(s({ orientation: "E", colour: "light" }), "north")).toBe(3);
    expect(solarAllowanceK(s({ kind: "roof", colour: "dark" }), "north")).toBe(11);
    expect(solarAllowanceK(s({ orientation: "S", colour: "medium" }), "north")).toBe(3);
    expect(solarAllowanceK(s({ orientation: "N", colour: "dark" }), "north")).toBe(0);
    // Southern hemisphere: the north wall faces the equator and takes the "south" value.
    expect(solarAllowanceK(s({ orientation: "N", colour: "medium" }), "south")).toBe(3);
    // Walls to another room get no sun.
    expect(solarAllowanceK(s({ orientation: "E", otherSide: { roomId: "x" } }), "north")).toBe(0);
  });
});
