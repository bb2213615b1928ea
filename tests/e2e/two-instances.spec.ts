import { spawn, type ChildProcess } from "node:child_process";
import { test, expect, request as pwRequest, type APIRequestContext } from "@playwright/test";
import { PASSWORD, stateOf, WS } from "./roles";
import { facilityWithInstalledPlant } from "./stocking-fixture";

/**
 * Two app instances, one database: the webServer is instance A; this spec starts instance B
 * (scripts/serve.ts on TEST_PORT_2, default TEST_PORT + 10) with the same environment — the
 * same DATABASE_URL, AUTH_SECRET and APP_URL, as behind one load balancer — and checks that
 * nothing that matters lives in one process: sessions, the sign-in limit, the merge-or-409 of
 * concurrent saves, stocking checks.
 */
const portA = Number(process.env.TEST_PORT ?? 3210);
const portB = Number(process.env.TEST_PORT_2 ?? portA + 10);
const A = `http://localhost:${portA}`;
const B = `http://localhost:${portB}`;
const SITE = { designDryBulbC: 32, coincidentWetBulbC: 23, groundTempC: 12, elevationM: 150 };

let server: ChildProcess | null = null;
let serverLog = "";

test.beforeAll(async () => {
  test.setTimeout(150_000);
  server = spawn(process.execPath, ["--import", "tsx", "scripts/serve.ts"], {
    env: { ...process.env, PORT: String(portB) },
    stdio: ["ignore", "pipe", "pipe"],
  });
  server.stdout?.on("data", (d) => (serverLog = (serverLog + d).slice(-4000)));
  server.stderr?.on("data", (d) => (serverLog = (serverLog + d).slice(-4000)));
  const until = Date.now() + 120_000;
  for (;;) {
    if (server.exitCode !== null) throw new Error(`instance B exited (${server.exitCode}):\n${serverLog}`);
    const ok = await fetch(`${B}/api/v1/health`).then((r) => r.status === 200, () => false);
    if (ok) break;
    if (Date.now() > until) throw new Error(`instance B did not answer on ${B} within 120 s:\n${serverLog}`);
    await new Promise((r) => setTimeout(r, 500));
  }
});

test.afterAll(async () => {
  if (!server || server.exitCode !== null) return;
  const exited = new Promise((r) => server!.once("exit", r));
  server.kill("SIGTERM");
  await Promise.race([exited, new Promise((r) => setTimeout(r, 8_000))]);
  if (server.exitCode === null) server.kill("SIGKILL");
});

/** One password sign-in through next-auth's form post; returns where it sent the browser. */
async function signIn(c: APIRequestContext, base: string, email: string, password: string): Promise<string> {
  const csrf = (await (await c.get(`${base}/api/auth/csrf`)).json()).csrfToken as string;
  const r = await c.post(`${base}/api/auth/callback/password`, { form: { csrfToken: csrf, email, password }, maxRedirects: 0 });
  expect(r.status(), await r.text()).toBe(302);
  return r.headers()["location"] ?? "";
}

test("a session made on one instance works on the other, and signing out on the other ends it on both", async () => {
  // Cookies are per host, not per port, so one context carries the cookie to both instances.
  const c = await pwRequest.newContext();
  const to = await signIn(c, A, "designer@harrowfield.example", PASSWORD);
  expect(to).not.toContain("error");
  for (const base of [A, B]) {
    const me = await c.get(`${base}/api/v1/me`);
    expect(me.status(), base).toBe(200);
    expect((await me.json()).user.email).toBe("designer@harrowfield.example");
  }
  const csrf = (await (await c.get(`${B}/api/auth/csrf`)).json()).csrfToken as string;
  const cookieBefore = (await c.storageState()).cookies.map((x) => `${x.name}=${x.value}`).join("; ");
  expect((await c.post(`${B}/api/auth/signout`, { form: { csrfToken: csrf }, maxRedirects: 0 })).status()).toBe(302);
  // The old cookie, replayed on A, names a session row that B deleted: signed out there too.
  const replay = await pwRequest.newContext({ extraHTTPHeaders: { cookie: cookieBefore } });
  expect((await replay.get(`${A}/api/v1/me`)).status()).toBe(401);
  await replay.dispose();
  await c.dispose();
});

test("the sign-in limit counts failures from both instances as one", async () => {
  // SIGNIN_MAX_ATTEMPTS is 5 in the browser tests. Five failures for one address from one
  // client, alternating A, B, A, B, A, leave each instance with at most three: a limit kept in
  // one process's memory would still let the sixth through. The sixth, on B, must be refused
  // (or held back) as it would be on one instance.
  const email = `two-instances-${Date.now()}@harrowfield.example`;
  const c = await pwRequest.newContext();
  for (let i = 0; i < 5; i++) {
    const to = await signIn(c, i % 2 === 0 ? A : B, email, "wrong-password");
    expect(to).toContain("error");
  }
  const started = Date.now();
  const sixth = await signIn(c, B, email, "wrong-password");
  const heldMs = Date.now() - started;
  // Refused for the count (any code but a plain wrong password), or answered only after a wait.
  const refusedAsLimited = /[?&]code=/.test(sixth) && !/[?&]code=bad_credentials/.test(sixth);
  expect(refusedAsLimited || heldMs >= 1000, `sixth attempt went to ${sixth} after ${heldMs} ms`).toBe(true);
  await c.dispose();
});

