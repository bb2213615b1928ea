import { readFileSync } from "node:fs";
import path from "node:path";
import { test, expect, request as pwRequest } from "@playwright/test";
import ExcelJS from "exceljs";
import { stateOf, WS } from "./roles";

/**
 * Plant options side by side: the designer uploads a weather file and makes two options, the
 * comparison shows them with the best of each row marked in words, the purchaser downloads it
 * in the Excel export, the viewer reads it and cannot edit. On a facility of this spec's own.
 */
const FACILITY_NAME = "Plant options e2e (invented)";
const SITE = { designDryBulbC: 32, coincidentWetBulbC: 23, groundTempC: 12, elevationM: 150 };
// An invented hourly year: a daily swing around 10 °C, 70 % RH (not a real site).
const WEATHER_CSV = ["Hour,Dry bulb [°C],Relative humidity [%]", ...Array.from({ length: 8760 }, (_, i) => `${i + 1},${(10 + 8 * Math.sin(((i % 24) / 24) * 2 * Math.PI) + 6 * Math.sin((i / 8760) * 2 * Math.PI - Math.PI / 2)).toFixed(1)},70`)].join("\n");
const fixture = (p: string) => {
  const { $comment, ...rest } = JSON.parse(readFileSync(path.resolve(p), "utf8"));
  void $comment;
  return rest;
};

let facilityId: string;
const api = () => `/api/v1/workspaces/${WS}/facilities/${facilityId}`;

test.beforeAll(async ({ baseURL }) => {
  // The facility with the invented demo model and no options (a rerun starts from the same state).
  const designer = await pwRequest.newContext({ baseURL, storageState: stateOf("designer") });
  const list = await (await designer.get(`/api/v1/workspaces/${WS}/facilities`)).json();
  facilityId = (list.facilities as { id: string; name: string }[]).find((x) => x.name === FACILITY_NAME)?.id ?? "";
  if (!facilityId) {
    const r = await designer.post(`/api/v1/workspaces/${WS}/facilities`, { data: { name: FACILITY_NAME, site: SITE } });
    expect(r.status(), await r.text()).toBe(201);
    facilityId = (await r.json()).facility.id;
  }
  const m = await (await designer.get(`${api()}/model`)).json();
  // An invented flat tariff, so the running cost has figures (0.20 per kWh, 8 per kW of monthly peak).
  const doc = { ...fixture("seeds/data/harrowfield-model.json"), plantOptions: [], operation: { tariff: { kind: "flat", pricePerKWh: 0.2, demandChargePerKWMonth: 8 } } };
  const saved = await designer.put(`${api()}/model`, { data: { baseVersion: m.version, doc, summary: "options e2e: start" } });
  expect(saved.status(), await saved.text()).toBe(200);
  await designer.dispose();
});

