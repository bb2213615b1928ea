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
