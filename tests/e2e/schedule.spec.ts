import { test, expect } from "@playwright/test";
import ExcelJS from "exceljs";
import { stateOf, WS } from "./roles";
import { facilityWithInstalledPlant } from "./stocking-fixture";

let facilityId: string;

test.beforeAll(async ({ baseURL }) => {
  facilityId = await facilityWithInstalledPlant(baseURL!);
});

test.describe("purchaser", () => {
  test.use({ storageState: stateOf("purchaser") });

  test("exports the schedule; the download is a valid .xlsx with every sheet", async ({ page }) => {
    await page.goto(`/w/${WS}/f/${facilityId}/schedule`);
    await expect(page.getByRole("heading", { name: "Equipment schedule", exact: true })).toBeVisible();
    await expect(page.locator("tr[data-tag='EV-1']")).toBeVisible();
    const download = page.waitForEvent("download");
    await page.getByRole("button", { name: "Export to Excel (.xlsx)" }).click();
    const d = await download;
    expect(d.suggestedFilename()).toMatch(/\.xlsx$/);
    const wb = new ExcelJS.Workbook();
    await wb.xlsx.readFile((await d.path())!);
    expect(wb.worksheets.map((w) => w.name)).toEqual(["Equipment schedule", "Room loads", "Circuits", "Circuit state points", "Design basis"]);
    const tags: unknown[] = [];
    wb.getWorksheet("Equipment schedule")!.getColumn(1).eachCell((c, row) => {
      if (row > 3) tags.push(c.value);
    });
    expect(tags).toContain("EV-1");
    await expect(page.getByText(/the export is recorded/)).toBeVisible();
    await expect(page.getByText(/last exported .* by Pia Purchaser/)).toBeVisible();
  });
});

test.describe("viewer", () => {
  test.use({ storageState: stateOf("viewer") });

  test("reads the schedule but is refused the export", async ({ page }) => {
    await page.goto(`/w/${WS}/f/${facilityId}/schedule`);
    await expect(page.locator("tr[data-tag='EV-1']")).toBeVisible();
    await expect(page.getByRole("button", { name: /Export/ })).toHaveCount(0);
    for (const ext of ["xlsx", "csv"]) {
      const r = await page.request.get(`/api/v1/workspaces/${WS}/facilities/${facilityId}/export.${ext}`);
      expect(r.status()).toBe(403);
      expect((await r.json()).error.message).toMatch(/may not export the equipment schedule/);
    }
  });
});
