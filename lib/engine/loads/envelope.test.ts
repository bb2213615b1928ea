import { describe, expect, it } from "vitest";
import { LoadInputError, computeLedger, type LedgerInputRaw } from "./index";

type RawRoom = LedgerInputRaw["rooms"][number];
const site = { designDryBulbC: 30, designRH: 50, groundTempC: 10, elevationM: 0 };

function fieldOf(fn: () => unknown): { field: string; message: string } {
  try {
    fn();
  } catch (e) {
    if (e instanceof LoadInputError) return { field: e.field, message: e.issues.map((i) => i.message).join("; ") };
    throw e;
  }
  throw new Error("no error thrown");
}

/** A 20 × 10 × 6 m chilled room at 0 °C whose north wall (surfaces.0) holds a door to outdoors. */
function dockRoom(surfaceExtra: object = {}): RawRoom {
  return {
    id: "chill",
    name: "Chill",
    kind: "storage",
    lengthM: 20,
    widthM: 10,
    heightM: 6,
    setPointC: 0,
    rhPct: 85,
    surfaces: [{ kind: "wall", orientation: "N", along: "length", uValueWm2K: 0.25, otherSide: "outdoors", ...surfaceExtra }],
  };
}
const door = { id: "d1", widthM: 3, heightM: 4, sides: ["chill", "outdoors"] as [string, string], passagesPerDay: 0, wall: { roomId: "chill", surfaceIndex: 0 } };

