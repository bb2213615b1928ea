import { readFileSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { computeFacility, createFacilityEngine } from "@/lib/engine/model";
import { loadFluid } from "@/lib/engine/thermo";
import { parseEngineModel } from "@/features/facilities/engine-model";
import { addNode, connect } from "./graph";
import { evaluate, splitField } from "./evaluate";
import type { CanvasDoc } from "./schema";

const raw = JSON.parse(readFileSync(path.resolve(__dirname, "../../seeds/data/harrowfield-model.json"), "utf8"));
const { $comment, ...demo } = raw;
void $comment;
const DOC = demo as CanvasDoc;
const SITE = { designDryBulbC: 32, coincidentWetBulbC: 23, designRhPct: null, groundTempC: 12, elevationM: 150 };
let n = 0;
const gen = (p: string) => `${p}-e${++n}`;

describe("browser evaluation", () => {
  it("gives exactly the figures the server computes for the same document and site", async () => {
    const ev = await evaluate(DOC, SITE, createFacilityEngine(), loadFluid);
    expect(ev.problems).toEqual([]);
    expect(ev.saveable).toBe(true);
    const parsed = parseEngineModel(DOC as never, SITE);
    expect(parsed.success).toBe(true);
    const server = computeFacility(parsed.data!);
    expect(ev.result!.ledger.totals).toEqual(server.ledger.totals);
    expect(ev.result!.plant.circuits.map((c) => c.cop)).toEqual(server.plant.circuits.map((c) => c.cop));
  });

  it("ties a bad value to its node and field, and a half-drawn item is left out but blocks saving", async () => {
    const bad = structuredClone(DOC);
    bad.rooms[2].setPointC = 45;
    const ev = await evaluate(bad, SITE, createFacilityEngine(), loadFluid);
    expect(ev.result).toBeNull();
    expect(ev.problems).toContainEqual({ nid: "room:apples", field: "setPointC", message: expect.stringContaining("40") });
    const half = addNode(DOC, "evaporator", gen);
    const ev2 = await evaluate(half.doc, SITE, createFacilityEngine(), loadFluid);
    expect(ev2.result).not.toBeNull();
    expect(ev2.skipped.map((s) => s.nid)).toEqual([half.nid]);
    expect(ev2.saveable).toBe(false);
  });

  it("computes a new circuit that has a condenser but no evaporators yet", async () => {
    const c = addNode(DOC, "circuit", gen);
    const d = connect(c.doc, c.nid, "condenser:cd1");
    const ev = await evaluate(d, SITE, createFacilityEngine(), loadFluid);
    expect(ev.problems).toEqual([]);
    expect(ev.saveable).toBe(true);
  });

  it("splits engine field paths in both notations", () => {
    expect(splitField("plant.circuits[2].heatRejection.condensingC")).toEqual(["plant", "circuits", "2", "heatRejection", "condensingC"]);
    expect(splitField("rooms.0.setPointC")).toEqual(["rooms", "0", "setPointC"]);
  });
});