test.describe.serial("plant options", () => {
  test.describe("designer", () => {
    test.use({ storageState: stateOf("designer") });

    test("uploads a weather file, makes two options and sees them compared, the best of each row marked in words", async ({ page }) => {
      test.setTimeout(300_000); // every edit recomputes the year of three plants on a shared machine
      const up = await page.request.post(`${api()}/weather`, { multipart: { file: { name: "invented-year.csv", mimeType: "text/csv", buffer: Buffer.from(WEATHER_CSV) } } });
      expect(up.status(), await up.text()).toBeLessThan(300);

      await page.goto(`/w/${WS}/f/${facilityId}/options`);
      await expect(page.getByRole("heading", { name: "Plant options", exact: true })).toBeVisible();
      await expect(page.getByText(/Create the first option: it starts as a copy of the design plant/)).toBeVisible();
      await expect(page.getByText(/ · weather: /)).toBeVisible();

      // Two options through the form: each a copy of the design, each a new version.
      for (const name of ["CO2/NH3 cascade", "Two LT standbys"]) {
        await page.getByLabel("New option name").fill(name);
        await page.getByRole("button", { name: "Create option" }).click();
        await expect(page.getByRole("status")).toContainText(`Option "${name}" created`);
        await expect(page.locator(`th[data-option="${name}"]`)).toBeVisible({ timeout: 30_000 }); // the year of every plant is recomputed
      }
      // An empty name is refused beside the field, naming it.
      await page.getByLabel("New option name").fill("  ");
      await page.getByRole("button", { name: "Create option" }).click();
      await expect(page.getByRole("alert").filter({ hasText: "Name: must not be empty" })).toBeVisible();

      // Make the options different plants, as the designer does in the model: the low-temperature
      // circuit of the first becomes a CO2 stage cascading into the ammonia circuit; the second
      // gets a second standby compressor.
      const m = await (await page.request.get(`${api()}/model`)).json();
      const opts = m.doc.plantOptions as { name: string; plant: { circuits: Record<string, unknown>[] } }[];
      const lt = (o: (typeof opts)[number]) => o.plant.circuits.find((c) => c.id === "lt")!;
      Object.assign(lt(opts.find((o) => o.name === "CO2/NH3 cascade")!), { refrigerant: "R744", arrangement: "single-stage", heatRejection: { to: "circuit", circuitId: "mt", condensingC: -5, approachK: 5 } });
      Object.assign(lt(opts.find((o) => o.name === "Two LT standbys")!), { compressor: { type: "screw", units: 4, standbyUnits: 2 } });
      const saved = await page.request.put(`${api()}/model`, { data: { baseVersion: m.version, doc: m.doc, summary: "options e2e: plants" } });
      expect(saved.status(), await saved.text()).toBe(200);

      await page.reload();
      const headers = page.locator("thead th[data-option]");
      await expect(headers).toHaveCount(3);
      await expect(headers.first()).toContainText("Design");
      await expect(headers.first()).toContainText("design");
      // Every figure row has values for all three plants, the year included (weather uploaded).
      for (const row of ["installedRefrigerationW", "annualKWh", "annualCost", "seasonalCOP", "chargeKg", "gwpWeighted", "tewiDirect", "tewiIndirect", "codeAidRatio"])
        await expect(page.locator(`tr[data-row="${row}"] td`).filter({ hasNotText: /^—$/ })).toHaveCount(3);
      await expect(page.locator('tr[data-row="safety"]')).toContainText("R744 A1");
      // The cascade uses more energy here than the ammonia plants, so it is not the cheapest to run.
      await expect(page.locator('tr[data-row="annualCost"] td').nth(1)).not.toHaveAttribute("data-best", "true");
      await expect(page.locator('tr[data-row="annualCost"] td').first()).toContainText("EUR");
      await expect(page.locator('tr[data-row="gwpWeighted"]')).toContainText("R717 0");
      // The best of a row is marked by text: ammonia only (GWP 0) has no direct TEWI.
      const bestDirect = page.locator('tr[data-row="tewiDirect"] td[data-best="true"]');
      await expect(bestDirect).toHaveCount(2);
      await expect(bestDirect.first()).toContainText("★ best");
      await expect(page.locator('tr[data-row="tewiDirect"] td').nth(1)).not.toHaveAttribute("data-best", "true");
      // More installed capacity with a second standby: the design or the cascade is best there, not it.
      await expect(page.locator('tr[data-row="installedRefrigerationW"] td').nth(2)).not.toHaveAttribute("data-best", "true");
      await expect(page.getByText(/Local codes govern and a licensed professional decides/)).toBeVisible();
      await expect(page.locator("figure svg.recharts-surface").first()).toBeVisible();
      await page.screenshot({ path: ".run/test/screenshots/options-compare.png", fullPage: true });

      // The user's own internal volume for a part replaces the default (the manufacturer's receiver: 2000 dm³, half full).
      await page.getByText("Charge estimate, part by part").click();
      const receiver = page.locator('form[aria-label="Charge estimate of Design"] tr[data-part="receiver:lt"]');
      await expect(receiver).toContainText("common practice");
      await page.getByLabel("Design C-1 High-pressure receiver volume, dm³").fill("2000");
      await page.getByLabel("Design C-1 High-pressure receiver liquid fraction").fill("0.5");
      await page.getByRole("button", { name: "Save volumes of Design" }).click();
      await expect(receiver).toContainText("volume entered by the user", { timeout: 30_000 });
      await expect(receiver.locator("td").nth(2)).toHaveText("2,000.0");
      const stored = await (await page.request.get(`${api()}/model`)).json();
      expect(stored.doc.plantStudy.designAssessment.chargeOverrides).toEqual([{ id: "receiver:lt", volumeM3: 2, liquidFraction: 0.5 }]);

      // Rename one, then make the other the design: a new revision, the former design kept as an option.
      await page.getByRole("button", { name: "Rename Two LT standbys" }).click();
      await page.getByLabel("New name of Two LT standbys").fill("Second LT standby");
      await page.getByRole("button", { name: "Save", exact: true }).first().click();
      await expect(page.locator('th[data-option="Second LT standby"]')).toBeVisible({ timeout: 30_000 });
      const before = (await (await page.request.get(`${api()}/revisions`)).json()).current;
      await page.getByRole("button", { name: "Make Second LT standby the design" }).click();
      await expect(page.getByRole("status")).toContainText('"Second LT standby" is now the design');
      await expect(headers.first()).toContainText("Second LT standby", { timeout: 30_000 });
      await expect(page.locator('th[data-option="Design"]')).toBeVisible();
      expect((await (await page.request.get(`${api()}/revisions`)).json()).current).toBe(before + 1);
      const after = await (await page.request.get(`${api()}/model`)).json();
      expect(after.doc.plant.circuits.find((c: { id: string }) => c.id === "lt").compressor.standbyUnits).toBe(2);
      // The entered receiver volume went with its plant (now the option "Design"), and the forms show each plant's own values.
      await expect(page.getByLabel("Design C-1 High-pressure receiver volume, dm³")).toHaveValue("2000");
      await expect(page.getByLabel("Second LT standby C-1 High-pressure receiver volume, dm³")).toHaveValue("");
      await page.screenshot({ path: ".run/test/screenshots/options-made-design.png", fullPage: true });
    });
  });

  test.describe("purchaser", () => {
    test.use({ storageState: stateOf("purchaser") });

    test("downloads the comparison: its own sheets beside the schedule's, units in the headers, full-precision numbers", async ({ page }) => {
      test.setTimeout(180_000);
      await page.goto(`/w/${WS}/f/${facilityId}/options`);
      await expect(page.locator("thead th[data-option]")).toHaveCount(3);
      await expect(page.getByRole("button", { name: "Create option" })).toHaveCount(0);
      const dto = await (await page.request.get(`${api()}/options`)).json();
      await page.getByRole("button", { name: "Export comparison (Excel)" }).click();
      const bar = page.getByRole("progressbar", { name: /Excel export .*: progress/ });
      await expect(bar).toBeVisible();
      await expect(bar).toHaveAttribute("aria-valuenow", "100", { timeout: 60_000 });
      const download = page.waitForEvent("download");
      await page.getByRole("link", { name: /^Download .*\.xlsx/ }).click();
      const d = await download;
      const wb = new ExcelJS.Workbook();
      await wb.xlsx.readFile((await d.path())!);
      expect(wb.worksheets.map((w) => w.name)).toEqual([
        "Equipment schedule",
        "Room loads",
        "Circuits",
        "Circuit state points",
        "Design basis",
        "Plant options",
        "Option monthly energy",
        "Option charge",
        "Option code aid",
      ]);
      const ws = wb.getWorksheet("Plant options")!;
      const head = (ws.getRow(3).values as unknown[]).slice(1) as string[];
      expect(head).toContain("Annual energy [kWh/year]");
      expect(head).toContain("TEWI indirect n·E·β, 15 years [kg CO2e]");
      const names = [4, 5, 6].map((r) => ws.getRow(r).getCell(1).value);
      expect(names).toEqual(dto.comparison.options.map((o: { name: string }) => o.name));
      const kWh = head.indexOf("Annual energy [kWh/year]") + 1;
      // Full precision: the cell holds the server's figure exactly, not a rounded one.
      expect(ws.getRow(4).getCell(kWh).value).toBe(dto.comparison.options[0].annual.kWh);
      expect(ws.getRow(5).getCell(kWh).value).toBe(dto.comparison.options[1].annual.kWh);
      const months = wb.getWorksheet("Option monthly energy")!;
      expect(months.rowCount - 3).toBe(36);
      await page.screenshot({ path: ".run/test/screenshots/options-export.png" });
    });
  });

  test.describe("viewer", () => {
    test.use({ storageState: stateOf("viewer") });

    test("reads the comparison and cannot create, rename, delete or make an option the design", async ({ page }) => {
      test.setTimeout(120_000);
      await page.goto(`/w/${WS}/f/${facilityId}/options`);
      await expect(page.locator("thead th[data-option]")).toHaveCount(3);
      await expect(page.locator('tr[data-row="annualKWh"]')).toBeVisible();
      await expect(page.getByText(/designers create, rename and delete options/)).toBeVisible();
      for (const name of [/^Rename /, /^Make .* the design$/, /^Delete /, /^Create option$/, /^Export comparison/]) await expect(page.getByRole("button", { name })).toHaveCount(0);
      const dto = await (await page.request.get(`${api()}/options`)).json();
      const oid = dto.comparison.options[1].id;
      for (const [method, url, data] of [
        ["post", api() + "/options", { name: "Viewer's option" }],
        ["patch", `${api()}/options/${oid}`, { name: "Viewer rename" }],
        ["delete", `${api()}/options/${oid}`, undefined],
        ["post", `${api()}/options/${oid}/design`, undefined],
      ] as const) {
        const r = await page.request[method](url, data ? { data } : {});
        expect(r.status(), `${method} ${url}`).toBe(403);
      }
      await page.screenshot({ path: ".run/test/screenshots/options-viewer.png", fullPage: true });
    });
  });
});
