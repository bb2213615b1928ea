import { readFileSync } from "node:fs";
import path from "node:path";
import { test, expect, type Page } from "@playwright/test";
import AxeBuilder from "@axe-core/playwright";
import { stateOf, WS } from "./roles";

/**
 * The plant inputs a designer enters that must compute (issue 10 §2), seen on the Circuits
 * page and entered in the Layout's inspector: a CO2 cascade into an ammonia high stage with
 * 5 K approach and superheat, a transcritical CO2 circuit, and a single ammonia stage whose
 * discharge is far past any compressor's limit.
 */
const SITE = { designDryBulbC: 32, coincidentWetBulbC: 23, groundTempC: 12, elevationM: 150 };
const shot = (page: Page, name: string) => page.screenshot({ path: `.run/test/screenshots/${name}.png`, fullPage: true });

function doc() {
  const { $comment, plant, ...rest } = JSON.parse(readFileSync(path.resolve("seeds/data/harrowfield-model.json"), "utf8"));
  void $comment;
  void plant;
  return {
    ...rest,
    plant: {
      evaporators: [
        { id: "ev-frozen", tag: "EV-1", roomId: "frozen-store", circuitId: "one", feed: { type: "dx", superheatK: 6 } },
        { id: "ev-blast", tag: "EV-2", roomId: "blast", circuitId: "lt", tdK: 7, feed: { type: "pumped", circulationRatio: 4 } },
        { id: "ev-apples", tag: "EV-3", roomId: "apples", circuitId: "co2", tdK: 5, feed: { type: "dx", superheatK: 6 } },
      ],
      circuits: [
        { id: "one", tag: "C-9", refrigerant: "R717", compressor: { type: "reciprocating" }, heatRejection: { to: "condenser", condenserId: "cd1" } },
        { id: "lt", tag: "C-1", refrigerant: "R744", compressor: { type: "reciprocating" }, heatRejection: { to: "circuit", circuitId: "hs", condensingC: -5, approachK: 5 } },
        { id: "hs", tag: "C-2", refrigerant: "R717", compressor: { type: "reciprocating" }, superheatK: 5, suctionLineAllowanceK: 0, heatRejection: { to: "condenser", condenserId: "cd1" } },
        { id: "co2", tag: "C-3", refrigerant: "R744", arrangement: "transcritical", compressor: { type: "reciprocating" }, heatRejection: { to: "condenser", condenserId: "gc" } },
      ],
      condensers: [
        { id: "cd1", tag: "CD-1", type: "evaporative" },
        { id: "gc", tag: "GC-1", type: "air-cooled" },
      ],
    },
  };
}

const card = (page: Page, tag: string) => page.locator("main article").filter({ has: page.getByRole("heading", { name: tag, exact: true }) });

test.describe("plant inputs that must compute", () => {
  test.use({ storageState: stateOf("designer") });

  test("the circuits show the cascade exchanger, the CO2 high side and switch-over, and a prominent discharge warning; the set point is entered in bar(a)", async ({ page }) => {
    const r = await page.request.post(`/api/v1/workspaces/${WS}/facilities`, { data: { name: `Plant inputs e2e ${Date.now()} (invented)`, site: SITE } });
    expect(r.status()).toBe(201);
    const id = (await r.json()).facility.id as string;
    const m = await (await page.request.get(`/api/v1/workspaces/${WS}/facilities/${id}/model`)).json();
    const put = await page.request.put(`/api/v1/workspaces/${WS}/facilities/${id}/model`, { data: { baseVersion: m.version, doc: doc() } });
    expect(put.status(), await put.text()).toBe(200);

    await page.goto(`/w/${WS}/f/${id}/circuits`);
    // High lift: computed, with the warning above everything else on its card.
    const one = card(page, "C-9");
    await expect(one.getByTestId("discharge-extreme")).toBeVisible({ timeout: 20_000 });
    await expect(one.getByTestId("discharge-extreme")).toContainText("far above what any compressor and its oil allow");
    await expect(one.getByTestId("discharge-extreme")).toContainText("two-stage compression with an intercooler");
    // Cascade: the exchanger's entropy generation on the high stage, the low stage's stream temperature.
    await expect(card(page, "C-2").getByText("of which cascade exchanger")).toBeVisible();
    await expect(card(page, "C-1").getByText("Rejects through its stream at")).toBeVisible();
    // Transcritical CO2 at 32 °C: optimised high side, and the switch-over shown (26 − 3 K approach).
    const co2 = card(page, "C-3");
    await expect(co2.getByText("transcritical (gas cooler)")).toBeVisible();
    await expect(co2.getByText("ambient ≤ 23.0 °C")).toBeVisible();
    await expect(co2.getByText("High side (optimised)")).toBeVisible();
    await shot(page, "circuits-plant-inputs");
    // The new rows and the warning box keep the page free of serious WCAG 2 A/AA findings (contrast included).
    const a = await new AxeBuilder({ page }).include("main").withTags(["wcag2a", "wcag2aa"]).analyze();
    expect(a.violations.filter((v) => v.impact === "serious" || v.impact === "critical").map((v) => `${v.id}: ${v.nodes.map((n) => n.target.join(" ")).slice(0, 3).join("; ")}`)).toEqual([]);

    // The set point in the inspector: bar(a), range named when out of it.
    await page.goto(`/w/${WS}/f/${id}/layout`);
    await page.locator('.react-flow__node[data-id="circuit:co2"]').click();
    const hp = page.getByLabel("High-side pressure (set point)");
    await expect(hp).toBeVisible({ timeout: 20_000 });
    await expect(page.getByText("bar(a)", { exact: true })).toBeVisible();
    await hp.fill("200");
    await expect(page.getByText(/High-side pressure \(set point\) must be "optimise" or a pressure .*50–140 bar\(a\)/)).toBeVisible();
    await hp.fill("95");
    await expect(page.locator("[data-save=saved]")).toBeVisible({ timeout: 20_000 });
    await shot(page, "inspector-high-side");
    await page.getByLabel("Condensing (subcritical) at gas-cooler outlet up to").scrollIntoViewIfNeeded();
    await page.getByRole("region", { name: "Inspector" }).screenshot({ path: ".run/test/screenshots/inspector-r744-fields.png" });
    await expect
      .poll(async () => (await (await page.request.get(`/api/v1/workspaces/${WS}/facilities/${id}/model`)).json()).doc.plant.circuits[3].highSidePa, { timeout: 20_000 })
      .toBe(9.5e6);

    await page.goto(`/w/${WS}/f/${id}/circuits`);
    await expect(card(page, "C-3").getByText("High side (set point)")).toBeVisible({ timeout: 20_000 });
    await expect(card(page, "C-3").getByRole("definition").filter({ hasText: "95.00 bar(a)" })).toBeVisible();
  });
});
