import { test, expect, type Page } from "@playwright/test";
import { emailOf, PASSWORD, stateOf, WS } from "./roles";
import { waitForMailLink } from "./mail";

const shot = (page: Page, name: string) => page.screenshot({ path: `.run/test/screenshots/${name}.png`, fullPage: true });

test.describe("designer", () => {
  test.use({ storageState: stateOf("designer") });

  test("creates a facility through the form; bad input is named and stores nothing", async ({ page }) => {
    await page.goto(`/w/${WS}`);
    await expect(page.getByRole("link", { name: /Harrowfield Cold Store — main building/ })).toBeVisible();
    await page.getByRole("button", { name: "New facility" }).click();
    const name = `Riverside annex ${Date.now()}`;
    await page.getByLabel("Facility name").fill(name);
    await page.getByLabel("Design dry bulb").fill("75");
    await page.getByLabel("Coincident wet bulb").fill("22");
    await page.getByLabel("Ground temperature").fill("12");
    await page.getByLabel("Elevation").fill("40");
    await page.getByRole("button", { name: "Create facility" }).click();
    await expect(page.getByText("Design dry bulb must be between -50 and 55 °C")).toBeVisible();
    await shot(page, "designer-field-error");
    // nothing was stored
    const before = await (await page.request.get(`/api/v1/workspaces/${WS}/facilities`)).json();
    expect(before.facilities.some((f: { name: string }) => f.name === name)).toBe(false);
    await page.getByLabel("Design dry bulb").fill("31");
    await page.getByRole("button", { name: "Create facility" }).click();
    await expect(page.getByRole("link", { name })).toBeVisible();
    await shot(page, "designer-facilities");
    await page.getByRole("link", { name }).click();
    await expect(page.getByRole("heading", { name })).toBeVisible();
    await page.getByRole("link", { name: "Site & settings" }).click();
    await expect(page.getByLabel("Design dry bulb")).toHaveValue("31");
    await shot(page, "designer-site-settings");
  });
});

test.describe("viewer", () => {
  test.use({ storageState: stateOf("viewer") });

  test("is refused where the role forbids, with a clear message", async ({ page }) => {
    await page.goto(`/w/${WS}`);
    await expect(page.getByRole("link", { name: /Harrowfield Cold Store — main building/ })).toBeVisible();
    await expect(page.getByRole("button", { name: "New facility" })).toHaveCount(0);
    const r = await page.request.post(`/api/v1/workspaces/${WS}/facilities`, {
      data: { name: "Sneaky", site: { designDryBulbC: 30, coincidentWetBulbC: 20, groundTempC: 10, elevationM: 0 } },
    });
    expect(r.status()).toBe(403);
    expect((await r.json()).error.message).toMatch(/Your role \(viewer\) may not create facilities/);
    await page.goto(`/w/${WS}/audit`);
    await expect(page.getByRole("alert").filter({ hasText: "Your role (viewer) may not read the audit log" })).toBeVisible();
    await shot(page, "viewer-forbidden");
  });
});

test("an owner's invitation arrives by e-mail and its link lets a new person join with the invited role", async ({ browser }) => {
  const owner = await browser.newContext({ storageState: stateOf("owner") });
  const page = await owner.newPage();
  await page.goto(`/w/${WS}/team`);
  const email = `new-purchaser-${Date.now()}@example.test`;
  await page.getByLabel("E-mail").fill(email);
  await page.getByRole("combobox", { name: "Role", exact: true }).selectOption("purchaser");
  await page.getByRole("button", { name: "Send invitation" }).click();
  await expect(page.getByText(`Invitation sent to ${email} as purchaser.`)).toBeVisible();
  await shot(page, "owner-team");
  const link = await waitForMailLink(email, "invited you");
  // the caught message is readable on the dev mail page too
  await page.goto("/dev/mail");
  await expect(page.getByTestId("mail").first()).toContainText(email);
  await owner.close();

  const fresh = await browser.newContext();
  const p = await fresh.newPage();
  await p.goto(link);
  await expect(p.getByRole("heading", { name: "Join Harrowfield Cold Store (demo)" })).toBeVisible();
  await p.getByLabel("Your name").fill("Nia Newcomer");
  await p.getByLabel("Choose a password").fill("short");
  await p.getByRole("button", { name: "Accept and join" }).click();
  await expect(p.getByText("Password must be at least 10 characters")).toBeVisible();
  await p.getByLabel("Choose a password").fill("a-long-enough-password");
  await p.getByRole("button", { name: "Accept and join" }).click();
  await expect(p.getByText("your role: purchaser")).toBeVisible();
  // the link is single-use
  await p.goto(link);
  await expect(p.getByRole("alert").filter({ hasText: "invalid, already used" })).toBeVisible();
  await fresh.close();
});

