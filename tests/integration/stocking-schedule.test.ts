import { describe, expect, it } from "vitest";
import { readFileSync } from "node:fs";
import path from "node:path";
import { and, eq } from "drizzle-orm";
import ExcelJS from "exceljs";
import { db } from "@/db/client";
import { auditLog, exportsLog } from "@/db/schema";
import { createFacility } from "@/features/facilities/queries";
import { loadFacilityModel, saveFacilityModel } from "@/features/facilities/model";
import type { ModelDoc } from "@/features/facilities/engine-model";
import { acceptScenario, applyScenario, createScenario, listScenarios } from "@/features/stocking-check/queries";
import { prepareExport, scheduleDto } from "@/features/schedule/queries";
import { SHEETS, workbookBuffer } from "@/features/schedule/workbook";
import { scenarioChangesSchema } from "@/lib/engine/stocking";
import { importRooms, importStocking } from "@/features/import/queries";
import { makeUser, makeWorkspace } from "../factories";

const read = (p: string) => JSON.parse(readFileSync(path.resolve(import.meta.dirname, "../..", p), "utf8"));
const demo = read("seeds/data/harrowfield-model.json") as ModelDoc;
const { $comment, ...installed } = read("lib/engine/stocking/fixtures/harrowfield-installed.json");
void $comment;
// The invented demo site (PRODUCT.md): 32 °C dry bulb, 23 °C wet bulb, 150 m.
const SITE = { designDryBulbC: 32, coincidentWetBulbC: 23, groundTempC: 12, elevationM: 150 };

async function setup() {
  const ws = await makeWorkspace();
  const u = await makeUser();
  const f = await createFacility(ws.id, u.id, { name: "Stocking test", site: SITE });
  const doc = { ...demo, plant: { ...(demo.plant ?? {}), installed } } as ModelDoc;
  await saveFacilityModel({ workspaceId: ws.id, facilityId: f.id, userId: u.id, baseVersion: 1, doc, summary: "with installed plant" });
  return { ws, u, f };
}

const apples = (tonnesPerDay: number) => scenarioChangesSchema.parse({ rooms: [{ roomId: "apples", tonnesPerDay }] });

describe("stocking checks against the stored model", () => {
  it("fits, tight and short verdicts; the solved intake fits and a little more does not", async () => {
    const { ws, u, f } = await setup();
    const design = await createScenario(ws.id, f.id, u.id, { name: "as designed", changes: apples(15) });
    expect(design.verdict).toBe("fits");
    expect(design.author?.name).toBeTruthy();
    const max = design.result!.solves[0].maxTonnesPerDay;
    expect(max.status).toBe("boundary");
    const at = await createScenario(ws.id, f.id, u.id, { name: "at the limit", changes: apples(max.value!) });
    // At the solved limit the headroom is within the bisection tolerance of zero: under 10 %, so tight.
    expect(at.verdict).toBe("tight");
    const over = await createScenario(ws.id, f.id, u.id, { name: "over", changes: apples(max.value! + 5 * max.tolerance) });
    expect(over.verdict).toBe("shortfall");
    expect(over.result!.limiting!.headroomW).toBeLessThan(0);
    expect((await listScenarios(ws.id, f.id)).map((s) => s.name)).toEqual(["over", "at the limit", "as designed"]);
    await expect(acceptScenario(ws.id, f.id, over.id)).rejects.toMatchObject({ code: "conflict" });
  });

  it("applies an accepted check as a new model version and audits it; unaccepted ones are refused", async () => {
    const { ws, u, f } = await setup();
    const s = await createScenario(ws.id, f.id, u.id, { name: "17 t/day", changes: apples(17) });
    await expect(applyScenario({ workspaceId: ws.id, facilityId: f.id, id: s.id, userId: u.id, userEmail: u.email })).rejects.toMatchObject({ code: "conflict" });
    await acceptScenario(ws.id, f.id, s.id);
    const r = await applyScenario({ workspaceId: ws.id, facilityId: f.id, id: s.id, userId: u.id, userEmail: u.email });
    expect(r.version).toBe(3);
    expect(r.scenario.appliedRevision).toBe(3);
    const m = await loadFacilityModel(ws.id, f.id);
    const room = (m.doc.rooms as { id: string; products: { massKgPerDay: number }[] }[]).find((x) => x.id === "apples")!;
    expect(room.products[0].massKgPerDay).toBe(17_000); // 17 t/day × 1000 kg/t
    const audits = await db.select().from(auditLog).where(and(eq(auditLog.workspaceId, ws.id), eq(auditLog.action, "scenario.applied")));
    expect(audits).toHaveLength(1);
  });

  it("refuses a change that cannot apply, naming the field, and stores nothing", async () => {
    const { ws, u, f } = await setup();
    await expect(createScenario(ws.id, f.id, u.id, { name: "x", changes: scenarioChangesSchema.parse({ rooms: [{ roomId: "dock", tonnesPerDay: 3 }] }) })).rejects.toMatchObject({
      code: "validation",
      field: "changes.rooms.0.commodityId",
    });
    expect(await listScenarios(ws.id, f.id)).toHaveLength(0);
  });
});

