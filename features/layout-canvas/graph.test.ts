import { readFileSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { facilityModelSchema } from "@/lib/engine/model";
import { toEngineInput } from "@/features/facilities/engine-model";
import {
  addNode,
  autoLayout,
  checkConnection,
  connect,
  copyNodes,
  disconnect,
  linksOf,
  nodeForPath,
  nodeIdsOf,
  pasteClip,
  pruneIncomplete,
  removeNodes,
} from "./graph";
import { initHistory, push, redo, reset, undo } from "./history";
import type { CanvasDoc } from "./schema";

const raw = JSON.parse(readFileSync(path.resolve(__dirname, "../../seeds/data/harrowfield-model.json"), "utf8"));
const { $comment, site: extras, ...rest } = raw;
void $comment;
const demo = { ...rest, site: extras } as CanvasDoc;
const SITE = { designDryBulbC: 32, coincidentWetBulbC: 23, designRhPct: null, groundTempC: 12, elevationM: 150 };

let n = 0;
const gen = (p: string) => `${p}-t${++n}`;

const valid = (d: CanvasDoc) => facilityModelSchema.safeParse(toEngineInput(d as never, SITE)).success;

describe("document ↔ links", () => {
  it("draws one link per reference of the demo facility", () => {
    const links = linksOf(demo);
    // 6 doors × 2 sides + 5 evaporators × (room + circuit) + 2 circuits → condenser.
    expect(links).toHaveLength(6 * 2 + 5 * 2 + 2);
    expect(links).toContainEqual({ id: "link:door:d-dock-1:1", kind: "door-side", source: "door:d-dock-1", target: "outdoors" });
    expect(links).toContainEqual({ id: "link:evcircuit:ev-blast", kind: "evaporator-circuit", source: "evaporator:ev-blast", target: "circuit:lt" });
  });

  it("places every node, rooms in a row above their evaporators, circuits and condensers below", () => {
    const pos = autoLayout(demo, {});
    for (const nid of nodeIdsOf(demo)) expect(pos[nid]).toBeDefined();
    expect(pos["evaporator:ev-frozen"].x).toBe(pos["room:frozen-store"].x);
    expect(pos["evaporator:ev-frozen"].y).toBeGreaterThan(pos["room:frozen-store"].y);
    expect(pos["circuit:lt"].y).toBeGreaterThan(pos["evaporator:ev-frozen"].y);
    expect(pos["condenser:cd1"].y).toBeGreaterThan(pos["circuit:lt"].y);
    const keys = new Set(Object.values(pos).map((p) => `${p.x}|${p.y}`));
    expect(keys.size).toBe(Object.keys(pos).length);
    // Doors share a row and never overlap (a node is about 200 px wide).
    const doorXs = demo.doors.map((d) => pos[`door:${d.id}`].x).sort((a, b) => a - b);
    for (let i = 1; i < doorXs.length; i++) expect(doorXs[i] - doorXs[i - 1]).toBeGreaterThanOrEqual(200);
    expect(autoLayout(demo, { "room:blast": { x: 5, y: 7 } })["room:blast"]).toEqual({ x: 5, y: 7 });
  });
});

describe("connection rules", () => {
  it("refuses what the product's rules refuse, with a message that says why", () => {
    const r1 = checkConnection(demo, "room:apples", "room:dock");
    expect(r1).toEqual({ ok: false, message: expect.stringContaining("add a door") });
    const r2 = checkConnection(demo, "room:apples", "circuit:mt");
    expect(r2.ok).toBe(false);
    const r3 = checkConnection(demo, "evaporator:ev-apples", "room:dock");
    expect(r3).toEqual({ ok: false, message: expect.stringContaining("an evaporator sits in one room") });
    const r4 = checkConnection(demo, "door:d-fs", "room:apples");
    expect(r4).toEqual({ ok: false, message: expect.stringContaining("a door joins two spaces") });
    expect(checkConnection(demo, "circuit:lt", "condenser:cd1").ok).toBe(false);
  });

  it("connects a new door to a room and Outdoors, a new evaporator to room and circuit", () => {
    let d = demo;
    const door = addNode(d, "door", gen);
    d = door.doc;
    expect(checkConnection(d, door.nid, "room:apples").ok).toBe(true);
    d = connect(d, "room:apples", door.nid);
    d = connect(d, door.nid, "outdoors");
    const created = d.doors.find((x) => `door:${x.id}` === door.nid)!;
    expect(created.sides).toEqual(["apples", "outdoors"]);
    const ev = addNode(d, "evaporator", gen);
    d = connect(connect(ev.doc, ev.nid, "room:apples"), ev.nid, "circuit:mt");
    expect(d.plant.evaporators!.at(-1)).toMatchObject({ roomId: "apples", circuitId: "mt", tag: "EV-6" });
    expect(valid(d)).toBe(true);
  });

  it("builds a cascade and refuses a loop", () => {
    let d = demo;
    const c = addNode(d, "circuit", gen);
    d = c.doc;
    d = connect(d, c.nid, "circuit:mt");
    expect(d.plant.circuits!.at(-1)!.heatRejection).toEqual({ to: "circuit", circuitId: "mt" });
    const c2 = addNode(d, "circuit", gen);
    d = connect(c2.doc, c2.nid, c.nid);
    const loop = checkConnection(disconnect(d, ["link:reject:mt"]), "circuit:mt", c2.nid);
    expect(loop).toEqual({ ok: false, message: expect.stringContaining("cascade loop") });
  });
});

describe("edits", () => {
  it("deleting a room clears the references to it and keeps its evaporator, unlinked", () => {
    const d = removeNodes(demo, ["room:apples"]);
    expect(d.rooms.map((r) => r.id)).not.toContain("apples");
    expect(d.doors.find((x) => x.id === "d-ap")!.sides).toEqual(["", "dock"]);
    expect(d.plant.evaporators!.find((e) => e.id === "ev-apples")!.roomId).toBe("");
    // Untouched entities keep their identity (the incremental engine relies on it).
    expect(d.rooms[0]).toBe(demo.rooms[0]);
  });

  it("deleting a room takes the plant options' evaporators in it along, so every option stays valid", () => {
    const withOptions = { ...demo, plantOptions: [{ id: "o1", name: "Alt", plant: structuredClone(demo.plant) }, { id: "o2", name: "No apples", plant: { circuits: demo.plant.circuits, condensers: demo.plant.condensers, evaporators: demo.plant.evaporators!.filter((e) => e.roomId !== "apples") } }] } as CanvasDoc;
    const d = removeNodes(withOptions, ["room:apples"]);
    const opts = d.plantOptions as { plant: { evaporators: { id: string; roomId: string }[] } }[];
    expect(opts[0].plant.evaporators.map((e) => e.id)).not.toContain("ev-apples");
    expect(opts[0].plant.evaporators).toHaveLength(demo.plant.evaporators!.length - 1);
    expect(opts[1]).toBe((withOptions.plantOptions as unknown[])[1]);
    const { doc } = pruneIncomplete(d);
    const r = facilityModelSchema.safeParse(toEngineInput(doc, SITE));
    expect(r.success ? [] : r.error.issues.map((i) => i.path.join("."))).toEqual([]);
  });

  it("a half-drawn model still computes: unconnected items are left out and listed", () => {
    let d = addNode(demo, "door", gen).doc;
    d = addNode(d, "evaporator", gen).doc;
    d = disconnect(d, ["link:reject:lt"]);
    const { doc, skipped } = pruneIncomplete(d);
    expect(skipped.map((s) => s.nid?.split(":")[0] ?? "installed")).toEqual(["door", "circuit", "evaporator", "evaporator", "evaporator", "installed", "installed", "installed"]);
    expect(skipped.find((s) => s.nid === "circuit:lt")!.message).toContain("rejects its heat nowhere");
    expect(doc.plant.circuits!.map((c) => c.id)).toEqual(["mt"]);
    expect(valid(doc)).toBe(true);
    expect(pruneIncomplete(demo).doc).toBe(demo);
  });

  it("copy and paste makes new ids and tags and keeps links inside the copy", () => {
    const clip = copyNodes(demo, ["room:apples", "evaporator:ev-apples"], { "room:apples": { x: 0, y: 0 } });
    const p = pasteClip(demo, clip, gen);
    expect(p.nids).toHaveLength(2);
    const room = p.doc.rooms.at(-1)!;
    expect(room.name).toContain("(copy)");
    const ev = p.doc.plant.evaporators!.at(-1)!;
    expect(ev.roomId).toBe(room.id);
    expect(ev.circuitId).toBe("mt");
    expect(ev.tag).toBe("EV-6");
    expect(p.positions[`room:${room.id}`]).toEqual({ x: 40, y: 40 });
    expect(valid(p.doc)).toBe(true);
  });

  it("maps validation paths to the node and the field", () => {
    expect(nodeForPath(demo, ["rooms", 2, "setPointC"])).toEqual({ nid: "room:apples", field: "setPointC" });
    expect(nodeForPath(demo, ["plant", "circuits", 1, "compressor", "units"])).toEqual({ nid: "circuit:mt", field: "compressor.units" });
    expect(nodeForPath(demo, ["site", "designDryBulbC"]).nid).toBeNull();
  });
});

describe("undo history", () => {
  it("undoes and redoes whole documents, coalescing a burst on one field", () => {
    let h = initHistory(1);
    h = push(h, 2, { key: "a", now: 0 });
    h = push(h, 3, { key: "a", now: 500 });
    h = push(h, 4, { key: "b", now: 600 });
    expect(h.past).toEqual([1, 3]);
    h = undo(h);
    expect(h.present).toBe(3);
    h = undo(h);
    expect(h.present).toBe(1);
    h = redo(h);
    expect(h.present).toBe(3);
    h = push(h, 9);
    expect(h.future).toEqual([]);
    expect(reset(5)).toEqual({ past: [], present: 5, future: [] });
  });
});
