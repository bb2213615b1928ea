/**
 * The database goes away under the running app and comes back: API routes answer 503 with a
 * clear message (not 500, no hang), the health route says 503, a page says what happened and
 * what to do; once PostgreSQL is back everything answers again without restarting the app.
 *
 * It stops the shared browser-test cluster through scripts/lib.sh (with the PGPORT and
 * RIMEPLAN_PG_DIR that scripts/test.sh exports) and always starts it again and waits for the
 * app to see it before ending, so later specs are unaffected.
 */
import { test, expect, type APIRequestContext } from "@playwright/test";
import { execFileSync } from "node:child_process";
import { emailOf, PASSWORD, stateOf, WS } from "./roles";

test.use({ storageState: stateOf("designer") });

const cluster = (fn: "pg_stop" | "pg_start") =>
  execFileSync("bash", ["-c", `source scripts/lib.sh && ${fn}`], { env: process.env, stdio: "pipe", timeout: 90_000 });

async function timed(request: APIRequestContext, url: string) {
  const t0 = Date.now();
  const r = await request.get(url, { timeout: 15_000 });
  return { status: r.status(), body: await r.json(), ms: Date.now() - t0, retryAfter: r.headers()["retry-after"] };
}

async function waitForHealthy(request: APIRequestContext) {
  await expect.poll(async () => (await request.get("/api/v1/health")).status(), { timeout: 60_000, intervals: [250, 500, 1000] }).toBe(200);
}

test("PostgreSQL stopped and started again under the running app: 503 with a clear message, then recovery by itself", async ({ request, page, browser }) => {
  test.setTimeout(180_000);
  const facilities = `/api/v1/workspaces/${WS}/facilities`;
  const before = await timed(request, facilities);
  expect(before.status).toBe(200);
  if (!process.env.RIMEPLAN_PG_DIR || !process.env.PGPORT) throw new Error("run through `npm test` (it exports PGPORT and RIMEPLAN_PG_DIR)");

  cluster("pg_stop");
  try {
    for (const url of [facilities, "/api/v1/me"]) {
      const down = await timed(request, url);
      expect(down.status, url).toBe(503);
      expect(down.body.error.code).toBe("unavailable");
      expect(down.body.error.message).toMatch(/database is not reachable right now.*Try again in a minute/);
      expect(down.retryAfter).toBe("5");
      expect(down.ms, `${url} answered in ${down.ms} ms`).toBeLessThan(10_000);
    }
    const health = await timed(request, "/api/v1/health");
    expect(health.status).toBe(503);
    expect(health.body).toMatchObject({ status: "degraded", database: "unreachable", error: { code: "unavailable" } });

    // A page says what happened and what to do.
    await page.goto(`/w/${WS}`);
    await expect(page.getByRole("heading", { name: "The database is not reachable right now" })).toBeVisible();
    await expect(page.getByText(/Nothing you saved is lost/)).toBeVisible();
    await expect(page.getByRole("button", { name: "Try again" })).toBeVisible();

    // Signing in says the database is away, not "wrong password".
    const fresh = await browser.newContext({ storageState: { cookies: [], origins: [] } });
    const signin = await fresh.newPage();
    await signin.goto("/signin");
    await signin.getByLabel("E-mail").fill(emailOf("designer"));
    await signin.getByLabel("Password").fill(PASSWORD);
    await signin.getByRole("button", { name: "Sign in" }).click();
    await expect(signin.getByText(/database is not reachable right now, so nobody can sign in/)).toBeVisible();
    await fresh.close();
  } finally {
    cluster("pg_start");
    await waitForHealthy(request);
  }

  // Back without restarting the app: the same routes and the page answer again.
  const after = await timed(request, facilities);
  expect(after.status).toBe(200);
  expect(after.body).toEqual(before.body);
  expect((await timed(request, "/api/v1/me")).status).toBe(200);
  await page.getByRole("button", { name: "Try again" }).click();
  await expect(page.getByRole("heading", { name: "The database is not reachable right now" })).toBeHidden();
  await expect(page.getByRole("link", { name: "Rimeplan home" })).toBeVisible();
});
