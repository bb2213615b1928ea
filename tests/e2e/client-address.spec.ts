import { test, expect, request as pwRequest } from "@playwright/test";
import { spawn, type ChildProcess } from "node:child_process";
import http from "node:http";
import net from "node:net";
import os from "node:os";
import { emailOf, PASSWORD } from "./roles";

/**
 * A second instance of the app's server (scripts/serve.ts, the same build) listening on every
 * interface, so requests can come from another address than loopback: this machine's own
 * non-loopback address stands in for another machine on the network.
 */
let PORT = 0;
let server: ChildProcess | undefined;

/** A port free on every interface right now (other test runs on this machine use fixed ports near ours). */
function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const s = net.createServer();
    s.once("error", reject);
    s.listen(0, "0.0.0.0", () => {
      const p = (s.address() as net.AddressInfo).port;
      s.close(() => resolve(p));
    });
  });
}

function outsideAddress(): string {
  for (const list of Object.values(os.networkInterfaces()))
    for (const a of list ?? []) if (a.family === "IPv4" && !a.internal) return a.address;
  throw new Error("this test needs a non-loopback IPv4 address on this machine");
}
const OUTSIDE = outsideAddress();

interface Answer {
  status: number;
  body: string;
  headers: http.IncomingHttpHeaders;
}

function send(method: string, host: string, path: string, headers: Record<string, string> = {}, json?: unknown): Promise<Answer> {
  return new Promise((resolve, reject) => {
    const data = json === undefined ? undefined : JSON.stringify(json);
    const h = { host: `localhost:${PORT}`, ...(data ? { "content-type": "application/json" } : {}), ...headers };
    const req = http.request({ method, host, port: PORT, path, headers: h }, (res) => {
      let body = "";
      res.setEncoding("utf8");
      res.on("data", (c) => (body += c));
      res.on("end", () => resolve({ status: res.statusCode ?? 0, body, headers: res.headers }));
    });
    req.on("error", reject);
    req.end(data);
  });
}
const get = (host: string, path: string, headers: Record<string, string> = {}) => send("GET", host, path, headers);

test.describe.configure({ mode: "serial" });

test.beforeAll(async () => {
  test.setTimeout(120_000);
  PORT = await freePort();
  let exited: number | null = null;
  server = spawn("node_modules/.bin/tsx", ["scripts/serve.ts"], {
    env: { ...process.env, PORT: String(PORT), HOST: "0.0.0.0", TRUST_PROXY: "0", APP_URL: `http://localhost:${PORT}` },
    stdio: ["ignore", "ignore", "inherit"],
  });
  server.on("exit", (code) => (exited = code ?? -1));
  const until = Date.now() + 100_000;
  for (;;) {
    if (exited !== null) throw new Error(`second server on port ${PORT} exited with ${exited}`);
    const ok = await get("127.0.0.1", "/api/v1/health").then((r) => r.status === 200, () => false);
    if (ok) break;
    if (Date.now() > until) throw new Error(`second server on port ${PORT} did not start`);
    await new Promise((r) => setTimeout(r, 500));
  }
});

test.afterAll(() => {
  server?.kill("SIGTERM");
});

test("the caught-mail page is shown on loopback and is a plain 404 to another machine, whatever it forges", async () => {
  const local = await get("127.0.0.1", "/dev/mail");
  expect(local.status).toBe(200);
  expect(local.body).toContain("Caught e-mail");
  expect(local.body).toContain("Messages sent by this app");
  // without a proxy configured, a forwarded header is dropped: it is the socket that counts
  expect((await get("127.0.0.1", "/dev/mail", { "x-forwarded-for": "203.0.113.9" })).status).toBe(200);

  const plain = await get(OUTSIDE, "/dev/mail");
  expect(plain.status).toBe(404);
  expect(plain.body).not.toContain("Caught e-mail");
  expect(plain.body).not.toContain("Messages sent by this app");
  const forged = await get(OUTSIDE, "/dev/mail", {
    "x-forwarded-for": "127.0.0.1",
    "x-real-ip": "127.0.0.1",
    forwarded: "for=127.0.0.1",
    "x-rimeplan-peer": "127.0.0.1",
    "x-rimeplan-client": "127.0.0.1",
  });
  expect(forged.status).toBe(404);
  expect(forged.body).not.toContain("Messages sent by this app");
  // from loopback but for another site's name (DNS rebinding)
  expect((await get("127.0.0.1", "/dev/mail", { host: `rebound.example:${PORT}` })).status).toBe(404);
});

test("a stranger's failed sign-ins from another machine do not stop the real person signing in from theirs", async ({ browser }) => {
  const email = emailOf("viewer");
  // The stranger signs in through the same form post the sign-in page makes, from this
  // machine's network address (an API context: it sends no Origin, as a script would).
  const stranger = await pwRequest.newContext({ baseURL: `http://${OUTSIDE}:${PORT}` });
  const attempt = async (password: string) => {
    const csrfToken = (await (await stranger.get("/api/auth/csrf")).json()).csrfToken;
    const r = await stranger.post("/api/auth/callback/password", { form: { csrfToken, email, password }, maxRedirects: 0 });
    return new URL(r.headers()["location"] ?? "http://x/", `http://${OUTSIDE}:${PORT}`).searchParams.get("code");
  };
  for (let i = 0; i < 5; i++) expect(await attempt(`guess-${i}`)).toBe("bad_credentials");
  // even the right password waits on the stranger's machine, and the wait is stated
  expect(await attempt(PASSWORD)).toMatch(/^rate_limited_\d+$/);
  await stranger.dispose();

  const real = await browser.newContext({ baseURL: `http://localhost:${PORT}` });
  const p = await real.newPage();
  await p.goto("/signin");
  await p.getByLabel("E-mail").fill(email);
  await p.getByLabel("Password").fill(PASSWORD);
  await p.getByRole("button", { name: "Sign in" }).click();
  await expect(p.getByText("your role: viewer")).toBeVisible();
  await real.close();
});

test("sign-in link and reset requests are throttled per address, the same whether or not it has an account, saying when", async () => {
  const answers: Record<string, Answer[]> = {};
  for (const email of [emailOf("purchaser"), `nobody-${Date.now()}@example.test`]) {
    answers[email] = [];
    // both kinds count together
    for (const path of ["/api/v1/auth/link", "/api/v1/auth/reset-request", "/api/v1/auth/link", "/api/v1/auth/reset-request"])
      answers[email].push(await send("POST", OUTSIDE, path, {}, { email }));
  }
  const [real, none] = Object.values(answers);
  expect(real.slice(0, 3).map((a) => a.status)).toEqual([200, 200, 200]);
  expect(none.map((a) => a.status)).toEqual(real.map((a) => a.status));
  expect(none.slice(0, 3).map((a) => a.body)).toEqual(real.slice(0, 3).map((a) => a.body));
  expect(JSON.parse(none[3].body).error.message).toBe(JSON.parse(real[3].body).error.message);
  const refused = real[3];
  expect(refused.status).toBe(429);
  const body = JSON.parse(refused.body);
  expect(body.error.code).toBe("rate_limited");
  expect(body.error.message).toMatch(/^Too many link requests for this address\. Try again in 1[45] minutes\.$/);
  expect(Number(refused.headers["retry-after"])).toBeGreaterThan(800);
  expect(Number(refused.headers["retry-after"])).toBeLessThanOrEqual(900);
});
