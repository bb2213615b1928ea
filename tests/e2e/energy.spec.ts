import { execFileSync } from "node:child_process";
import { mkdirSync, readFileSync } from "node:fs";
import path from "node:path";
import { test, expect, request as pwRequest, type Page } from "@playwright/test";
import AxeBuilder from "@axe-core/playwright";
import { stateOf, WS } from "./roles";

/** Serious and critical WCAG 2 A/AA findings inside the page's own content. */
async function axe(page: Page) {
  const r = await new AxeBuilder({ page }).include("main").withTags(["wcag2a", "wcag2aa"]).analyze();
  return r.violations.filter((v) => v.impact === "serious" || v.impact === "critical").map((v) => `${v.id}: ${v.help} (${v.nodes.map((n) => n.target.join(" ")).slice(0, 3).join("; ")})`);
}

const shot = (page: Page, name: string) => page.screenshot({ path: `.run/test/screenshots/${name}.png`, fullPage: true });
const SITE = { designDryBulbC: 32, coincidentWetBulbC: 23, groundTempC: 12, elevationM: 150 };
const FIXTURE = path.resolve(".run/test/invented-weather.csv");
let facilityId: string;

test.beforeAll(async ({ baseURL }) => {
  // The weather file: an invented year written by the repo's own script (fictional data).
  mkdirSync(path.dirname(FIXTURE), { recursive: true });
  execFileSync("npx", ["tsx", "scripts/invent-weather.ts", FIXTURE, "2025", "11"], { stdio: "pipe" });
  const designer = await pwRequest.newContext({ baseURL, storageState: stateOf("designer") });
  const made = await designer.post(`/api/v1/workspaces/${WS}/facilities`, { data: { name: `Energy e2e ${Date.now()} (invented)`, site: SITE } });
  expect(made.status(), await made.text()).toBe(201);
  facilityId = (await made.json()).facility.id;
  const { $comment, ...doc } = JSON.parse(readFileSync("seeds/data/harrowfield-model.json", "utf8"));
  void $comment;
  const saved = await designer.put(`/api/v1/workspaces/${WS}/facilities/${facilityId}/model`, { data: { baseVersion: 1, doc, summary: "demo model" } });
  expect(saved.status(), await saved.text()).toBe(200);
  await designer.dispose();
});

test.describe.configure({ mode: "serial" });

