import { test, expect, type Page } from "@playwright/test";
import { stateOf, WS } from "./roles";

/**
 * The Content-Security-Policy holds on every view and the app passes it with no violation: each
 * page records `securitypolicyviolation` events from the first script on, and the browser's
 * console CSP refusals are caught too.
 */
async function watch(page: Page) {
  const seen: string[] = [];
  page.on("console", (m) => {
    if (/Content Security Policy|Content-Security-Policy/i.test(m.text())) seen.push(`console: ${m.text()}`);
  });
  await page.addInitScript(() => {
    (window as unknown as { __csp: string[] }).__csp = [];
    document.addEventListener("securitypolicyviolation", (e) =>
      (window as unknown as { __csp: string[] }).__csp.push(`${e.violatedDirective} ${e.blockedURI}`),
    );
  });
  return async () => [...seen, ...(await page.evaluate(() => (window as unknown as { __csp?: string[] }).__csp ?? []))];
}

test("pages and API answers carry the security headers", async ({ request }) => {
  const page = await request.get("/signin");
  const csp = page.headers()["content-security-policy"];
  expect(csp).toMatch(/script-src 'self' 'nonce-[A-Za-z0-9+/=]+' 'strict-dynamic'/);
  expect(csp).toContain("frame-ancestors 'none'");
  expect(csp).toContain("object-src 'none'");
  expect(page.headers()["x-content-type-options"]).toBe("nosniff");
  expect(page.headers()["referrer-policy"]).toBe("same-origin");
  // served over plain http on loopback: no HSTS
  expect(page.headers()["strict-transport-security"]).toBeUndefined();
  // a fresh nonce per request
  const again = (await request.get("/signin")).headers()["content-security-policy"];
  expect(again).not.toBe(csp);
  const api = await request.get("/api/v1/health");
  expect(api.headers()["content-security-policy"]).toContain("default-src 'none'");
  expect(api.headers()["x-content-type-options"]).toBe("nosniff");
});

test("the sign-in page works under the policy with no violation", async ({ page }) => {
  const violations = await watch(page);
  await page.goto("/signin");
  await expect(page.getByLabel("E-mail")).toBeVisible();
  expect(await violations()).toEqual([]);
});

test.describe("every facility view passes the policy", () => {
  test.use({ storageState: stateOf("designer") });

  test("layout canvas (worker computing), outline, ledger, circuits, stocking, schedule, report, import, settings, revisions, team, account", async ({ page }) => {
    const violations = await watch(page);
    await page.goto(`/w/${WS}`);
    await page.getByRole("link", { name: /Harrowfield Cold Store — main building/ }).click();
    await page.getByRole("link", { name: "Layout" }).click();
    // the figure comes from the engine in the Web Worker: scripts and the worker both ran
    await expect(page.locator('.react-flow__node[data-id="room:frozen-store"] [data-figure="Required"]')).toHaveText(/kW/, { timeout: 20_000 });
    await page.getByRole("button", { name: "Outline" }).click();
    const facilityUrl = page.url().replace(/\/layout.*$/, "");
    for (const view of ["ledger", "circuits", "stocking", "schedule", "report", "import", "settings", "revisions"]) {
      await page.goto(`${facilityUrl}/${view}`);
      await expect(page.locator("main")).toBeVisible();
      await page.waitForLoadState("networkidle");
      expect(await violations(), view).toEqual([]);
    }
    for (const path of [`/w/${WS}/team`, `/account`]) {
      await page.goto(path);
      await page.waitForLoadState("networkidle");
      expect(await violations(), path).toEqual([]);
    }
  });
});

test.describe("the owner's views pass the policy", () => {
  test.use({ storageState: stateOf("owner") });
  test("audit log", async ({ page }) => {
    const violations = await watch(page);
    await page.goto(`/w/${WS}/audit`);
    await page.waitForLoadState("networkidle");
    await expect(page.locator("main")).toBeVisible();
    expect(await violations()).toEqual([]);
  });
});