test("sign-in link by e-mail, single use", async ({ browser }) => {
  const c = await browser.newContext();
  const page = await c.newPage();
  await page.goto("/signin");
  await page.getByRole("button", { name: "E-mail me a sign-in link" }).click();
  await page.getByLabel("E-mail").fill(emailOf("operations"));
  await page.getByRole("button", { name: "Send link" }).click();
  await expect(page.getByRole("status")).toContainText("sign-in link is on its way");
  const link = await waitForMailLink(emailOf("operations"), "sign-in link");
  await page.goto(link);
  await page.getByRole("button", { name: "Continue to Rimeplan" }).click();
  await expect(page.getByText("your role: operations")).toBeVisible();
  await c.close();
  const c2 = await browser.newContext();
  const p2 = await c2.newPage();
  await p2.goto(link);
  await p2.getByRole("button", { name: "Continue to Rimeplan" }).click();
  await expect(p2.getByRole("alert").filter({ hasText: "invalid, used or expired" })).toBeVisible();
  await c2.close();
});

test("password reset by e-mail signs the person out everywhere", async ({ browser }) => {
  // a dedicated account so the demo users keep their password
  const owner = await browser.newContext({ storageState: stateOf("owner") });
  const email = `reset-${Date.now()}@example.test`;
  const op = await owner.newPage();
  expect((await op.request.post(`/api/v1/workspaces/${WS}/invites`, { data: { email, role: "viewer" } })).status()).toBe(201);
  const invite = new URL(await waitForMailLink(email, "invited you")).searchParams.get("token");
  expect((await op.request.post("/api/v1/invites/accept", { data: { token: invite, name: "Reset Tester", password: "first-password-1" } })).status()).toBe(200);
  await owner.close();

  const signedIn = await browser.newContext();
  const s = await signedIn.newPage();
  await s.goto("/signin");
  await s.getByLabel("E-mail").fill(email);
  await s.getByLabel("Password").fill("first-password-1");
  await s.getByRole("button", { name: "Sign in" }).click();
  await expect(s.getByText("your role: viewer")).toBeVisible();

  const c = await browser.newContext();
  const page = await c.newPage();
  await page.goto("/signin");
  await page.getByRole("button", { name: "Forgot password?" }).click();
  await page.getByLabel("E-mail").fill(email);
  await page.getByRole("button", { name: "Send reset link" }).click();
  const link = await waitForMailLink(email, "Reset your");
  await page.goto(link);
  await page.getByLabel("New password").fill("second-password-2");
  await page.getByRole("button", { name: "Set password" }).click();
  await expect(page.getByRole("status")).toContainText("Password changed");
  // the other browser's session ended
  expect((await s.request.get("/api/v1/me")).status()).toBe(401);
  await page.goto("/signin");
  await page.getByLabel("E-mail").fill(email);
  await page.getByLabel("Password").fill("second-password-2");
  await page.getByRole("button", { name: "Sign in" }).click();
  await expect(page.getByText("your role: viewer")).toBeVisible();
  await c.close();
  await signedIn.close();
});

test("repeated failed sign-ins from one client are slowed down with the wait stated, not locked out", async ({ page }) => {
  const email = `nobody-${Date.now()}@example.test`;
  await page.goto("/signin");
  for (let i = 0; i < 5; i++) {
    await page.getByLabel("E-mail").fill(email);
    await page.getByLabel("Password").fill(`wrong-${i}`);
    await page.getByRole("button", { name: "Sign in" }).click();
    await expect(page.getByRole("alert").filter({ hasText: "E-mail or password is wrong" })).toBeVisible();
  }
  await page.getByRole("button", { name: "Sign in" }).click();
  // SIGNIN_WAIT_SECONDS (30 by default) after the latest failure
  await expect(page.getByRole("alert").filter({ hasText: "Too many" })).toHaveText(/^⚠ Too many failed sign-ins from here for this address\. Try again in (2\d|30) seconds, or ask for a sign-in link\./);
  await shot(page, "signin-rate-limited");
});

