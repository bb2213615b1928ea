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

describe("solar allowance for every facing", () => {
  const s = (o: object) => surfaceSchema.parse({ kind: "wall", areaM2: 1, uValueWm2K: 0.2, otherSide: "outdoors", ...o });
  it("cardinal walls and flat roofs follow the handbook's sun-effect table for each colour", () => {
    // ASHRAE Handbook—Refrigeration, "Refrigerated-facility loads", table "Allowance for sun
    // effect" (from memory): E/S/W wall and flat roof, K — dark 5/3/5/11, medium 4/3/4/9, light 3/2/3/5.
    const table = { dark: [5, 3, 5, 11], medium: [4, 3, 4, 9], light: [3, 2, 3, 5] } as const;
    for (const [colour, [e, south, w, roof]] of Object.entries(table)) {
      expect(solarAllowanceK(s({ orientation: "E", colour }), "north")).toBe(e);
      expect(solarAllowanceK(s({ orientation: "S", colour }), "north")).toBe(south);
      expect(solarAllowanceK(s({ orientation: "W", colour }), "north")).toBe(w);
      expect(solarAllowanceK(s({ orientation: "N", colour }), "north")).toBe(0);
      expect(solarAllowanceK(s({ kind: "roof", colour }), "north")).toBe(roof);
    }
  });
  it("intercardinal walls take the mean of their two neighbours (common practice), N/S swapped in the south", () => {
    expect(solarAllowanceK(s({ orientation: "NE", colour: "dark" }), "north")).toBe(2.5);
    expect(solarAllowanceK(s({ orientation: "SE", colour: "dark" }), "north")).toBe(4);
    expect(solarAllowanceK(s({ orientation: "SW", colour: "light" }), "north")).toBe(2.5);
    expect(solarAllowanceK(s({ orientation: "NW", colour: "medium" }), "north")).toBe(2);
    // Southern hemisphere: a NE wall faces the equator the way a SE wall does in the north.
    expect(solarAllowanceK(s({ orientation: "NE", colour: "dark" }), "south")).toBe(4);
    expect(solarAllowanceK(s({ orientation: "SW", colour: "dark" }), "south")).toBe(2.5);
  });
  it("every orientation the schema allows computes, and a wrong one is refused naming the allowed values", () => {
    for (const o of ["N", "NE", "E", "SE", "S", "SW", "W", "NW"]) {
      const v = solarAllowanceK(s({ orientation: o, colour: "medium" }), "north");
      expect(v).toBeGreaterThanOrEqual(0);
      expect(v).toBeLessThanOrEqual(4);
    }
    const bad = surfaceSchema.safeParse({ kind: "wall", areaM2: 1, uValueWm2K: 0.2, otherSide: "outdoors", orientation: "NNE" });
    expect(bad.success).toBe(false);
    expect(bad.error!.issues[0].path).toEqual(["orientation"]);
    expect(bad.error!.issues[0].message).toMatch(/NE/);
  });
});
