import { describe, expect, it } from "vitest";
import { readFileSync } from "node:fs";
import path from "node:path";
import { eq } from "drizzle-orm";
import { db } from "@/db/client";
import { facilityRevisions } from "@/db/schema";
import { createFacility } from "@/features/facilities/queries";
import {
  computeFacilityResults,
  issueRevision,
  listRevisions,
  loadFacilityModel,
  restoreRevision,
  saveFacilityModel,
} from "@/features/facilities/model";
import type { ModelDoc } from "@/features/facilities/engine-model";
import { makeUser, makeWorkspace } from "../factories";

const demo = JSON.parse(readFileSync(path.resolve(import.meta.dirname, "../../seeds/data/harrowfield-model.json"), "utf8")) as ModelDoc;
// The invented demo site (PRODUCT.md): 32 °C dry bulb, 23 °C wet bulb, 150 m.
const SITE = { designDryBulbC: 32, coincidentWetBulbC: 23, groundTempC: 12, elevationM: 150 };

async function setup() {
  const ws = await makeWorkspace();
  const u = await makeUser();
  const f = await createFacility(ws.id, u.id, { name: "Model test", site: SITE });
  const saved = await saveFacilityModel({ workspaceId: ws.id, facilityId: f.id, userId: u.id, baseVersion: 1, doc: demo, summary: "demo model" });
  return { ws, u, f, saved };
}

type Room = { id: string; setPointC: number; name: string };

describe("facility model documents", () => {
  it("saves a version with its revision, and results carry the engine version and an input hash", async () => {
    const { ws, f, saved } = await setup();
    expect(saved.version).toBe(2);
    const m = await loadFacilityModel(ws.id, f.id);
    expect((m.doc.rooms as Room[]).map((r) => r.id)).toEqual((demo.rooms as Room[]).map((r) => r.id));
    const r = await computeFacilityResults(m.engineModel());
    expect(r.inputHash).toMatch(/^[0-9a-f]{16}$/);
    expect(r.engineVersion).toBeTruthy();
    for (const c of r.result.plant.circuits) {
      expect(c.copCarnot).not.toBeNull();
      expect(c.cop).toBeLessThan(c.copCarnot as number);
    }
    expect((await listRevisions(f.id)).map((x) => x.number)).toEqual([2, 1]);
  });

  it("merges concurrent edits to different rooms; refuses overlapping ones with the current document and stores nothing", async () => {
    const { ws, u, f } = await setup();
    const base = (await loadFacilityModel(ws.id, f.id)).doc;
    const rooms = base.rooms as Room[];
    const a = { ...base, rooms: rooms.map((r, i) => (i === 0 ? { ...r, setPointC: -28 } : r)) };
    const b = { ...base, rooms: rooms.map((r, i) => (i === 1 ? { ...r, name: "Blast freezer B" } : r)) };
    const first = await saveFacilityModel({ workspaceId: ws.id, facilityId: f.id, userId: u.id, baseVersion: 2, doc: a });
    const second = await saveFacilityModel({ workspaceId: ws.id, facilityId: f.id, userId: u.id, baseVersion: 2, doc: b });
    expect(first.rebased).toBe(false);
    expect(second.rebased).toBe(true);
    const now = (await loadFacilityModel(ws.id, f.id)).doc.rooms as Room[];
    expect(now[0].setPointC).toBe(-28);
    expect(now[1].name).toBe("Blast freezer B");

    const c = { ...base, rooms: rooms.map((r, i) => (i === 0 ? { ...r, setPointC: -30 } : r)) };
    await expect(saveFacilityModel({ workspaceId: ws.id, facilityId: f.id, userId: u.id, baseVersion: 2, doc: c })).rejects.toMatchObject({
      code: "conflict",
      extra: { conflicts: [`rooms[${rooms[0].id}].setPointC`], current: { version: 4 } },
    });
    expect((await loadFacilityModel(ws.id, f.id)).version).toBe(4);
  });

  it("refuses an invalid model with a field path into it, storing nothing", async () => {
    const { ws, u, f } = await setup();
    const bad = { ...demo, rooms: (demo.rooms as Room[]).map((r, i) => (i === 0 ? { ...r, rhPct: 130 } : r)) };
    await expect(saveFacilityModel({ workspaceId: ws.id, facilityId: f.id, userId: u.id, baseVersion: 2, doc: bad })).rejects.toMatchObject({
      code: "validation",
      field: "model.rooms.0.rhPct",
    });
    expect((await loadFacilityModel(ws.id, f.id)).version).toBe(2);
  });

  it("issued revisions are locked; restore makes a new version", async () => {
    const { ws, u, f } = await setup();
    await issueRevision(f.id, 2, u.id, { letter: "A", status: "for comment", checkedBy: "K. Checker" });
    await expect(issueRevision(f.id, 2, u.id, { letter: "B", status: "for comment", checkedBy: "K. Checker" })).rejects.toMatchObject({ code: "conflict" });
    const reason = await db
      .update(facilityRevisions)
      .set({ summary: "tampered" })
      .where(eq(facilityRevisions.facilityId, f.id))
      .then(
        () => "no error",
        (e: Error & { cause?: Error }) => `${e.message} ${e.cause?.message ?? ""}`,
      );
    expect(reason).toMatch(/issued and locked/);
    const r = await restoreRevision(ws.id, f.id, 1, u.id);
    expect(r.version).toBe(3);
    expect((await loadFacilityModel(ws.id, f.id)).doc.rooms).toEqual([]);
  });
});