describe("doors set in a wall", () => {
  it("the door's area leaves the wall and is counted at the door leaf's own U", () => {
    // ASHRAE Handbook—Refrigeration, refrigerated-facility loads: transmission q = U·A·ΔT per
    // construction, each area at its own U. By hand: wall 20 × 6 = 120 m², door 3 × 4 = 12 m²:
    // wall 0.25 × 108 × 30 = 810 W, door leaf U 0.6 → 0.6 × 12 × 30 = 216 W (north: no sun).
    const r = computeLedger({ site, rooms: [dockRoom()], doors: [{ ...door, uValueWm2K: 0.6 }] }).rooms[0];
    const t = r.components.filter((c) => c.kind === "transmission");
    expect(t).toHaveLength(2);
    expect(t[0].powerW).toBeCloseTo(810, 9);
    expect(t[0].trace.inputs).toMatchObject({ grossAreaM2: 120, doorsAreaM2: 12, areaM2: 108, doorsInWall: "d1" });
    expect(t[1].label).toMatch(/door d1 \(leaf/);
    expect(t[1].powerW).toBeCloseTo(216, 9);
    // Without a door U the leaf takes the wall's: the total is the undivided wall's 0.25 × 120 × 30.
    const same = computeLedger({ site, rooms: [dockRoom()], doors: [door] }).rooms[0];
    const sum = same.components.filter((c) => c.kind === "transmission").reduce((a, c) => a + c.powerW, 0);
    expect(sum).toBeCloseTo(900, 9);
    expect(same.components.find((c) => c.label.includes("leaf"))!.trace.inputs.uFrom).toMatch(/wall/);
  });

  it("a door in a sunlit wall carries the wall's solar allowance", () => {
    // Dark east wall: +5 K (handbook sun-effect table, from memory): door 12 m² × 0.6 × 35 K = 252 W.
    const r = computeLedger({ site, rooms: [dockRoom({ orientation: "E", colour: "dark" })], doors: [{ ...door, uValueWm2K: 0.6 }] }).rooms[0];
    expect(r.components.find((c) => c.label.includes("leaf"))!.powerW).toBeCloseTo(252, 9);
  });

  it("a door in a shared wall comes out of the wall on both sides", () => {
    // Freezer (−20 °C) next to the chill (0 °C); the shared wall (10 × 6 = 60 m², U 0.2) is
    // entered in the freezer and holds a 2 × 3 m door: freezer gain 0.2 × 54 × 20 = 216 W.
    const freezer: RawRoom = {
      id: "frz",
      name: "Freezer",
      kind: "storage",
      lengthM: 10,
      widthM: 10,
      heightM: 6,
      setPointC: -20,
      rhPct: 90,
      surfaces: [{ kind: "wall", along: "width", uValueWm2K: 0.2, otherSide: { roomId: "chill" } }],
    };
    const chill = { ...dockRoom(), surfaces: [] };
    const r = computeLedger({
      site,
      rooms: [freezer, chill],
      doors: [{ id: "fd", widthM: 2, heightM: 3, sides: ["frz", "chill"], passagesPerDay: 0, wall: { roomId: "frz", surfaceIndex: 0 } }],
      options: { colderNeighbour: "credit" },
    });
    const wallF = r.rooms[0].components.find((c) => c.kind === "transmission" && !c.label.includes("leaf"))!;
    expect(wallF.powerW).toBeCloseTo(216, 9);
    const wallC = r.rooms[1].components.find((c) => c.kind === "transmission" && !c.label.includes("leaf"))!;
    expect(wallC.powerW).toBeCloseTo(-216, 9);
    expect(r.rooms[1].components.some((c) => c.label.includes("leaf"))).toBe(true);
  });

  it("doors larger than their wall are refused, naming the door's wall field", () => {
    const big = { ...door, widthM: 20, heightM: 6.5 };
    const e = fieldOf(() => computeLedger({ site, rooms: [dockRoom()], doors: [big] }));
    expect(e.field).toBe("doors.0.wall");
    expect(e.message).toMatch(/130\.00 m².*120\.00 m²/);
  });

  it("a door's wall must be a wall of a room it joins", () => {
    const other = fieldOf(() => computeLedger({ site, rooms: [dockRoom()], doors: [{ ...door, wall: { roomId: "nope", surfaceIndex: 0 } }] }));
    expect(other.field).toBe("doors.0.wall.roomId");
    const idx = fieldOf(() => computeLedger({ site, rooms: [dockRoom()], doors: [{ ...door, wall: { roomId: "chill", surfaceIndex: 3 } }] }));
    expect(idx.field).toBe("doors.0.wall.surfaceIndex");
    expect(idx.message).toMatch(/between 0 and 0/);
    const roofRoom = { ...dockRoom(), surfaces: [{ kind: "roof" as const, uValueWm2K: 0.2, otherSide: "outdoors" as const }] };
    const roof = fieldOf(() => computeLedger({ site, rooms: [roofRoom], doors: [door] }));
    expect(roof.field).toBe("doors.0.wall.surfaceIndex");
    expect(roof.message).toMatch(/roof/);
  });

  it("a designer's natural input computes: a dock room with two doors in the north wall and a NE wall", () => {
    const r = computeLedger({
      site,
      rooms: [
        {
          ...dockRoom(),
          surfaces: [
            { kind: "wall", orientation: "N", along: "length", uValueWm2K: 0.25, otherSide: "outdoors" },
            { kind: "wall", orientation: "NE", along: "width", uValueWm2K: 0.25, otherSide: "outdoors", colour: "dark" },
            { kind: "roof", uValueWm2K: 0.2, otherSide: "outdoors", colour: "light" },
          ],
        },
      ],
      doors: [
        { id: "a", widthM: 3, heightM: 4, sides: ["chill", "outdoors"], passagesPerDay: 40, protection: "stripCurtain", wall: { roomId: "chill", surfaceIndex: 0 }, uValueWm2K: 0.5 },
        { id: "b", widthM: 1, heightM: 2.1, sides: ["chill", "outdoors"], passagesPerDay: 10, wall: { roomId: "chill", surfaceIndex: 0 } },
      ],
    }).rooms[0];
    const north = r.components.find((c) => c.label.startsWith("wall N"))!;
    expect(north.trace.inputs.areaM2).toBeCloseTo(120 - 12 - 2.1, 9);
    expect(r.components.find((c) => c.label.startsWith("wall NE"))!.trace.inputs.solarAllowanceK).toBe(2.5);
    expect(r.components.filter((c) => c.kind === "infiltration")).toHaveLength(2);
    expect(Number.isFinite(r.designCapacityW)).toBe(true);
  });
});