describe("schedule exports", () => {
  it("records each export with revision and issued flag, and marks what changed since", async () => {
    const { ws, u, f } = await setup();
    const user = { id: u.id, email: u.email, name: u.name, unitSystem: "SI" as const };
    const first = await scheduleDto(ws.id, f.id);
    expect(first.firstExport).toBe(true);
    const p = await prepareExport({ workspaceId: ws.id, facilityId: f.id, user, kind: "schedule.xlsx" });
    const wb = new ExcelJS.Workbook();
    await wb.xlsx.load((await workbookBuffer(p.input)) as unknown as ArrayBuffer);
    expect(wb.worksheets.map((w) => w.name)).toEqual(Object.values(SHEETS));
    await p.record();
    const logged = await db.select().from(exportsLog).where(eq(exportsLog.facilityId, f.id));
    expect(logged).toMatchObject([{ revisionNumber: 2, issued: false, kind: "schedule.xlsx", actorId: u.id }]);
    const s = await createScenario(ws.id, f.id, u.id, { name: "more apples", changes: apples(17) });
    await acceptScenario(ws.id, f.id, s.id);
    await applyScenario({ workspaceId: ws.id, facilityId: f.id, id: s.id, userId: u.id, userEmail: u.email });
    const after = await scheduleDto(ws.id, f.id);
    expect(after.firstExport).toBe(false);
    expect(after.rows.find((r) => r.tag === "EV-3")!.mark).toMatchObject({ status: "changed" });
    expect(after.rows.find((r) => r.tag === "EV-1")!.mark).toEqual({ status: "same" });
    const audits = await db.select().from(auditLog).where(and(eq(auditLog.workspaceId, ws.id), eq(auditLog.action, "export.created")));
    expect(audits[0].detail).toMatchObject({ kind: "schedule.xlsx", revision: 2, issued: false });
  });
});

describe("imports", () => {
  const csv = (text: string, mode: "preview" | "commit", name: string | null = null) => ({ buf: Buffer.from(text), fileName: "plan.csv", mode, name });

  it("previews row errors naming the column, refuses the commit and stores nothing; a clean plan becomes one stocking check", async () => {
    const { ws, u, f } = await setup();
    const bad = "Room;Intake [t/day];Entering [°C]\nProduce room +2 °C (apples);12,5;warm\nAttic;3;10\n";
    const preview = await importStocking(ws.id, f.id, u, csv(bad, "preview"));
    expect(preview.errors).toEqual([
      { row: 2, column: "Entering [°C]", message: '"warm" is not a number' },
      { row: 3, column: "Room", message: 'no room "Attic" in this facility' },
    ]);
    await expect(importStocking(ws.id, f.id, u, csv(bad, "commit"))).rejects.toMatchObject({ code: "validation", field: "file" });
    expect(await listScenarios(ws.id, f.id)).toHaveLength(0);
    const good = "Room;Intake [t/day];Entering [°C]\napples;12,5;18\n";
    const done = await importStocking(ws.id, f.id, u, csv(good, "commit", "Plan A"));
    const list = await listScenarios(ws.id, f.id);
    expect(list.map((s) => [s.id, s.name])).toEqual([[done.committed!.scenarioId, "Plan A"]]);
    expect(list[0].changes.rooms).toEqual([{ roomId: "apples", tonnesPerDay: 12.5, enteringTempC: 18 }]);
  });

  it("adds a room list as one new model version, or nothing when a file is refused", async () => {
    const { ws, u, f } = await setup();
    await expect(importRooms(ws.id, f.id, u, { buf: Buffer.from("PK\u0003\u0004garbage"), fileName: "rooms.xlsx", mode: "commit", name: null })).rejects.toMatchObject({ code: "validation", field: "file" });
    expect((await loadFacilityModel(ws.id, f.id)).version).toBe(2);
    const r = await importRooms(ws.id, f.id, u, csv("Name,Length [m],Width [m],Height [m],Set point [°C],Construction\nNew chiller,20,10,8,4,PIR 120\n", "commit"));
    expect(r.committed).toEqual({ version: 3 });
    const m = await loadFacilityModel(ws.id, f.id);
    expect((m.doc.rooms as { name: string }[]).map((x) => x.name)).toContain("New chiller");
    m.engineModel(); // the imported room is a valid model room
  });
});