test.describe("two designers on two instances", () => {
  test("edits to different rooms merge, edits to the same field get 409, whichever instance takes each", async () => {
    const owner = await pwRequest.newContext({ storageState: stateOf("owner") });
    const designer = await pwRequest.newContext({ storageState: stateOf("designer") });
    const base = `/api/v1/workspaces/${WS}/facilities`;
    const f = await owner.post(`${A}${base}`, { data: { name: `Two instances ${Date.now()}`, site: SITE } });
    expect(f.status(), await f.text()).toBe(201);
    const id = (await f.json()).facility.id as string;
    const room = (rid: string, name: string) => ({
      id: rid,
      name,
      kind: "storage",
      lengthM: 12,
      widthM: 10,
      heightM: 6,
      setPointC: 2,
      rhPct: 85,
      surfaces: [{ kind: "roof", otherSide: "outdoors", uValueWm2K: 0.2 }],
    });
    const start = await (await owner.get(`${A}${base}/${id}/model`)).json();
    const doc0 = { ...start.doc, rooms: [room("r1", "Room one"), room("r2", "Room two")] };
    const put0 = await owner.put(`${A}${base}/${id}/model`, { data: { baseVersion: start.version, doc: doc0 } });
    expect(put0.status(), await put0.text()).toBe(200);
    const v = (await put0.json()).version as number;

    // Both read version v (one from each instance), then each changes a different room.
    const seenA = await (await owner.get(`${A}${base}/${id}/model`)).json();
    const seenB = await (await designer.get(`${B}${base}/${id}/model`)).json();
    expect(seenB.version).toBe(v);
    expect(seenB.doc).toEqual(seenA.doc);
    const withRoom = (doc: typeof doc0, i: number, patch: object) => ({ ...doc, rooms: doc.rooms.map((r: object, j: number) => (j === i ? { ...r, ...patch } : r)) });
    const first = await owner.put(`${A}${base}/${id}/model`, { data: { baseVersion: v, doc: withRoom(seenA.doc, 0, { setPointC: -20 }) } });
    expect(first.status(), await first.text()).toBe(200);
    const second = await designer.put(`${B}${base}/${id}/model`, { data: { baseVersion: v, doc: withRoom(seenB.doc, 1, { name: "Room two, renamed on B" }) } });
    expect(second.status(), await second.text()).toBe(200);
    expect((await second.json()).rebased).toBe(true);
    const merged = await (await owner.get(`${A}${base}/${id}/model`)).json();
    expect(merged.version).toBe(v + 2);
    expect(merged.doc.rooms[0].setPointC).toBe(-20);
    expect(merged.doc.rooms[1].name).toBe("Room two, renamed on B");

    // Now both change the same field from the same version: the later one gets 409, on either instance.
    const w = merged.version as number;
    const mine = await designer.put(`${B}${base}/${id}/model`, { data: { baseVersion: w, doc: withRoom(merged.doc, 0, { setPointC: -25 }) } });
    expect(mine.status(), await mine.text()).toBe(200);
    const theirs = await owner.put(`${A}${base}/${id}/model`, { data: { baseVersion: w, doc: withRoom(merged.doc, 0, { setPointC: -18 }) } });
    expect(theirs.status()).toBe(409);
    const err = (await theirs.json()).error;
    expect(err.code).toBe("conflict");
    expect(JSON.stringify(err)).toContain("rooms[r1].setPointC");
    const after = await (await designer.get(`${B}${base}/${id}/model`)).json();
    expect(after.version).toBe(w + 1);
    expect(after.doc.rooms[0].setPointC).toBe(-25);
    await owner.dispose();
    await designer.dispose();
  });
});

test("a stocking check started on one instance is seen, with its result, on the other", async () => {
  const facilityId = await facilityWithInstalledPlant(A);
  const ops = await pwRequest.newContext({ storageState: stateOf("operations") });
  const name = `Seen on both ${Date.now()}`;
  const base = `/api/v1/workspaces/${WS}/facilities/${facilityId}/scenarios`;
  const r = await ops.post(`${A}${base}`, { data: { name, changes: { rooms: [{ roomId: "apples", tonnesPerDay: 10 }] } } });
  expect([201, 202], await r.text()).toContain(r.status());
  const made = await r.json();
  const sid = (made.scenario ?? made).id as string;
  expect(sid).toBeTruthy();
  // Listed on B, and its result readable on B (polled, in case the check runs as a job).
  const list = await (await ops.get(`${B}${base}`)).json();
  expect((list.scenarios as { id: string; name: string }[]).find((s) => s.id === sid)?.name).toBe(name);
  await expect
    .poll(async () => {
      const s = await (await ops.get(`${B}${base}/${sid}`)).json();
      return (s.scenario ?? s).result ? "computed" : "pending";
    }, { timeout: 30_000 })
    .toBe("computed");
  await ops.dispose();
});
