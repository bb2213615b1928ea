import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { canonicalJson, mergeThreeWay } from "./merge";

const base = {
  schemaVersion: 1,
  rooms: [
    { id: "a", name: "Frozen", setPointC: -25 },
    { id: "b", name: "Dock", setPointC: 5 },
  ],
  doors: [],
};

describe("three-way merge of model documents", () => {
  it("keeps both sides' edits to different rooms and fields", () => {
    const theirs = { ...base, rooms: [{ ...base.rooms[0], setPointC: -28 }, base.rooms[1]] };
    const mine = { ...base, rooms: [base.rooms[0], { ...base.rooms[1], name: "Loading dock" }], doors: [{ id: "d1", sides: ["a", "b"] }] };
    const r = mergeThreeWay(base, theirs, mine);
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.merged).toEqual({
      schemaVersion: 1,
      rooms: [
        { id: "a", name: "Frozen", setPointC: -28 },
        { id: "b", name: "Loading dock", setPointC: 5 },
      ],
      doors: [{ id: "d1", sides: ["a", "b"] }],
    });
  });

  it("reports a conflict when both change the same field differently", () => {
    const theirs = { ...base, rooms: [{ ...base.rooms[0], setPointC: -28 }, base.rooms[1]] };
    const mine = { ...base, rooms: [{ ...base.rooms[0], setPointC: -30 }, base.rooms[1]] };
    expect(mergeThreeWay(base, theirs, mine)).toEqual({ ok: false, conflicts: ["rooms[a].setPointC"] });
  });

  it("a deletion on one side and an edit of the same item on the other conflict", () => {
    const theirs = { ...base, rooms: [base.rooms[1]] };
    const mine = { ...base, rooms: [{ ...base.rooms[0], name: "Frozen store" }, base.rooms[1]] };
    const r = mergeThreeWay(base, theirs, mine);
    expect(r.ok).toBe(false);
  });

  it("merging with an unchanged side returns the other side exactly", () => {
    fc.assert(
      fc.property(fc.jsonValue(), (v) => {
        const a = mergeThreeWay(base, base, v);
        const b = mergeThreeWay(base, v, base);
        expect(a.ok && canonicalJson(a.merged)).toBe(canonicalJson(v));
        expect(b.ok && canonicalJson(b.merged)).toBe(canonicalJson(v));
      }),
      { seed: 42, numRuns: 200 },
    );
  });

  it("canonical JSON ignores key order", () => {
    expect(canonicalJson({ b: 1, a: [1, { d: 2, c: 3 }] })).toBe(canonicalJson({ a: [1, { c: 3, d: 2 }], b: 1 }));
  });
});