test("session cookie is http-only", async ({ browser }) => {
  const c = await browser.newContext();
  const page = await c.newPage();
  await page.goto("/signin");
  await page.getByLabel("E-mail").fill(emailOf("purchaser"));
  await page.getByLabel("Password").fill(PASSWORD);
  await page.getByRole("button", { name: "Sign in" }).click();
  await expect(page.getByText("your role: purchaser")).toBeVisible();
  const cookies = await c.cookies();
  const session = cookies.find((k) => k.name.includes("session-token"));
  expect(session?.httpOnly).toBe(true);
  expect(await page.evaluate(() => document.cookie)).not.toContain("session-token");
  await shot(page, "purchaser-facilities");
  await c.close();
});

test("units and theme are a per-user preference: IP shows °F and ft, dark theme applies", async ({ browser }) => {
  // a dedicated person so the other tests keep SI
  const owner = await browser.newContext({ storageState: stateOf("owner") });
  const op = await owner.newPage();
  const email = `ip-user-${Date.now()}@example.test`;
  expect((await op.request.post(`/api/v1/workspaces/${WS}/invites`, { data: { email, role: "designer" } })).status()).toBe(201);
  const token = new URL(await waitForMailLink(email, "invited you")).searchParams.get("token");
  expect((await op.request.post("/api/v1/invites/accept", { data: { token, name: "Imperial Ivy", password: "imperial-units-1" } })).status()).toBe(200);
  await owner.close();

  const c = await browser.newContext();
  const page = await c.newPage();
  await page.goto("/signin");
  await page.getByLabel("E-mail").fill(email);
  await page.getByLabel("Password").fill("imperial-units-1");
  await page.getByRole("button", { name: "Sign in" }).click();
  await expect(page.getByText("your role: designer")).toBeVisible();
  await page.goto("/account");
  await page.getByLabel(/IP — °F/).check();
  await page.getByLabel("dark").check();
  await page.getByRole("button", { name: "Save" }).click();
  // the page reloads with the new preference: the header's unit badge says IP
  await expect(page.getByRole("button", { name: /Imperial Ivy/ })).toContainText("IP");
  await page.goto(`/w/${WS}`);
  const row = page.getByRole("row", { name: /Harrowfield Cold Store — main building/ });
  // 32 °C = 89.6 °F, 150 m = 492.13 ft (NIST SP 811: °F = 1.8·°C + 32; 1 ft = 0.3048 m)
  await expect(row).toContainText("89.6 °F");
  await expect(row).toContainText("492.13 ft");
  await expect(page.locator("html")).toHaveClass(/dark/);
  await shot(page, "ip-dark-facilities");
  // the form states the allowed range in the user's units: −50…55 °C = −58…131 °F
  await page.getByRole("button", { name: "New facility" }).click();
  await page.getByLabel("Facility name").fill("Imperial check");
  await page.getByLabel("Design dry bulb").fill("140");
  await page.getByLabel("Coincident wet bulb").fill("70");
  await page.getByLabel("Ground temperature").fill("50");
  await page.getByLabel("Elevation").fill("300");
  await page.getByRole("button", { name: "Create facility" }).click();
  await expect(page.getByText("Design dry bulb must be between -58 and 131 °F")).toBeVisible();
  await page.getByLabel("Design dry bulb").fill("95");
  await page.getByRole("button", { name: "Create facility" }).click();
  const created = page.getByRole("row", { name: /Imperial check/ });
  // 95 °F = 35 °C stored, shown back as 95.0 °F; 300 ft = 91.44 m shown back as 300.00 ft
  await expect(created).toContainText("95.0 °F");
  await expect(created).toContainText("300.00 ft");
  await c.close();
});
