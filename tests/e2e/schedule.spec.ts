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

  test("exports the schedule on the worker with a progress bar; the download is a valid .xlsx with every sheet", async ({ page }) => {
    await page.goto(`/w/${WS}/f/${facilityId}/schedule`);
    await expect(page.getByRole("heading", { name: "Equipment schedule", exact: true })).toBeVisible();
    await expect(page.locator("tr[data-tag='EV-1']")).toBeVisible();
    const started = page.waitForResponse((r) => r.url().endsWith("/exports") && r.request().method() === "POST");
    await page.getByRole("button", { name: "Export to Excel (.xlsx)" }).click();
    const res = await started;
    expect(res.status()).toBe(202);
    const { job } = await res.json();
    expect(job).toMatchObject({ kind: "schedule.export", status: "queued" });
    // The export runs as a job: a progress bar with its stage, and the page stays usable meanwhile.
    const bar = page.getByRole("progressbar", { name: "Excel export: progress" });
    await expect(bar).toBeVisible();
    await page.getByLabel("Filter").fill("EV-1");
    await expect(page.locator("tr[data-tag='EV-1']")).toBeVisible();
    await page.getByLabel("Filter").fill("");
    await expect(bar).toHaveAttribute("aria-valuenow", "100");
    await expect(bar).toHaveAttribute("aria-valuetext", /^100% · Ready: \d+ items exported as \.xlsx/);
    const status = await (await page.request.get(job.url)).json();
    expect(status.job).toMatchObject({ status: "done", progress: 1, attempts: 1, error: null });
    expect(status.job.file).toMatchObject({ name: expect.stringMatching(/\.xlsx$/), mime: expect.stringContaining("spreadsheetml") });
    expect(status.job.file.bytes).toBeGreaterThan(5000);
    await page.screenshot({ path: ".run/test/screenshots/schedule-export-job.png" });
    const download = page.waitForEvent("download");
    await page.getByRole("link", { name: /^Download .*\.xlsx/ }).click();
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
    // Leaving and coming back (the same tab) still shows the finished export and its download.
    await page.reload();
    await expect(page.getByRole("link", { name: /^Download .*\.xlsx/ })).toBeVisible();
  });
});

test.describe("viewer", () => {
  test.use({ storageState: stateOf("viewer") });

  test("reads the schedule but is refused the export", async ({ page }) => {
    await page.goto(`/w/${WS}/f/${facilityId}/schedule`);
    await expect(page.locator("tr[data-tag='EV-1']")).toBeVisible();
    await expect(page.getByRole("button", { name: /Export/ })).toHaveCount(0);
    for (const format of ["xlsx", "csv"]) {
      const r = await page.request.post(`/api/v1/workspaces/${WS}/facilities/${facilityId}/exports`, { data: { format } });
      expect(r.status()).toBe(403);
      expect((await r.json()).error.message).toMatch(/may not export the equipment schedule/);
    }
  });
});
