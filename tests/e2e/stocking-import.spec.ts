import { readFileSync } from "node:fs";
import path from "node:path";
import { test, expect } from "@playwright/test";
import { stateOf, WS } from "./roles";
import { facilityWithInstalledPlant } from "./stocking-fixture";

let facilityId: string;

test.beforeAll(async ({ baseURL }) => {
  facilityId = await facilityWithInstalledPlant(baseURL!);
});

test.use({ storageState: stateOf("operations") });

test("operations imports a stocking plan: errors name row and column, then the fixed file becomes a check", async ({ page }) => {
  await page.goto(`/w/${WS}/f/${facilityId}/import`);
  const region = page.getByRole("region", { name: "Import a stocking plan" });
  // Operations may not edit the model, so the room-list import is not offered.
  await expect(page.getByRole("region", { name: "Import a room list" })).toHaveCount(0);
  const bad = "Room;Intake [t/day];Entering [°C]\r\napples;1,234;18\r\n";
  await region.getByLabel("File").setInputFiles({ name: "plan.csv", mimeType: "text/csv", buffer: Buffer.from(bad) });
  await region.getByRole("button", { name: "Preview" }).click();
  await expect(region.getByText("Intake [t/day]: \"1,234\" is ambiguous", { exact: false })).toBeVisible();
  await expect(region.getByRole("button", { name: /Save as a stocking check/ })).toBeDisabled();
  const good = "Room;Intake [t/day];Entering [°C]\r\napples;16,5;18\r\n";
  await region.getByLabel("File").setInputFiles({ name: "plan.csv", mimeType: "text/csv", buffer: Buffer.from(good) });
  await region.getByLabel("Name of the stocking check").fill(`Imported plan ${Date.now()}`);
  await region.getByRole("button", { name: "Preview" }).click();
  await region.getByRole("button", { name: "Save as a stocking check (1 room)" }).click();
  await region.getByRole("link", { name: "open its verdict" }).click();
  await expect(page.getByRole("status", { name: "Verdict" })).toBeVisible();
});

test("a zip bomb named .xlsx is refused before it is read", async ({ page }) => {
  // A ZIP whose directory declares a 200 MB sheet from a few hundred bytes (ratio far above 150).
  const entry = (name: string, comp: number, size: number, offset: number) => {
    const n = Buffer.from(name);
    const cd = Buffer.alloc(46);
    cd.writeUInt32LE(0x02014b50, 0);
    cd.writeUInt16LE(8, 10);
    cd.writeUInt32LE(comp, 20);
    cd.writeUInt32LE(size, 24);
    cd.writeUInt16LE(n.length, 28);
    cd.writeUInt32LE(offset, 42);
    return Buffer.concat([cd, n]);
  };
  const local = Buffer.alloc(30);
  local.writeUInt32LE(0x04034b50, 0);
  const dir = entry("xl/worksheets/sheet1.xml", 200, 200 * 1024 * 1024, 0);
  const end = Buffer.alloc(22);
  end.writeUInt32LE(0x06054b50, 0);
  end.writeUInt16LE(1, 8);
  end.writeUInt16LE(1, 10);
  end.writeUInt32LE(dir.length, 12);
  end.writeUInt32LE(30 + 200, 16);
  const bomb = Buffer.concat([local, Buffer.alloc(200), dir, end]);
  const r = await page.request.post(`/api/v1/workspaces/${WS}/facilities/${facilityId}/import/stocking`, {
    multipart: { mode: "preview", file: { name: "plan.xlsx", mimeType: "application/vnd.openxmlformats-officedocument.spreadsheetml.sheet", buffer: bomb } },
  });
  expect(r.status()).toBe(400);
  expect((await r.json()).error.message).toMatch(/zip bomb/);
});

test.describe("a commit refused on the worker", () => {
  test.use({ storageState: stateOf("designer") });

  test("says why in words, naming the row, and nothing is imported", async ({ page }) => {
    // A facility of its own, with the invented demo rooms.
    const site = { designDryBulbC: 32, coincidentWetBulbC: 23, groundTempC: 12, elevationM: 150 };
    const made = await page.request.post(`/api/v1/workspaces/${WS}/facilities`, { data: { name: `Import race ${Date.now()}`, site } });
    expect(made.status()).toBe(201);
    const fid = (await made.json()).facility.id as string;
    const modelUrl = `/api/v1/workspaces/${WS}/facilities/${fid}/model`;
    const demo = JSON.parse(readFileSync(path.resolve("seeds/data/harrowfield-model.json"), "utf8"));
    delete demo.$comment;
    const first = await (await page.request.get(modelUrl)).json();
    expect((await page.request.put(modelUrl, { data: { baseVersion: first.version, doc: demo, summary: "demo rooms" } })).status()).toBe(200);

    await page.goto(`/w/${WS}/f/${fid}/import`);
    const region = page.getByRole("region", { name: "Import a stocking plan" });
    await region.getByLabel("File").setInputFiles({ name: "plan.csv", mimeType: "text/csv", buffer: Buffer.from("Room;Intake [t/day];Entering [°C]\r\nProduce room +2 °C (apples);16,5;18\r\n") });
    await region.getByRole("button", { name: "Preview" }).click();
    const save = region.getByRole("button", { name: "Save as a stocking check (1 room)" });
    await expect(save).toBeEnabled();
    // Meanwhile someone renames the room the plan names (by its name): the commit, checked again on the worker, is refused.
    const cur = await (await page.request.get(modelUrl)).json();
    const rooms = cur.doc.rooms.map((r: { name: string }) => (r.name === "Produce room +2 °C (apples)" ? { ...r, name: "Pear store +2 °C" } : r));
    expect((await page.request.put(modelUrl, { data: { baseVersion: cur.version, doc: { ...cur.doc, rooms }, summary: "room renamed" } })).status()).toBe(200);
    await save.click();
    const alert = region.getByRole("alert");
    await expect(alert).toContainText("Import of plan.csv failed: 1 problem in the file; nothing was imported.");
    await expect(alert).toContainText('no room "Produce room +2 °C (apples)" in this facility');
    await expect(region.getByRole("progressbar")).toHaveAttribute("aria-valuetext", /Failed/);
    await region.screenshot({ path: ".run/test/screenshots/import-job-failed.png" });
    const checks = await (await page.request.get(`/api/v1/workspaces/${WS}/facilities/${fid}/scenarios`)).json();
    expect(checks.scenarios).toHaveLength(0);
  });
});
