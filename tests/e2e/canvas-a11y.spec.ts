import { test, expect, type Page } from "@playwright/test";
import AxeBuilder from "@axe-core/playwright";
import { stateOf, WS } from "./roles";

/** Serious and critical WCAG 2 A/AA findings inside a view's own content (the shared frame is checked elsewhere). */
async function axe(page: Page, include: string) {
  const r = await new AxeBuilder({ page }).include(include).withTags(["wcag2a", "wcag2aa"]).analyze();
  return r.violations.filter((v) => v.impact === "serious" || v.impact === "critical").map((v) => `${v.id}: ${v.help} (${v.nodes.map((n) => n.target.join(" ")).slice(0, 3).join("; ")})`);
}

test.describe("accessibility of the facility views", () => {
  test.use({ storageState: stateOf("designer") });

  test("layout (canvas and outline), heat ledger, circuits and revisions have no serious axe findings", async ({ page }) => {
    await page.goto(`/w/${WS}`);
    await page.getByRole("link", { name: /Harrowfield Cold Store — main building/ }).click();
    await page.getByRole("link", { name: "Layout" }).click();
    await expect(page.locator('.react-flow__node[data-id="room:frozen-store"] [data-figure="Required"]')).toHaveText(/kW/, { timeout: 20_000 });
    expect(await axe(page, "#canvas-editor")).toEqual([]);
    await page.getByRole("button", { name: "Outline" }).click();
    expect(await axe(page, "#canvas-editor")).toEqual([]);
    // wait for each view itself, not a table the previous view still shows
    await page.getByRole("link", { name: "Heat ledger" }).click();
    await expect(page).toHaveURL(/\/ledger$/);
    await expect(page.getByRole("region", { name: "Totals" })).toBeVisible();
    expect(await axe(page, "main")).toEqual([]);
    await page.getByRole("link", { name: "Circuits" }).click();
    await expect(page).toHaveURL(/\/circuits$/);
    await expect(page.locator("main article").first()).toBeVisible();
    expect(await axe(page, "main")).toEqual([]);
    await page.getByRole("link", { name: "Revisions" }).click();
    await expect(page).toHaveURL(/\/revisions$/);
    await expect(page.locator("main").getByRole("table")).toBeVisible();
    expect(await axe(page, "main")).toEqual([]);
  });
});