test.describe("designer", () => {
  test.use({ storageState: stateOf("designer") });

  test("uploads a weather file (a bad one is refused by row and column), the year runs, the figures show; a tariff prices it", async ({ page }) => {
    test.setTimeout(120_000);
    await page.goto(`/w/${WS}/f/${facilityId}/energy`);
    await expect(page.getByRole("tab", { name: "Energy" }).or(page.getByRole("link", { name: "Energy" })).first()).toBeVisible();
    await expect(page.getByText("It needs a weather year first.")).toBeVisible();
    const good = readFileSync(FIXTURE, "utf8");
    const bad = good.split("\n").map((l, i) => (i === 2 ? l.replace(/,[^,]+$/, ",104.0") : l)).join("\n");
    await page.getByLabel("Weather file (.csv or .epw)").setInputFiles({ name: "bad-year.csv", mimeType: "text/csv", buffer: Buffer.from(bad) });
    await page.getByRole("button", { name: "Upload weather file" }).click();
    const alert = page.getByRole("alert").filter({ hasText: "nothing was stored" });
    await expect(alert).toBeVisible();
    await expect(alert).toContainText("row 3 · Relative humidity [%]: 104 % is over 100 %");
    await expect(page.getByText("It needs a weather year first.")).toBeVisible();

    await page.getByLabel("Weather file (.csv or .epw)").setInputFiles(FIXTURE);
    await page.getByRole("button", { name: "Upload weather file" }).click();
    await expect(page.getByRole("status").filter({ hasText: "Stored: invented-weather.csv (hourly CSV, 2025)" })).toBeVisible();
    await expect(page.getByTestId("weather-source")).toContainText("invented-weather.csv (hourly CSV, 2025)");
    await expect(page.getByTestId("weather-source")).toContainText("uploaded hourly file");
    await expect(page.getByTestId("annual-kwh")).toContainText(/MWh\(e\)/, { timeout: 60_000 });
    await expect(page.getByTestId("seasonal-cop")).toContainText(/\d+\.\d\d · \d+\.\d\d/);
    await expect(page.getByTestId("peak-kwe")).toContainText("kW(e)");
    await expect(page.getByTestId("kwh-per-m3")).toContainText("kWh(e)/m³·yr");
    await expect(page.getByTestId("split-table")).toContainText("Compressors");
    await expect(page.getByTestId("split-table")).toContainText("C-1");
    await expect(page.getByRole("img", { name: /Bars: the facility's kWh\(e\) each month/ })).toBeVisible();
    await page.getByRole("group", { name: "Monthly energy: chart or table" }).getByRole("button", { name: "Table" }).click();
    await expect(page.getByTestId("monthly-table")).toContainText("Dec");
    await shot(page, "energy-designer");
    expect(await axe(page)).toEqual([]);

    // a tariff out of range is named and nothing saved; a valid one prices the year (the demo
    // model carries a day/night tariff: switch it to a flat rate)
    await page.getByLabel("Kind", { exact: true }).selectOption("flat");
    await page.getByLabel("Price", { exact: true }).fill("250");
    await page.getByRole("button", { name: "Save tariff and operation" }).click();
    await expect(page.getByText("Price must be between 0 and 100 EUR/kWh").first()).toBeVisible();
    await page.getByLabel("Price", { exact: true }).fill("0.18");
    await page.getByLabel("Demand charge", { exact: true }).fill("9");
    await page.getByRole("button", { name: "Save tariff and operation" }).click();
    await expect(page.getByRole("status").filter({ hasText: /Saved as model version \d+/ })).toBeVisible();
    await expect(page.getByTestId("annual-cost")).toContainText(/€[1-9][\d,]*/, { timeout: 60_000 });
    await expect(page.getByText("Out of date")).toHaveCount(0, { timeout: 30_000 });
    await shot(page, "energy-designer-priced");

    // monthly means instead of a file: a value out of range is named beside its month, then the year is built
    await page.getByRole("button", { name: "Enter monthly means instead" }).click();
    const months = ["January", "February", "March", "April", "May", "June", "July", "August", "September", "October", "November", "December"];
    const means = [2, 3, 6, 9, 13, 16, 19, 18, 15, 11, 6, 3];
    for (const [i, m] of months.entries()) {
      await page.getByLabel(`${m} mean dry bulb`).fill(String(means[i]));
      await page.getByLabel(`${m} mean daily range`).fill("8");
      await page.getByLabel(`${m} mean relative humidity`).fill(i === 2 ? "120" : "78");
    }
    await page.getByLabel("Name of the climate").fill("Invented test climate");
    await page.getByRole("button", { name: "Build the year from these means" }).click();
    await expect(page.getByText("March mean relative humidity must be between 1 and 100 %")).toBeVisible();
    await shot(page, "energy-monthly-error");
    await page.getByLabel("March mean relative humidity").fill("80");
    await page.getByRole("button", { name: "Build the year from these means" }).click();
    await expect(page.getByTestId("weather-source")).toContainText("Invented test climate — sine-day year 2025 from monthly means (an approximation)");
    await expect(page.getByText("Out of date")).toHaveCount(0, { timeout: 60_000 });
    await expect(page.getByTestId("annual-kwh")).toContainText(/MWh\(e\)/);
  });
});

test.describe("owner", () => {
  test.use({ storageState: stateOf("owner") });

  test("sets the workspace currency, and the running cost is shown in it", async ({ page }) => {
    await page.goto(`/w/${WS}/settings`);
    await page.getByLabel("Currency of running costs (ISO 4217)").selectOption("CHF");
    await page.getByRole("button", { name: "Save" }).click();
    await expect(page.getByRole("status").filter({ hasText: "Currency: CHF" })).toBeVisible();
    await page.goto(`/w/${WS}/f/${facilityId}/energy`);
    await expect(page.getByTestId("annual-cost")).toContainText("CHF");
    await expect(page.getByLabel("Price", { exact: true })).toBeVisible();
    await expect(page.getByText("Electricity tariff (CHF)")).toBeVisible();
    // back to the demo's currency for the other specs
    await page.goto(`/w/${WS}/settings`);
    await page.getByLabel("Currency of running costs (ISO 4217)").selectOption("EUR");
    await page.getByRole("button", { name: "Save" }).click();
    await expect(page.getByRole("status").filter({ hasText: "Currency: EUR" })).toBeVisible();
  });
});

test.describe("viewer", () => {
  test.use({ storageState: stateOf("viewer") });

  test("reads the year and cannot edit the weather, the tariff or run it", async ({ page }) => {
    await page.goto(`/w/${WS}/f/${facilityId}/energy`);
    await expect(page.getByTestId("annual-kwh")).toContainText(/MWh\(e\)/, { timeout: 30_000 });
    await expect(page.getByTestId("weather-source")).toContainText("from monthly means (an approximation)");
    await expect(page.getByRole("button", { name: "Run the year" })).toHaveCount(0);
    await expect(page.getByLabel("Weather file (.csv or .epw)")).toHaveCount(0);
    await expect(page.getByRole("button", { name: "Save tariff and operation" })).toHaveCount(0);
    await expect(page.getByText("Read only: owners and designers change the tariff and the schedules.")).toBeVisible();
    await expect(page.getByLabel("Price", { exact: true })).toBeDisabled();
    const r = await page.request.post(`/api/v1/workspaces/${WS}/facilities/${facilityId}/energy`);
    expect(r.status()).toBe(403);
    await shot(page, "energy-viewer");
    expect(await axe(page)).toEqual([]);
    await page.goto(`/w/${WS}/settings`);
    await expect(page.getByLabel("Currency of running costs (ISO 4217)")).toBeDisabled();
    await expect(page.getByText("Only an owner changes the workspace's settings.")).toBeVisible();
  });
});
