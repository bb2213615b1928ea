/**
 * The HTTP load test behind `npm run bench:api` (scripts/bench-api.sh starts the database and
 * the servers, then runs this). Against already running instances:
 *
 *   BENCH_URLS=http://localhost:3246,http://localhost:3256 tsx scripts/bench-api.ts
 *
 * Signs in as the demo designer, then drives three routes with autocannon, each for
 * BENCH_SECONDS (default 10) at 10 and at 50 connections, spread over every URL given:
 *   trivial    GET  /api/v1/health (one `select 1`, no sign-in)
 *   model read GET  /api/v1/workspaces/harrowfield/facilities/{demo}/model (signed in)
 *   calculate  POST /api/v1/calculate with the demo facility's engine input (signed in)
 * and the model read once more at a fixed BENCH_RATE (default 200) requests/s, evenly paced
 * (the target: p95 under 50 ms).
 * Prints requests/s and p50/p95/p99 latency (from every response's own time) and the ratio of
 * calculate to trivial. Any answer other than 200 is counted and printed as an error.
 */
import { readdirSync, readFileSync } from "node:fs";
import { Agent, request } from "node:http";
import autocannon from "autocannon";
import { toEngineInput, type ModelDoc } from "@/features/facilities/engine-model";
import type { SiteConditions } from "@/features/facilities/schema";

const urls = (process.env.BENCH_URLS ?? "http://localhost:3000").split(",").map((u) => u.trim().replace(/\/$/, "")).filter(Boolean);
const seconds = Number(process.env.BENCH_SECONDS ?? 10);
const connectionsList = (process.env.BENCH_CONNECTIONS ?? "10 50").split(/[ ,]+/).map(Number);
const fixedRate = Number(process.env.BENCH_RATE ?? 200);
const routes = new Set((process.env.BENCH_ROUTES ?? "trivial read calculate").split(/[ ,]+/));
const WS = "harrowfield";
const EMAIL = "designer@harrowfield.example";
const PASSWORD = process.env.BENCH_PASSWORD ?? "harrowfield-demo";

if (!Number.isFinite(seconds) || seconds < 1 || seconds > 600) throw new Error("BENCH_SECONDS must be 1 to 600");

/** Signs in through next-auth's credentials callback; returns the Cookie header value. */
async function signIn(base: string): Promise<string> {
  const jar = new Map<string, string>();
  const keep = (r: Response) => {
    for (const c of r.headers.getSetCookie()) {
      const [pair] = c.split(";");
      const i = pair.indexOf("=");
      jar.set(pair.slice(0, i), pair.slice(i + 1));
    }
  };
  const cookie = () => [...jar].map(([k, v]) => `${k}=${v}`).join("; ");
  const c = await fetch(`${base}/api/auth/csrf`);
  keep(c);
  const { csrfToken } = (await c.json()) as { csrfToken: string };
  const r = await fetch(`${base}/api/auth/callback/password`, {
    method: "POST",
    redirect: "manual",
    headers: { "content-type": "application/x-www-form-urlencoded", cookie: cookie() },
    body: new URLSearchParams({ csrfToken, email: EMAIL, password: PASSWORD }),
  });
  keep(r);
  const me = await fetch(`${base}/api/v1/me`, { headers: { cookie: cookie() } });
  if (me.status !== 200) throw new Error(`sign-in as ${EMAIL} failed: /api/v1/me answered ${me.status} (callback ${r.status} ${r.headers.get("location")})`);
  return cookie();
}

/**
 * CPU time (ms) used so far by the app servers (BENCH_SERVER_PIDS) and by the PostgreSQL
 * backends serving BENCH_DB (found by their process title), from /proc: a figure per request
 * that other work on a shared machine does not change, unlike requests/s.
 */
const serverPids = (process.env.BENCH_SERVER_PIDS ?? "").split(/[ ,]+/).filter(Boolean);
const benchDb = process.env.BENCH_DB ?? "";
function ticksOf(pid: string): number {
  try {
    const f = readFileSync(`/proc/${pid}/stat`, "utf8");
    const rest = f.slice(f.lastIndexOf(")") + 2).split(" ");
    return Number(rest[11]) + Number(rest[12]); // utime + stime, in 1/100 s
  } catch {
    return 0;
  }
}
function pgBackends(): string[] {
  if (!benchDb) return [];
  const out: string[] = [];
  for (const pid of readdirSync("/proc")) {
    if (!/^\d+$/.test(pid)) continue;
    try {
      const cmd = readFileSync(`/proc/${pid}/cmdline`, "utf8");
      if (cmd.startsWith("postgres: ") && cmd.includes(` ${benchDb} `)) out.push(pid);
    } catch {
      /* gone */
    }
  }
  return out;
}
/** CPU ms per process: app servers under "app:", database backends under "db:". */
function cpuNow(): Map<string, number> {
  const m = new Map<string, number>();
  for (const p of serverPids) m.set(`app:${p}`, ticksOf(p) * 10);
  for (const p of pgBackends()) m.set(`db:${p}`, ticksOf(p) * 10);
  return m;
}

/** CPU used between two readings; a backend that started in between counts from zero, one that ended is lost. */
function cpuUsed(before: Map<string, number>, after: Map<string, number>, kind: "app" | "db"): number {
  let n = 0;
  for (const [k, v] of after) if (k.startsWith(kind + ":")) n += v - (before.get(k) ?? 0);
  return n;
}

interface Figures {
  label: string;
  connections: number | string;
  rps: number;
  p50: number;
  p95: number;
  p99: number;
  errors: number;
  total: number;
  /** CPU ms per request in the app servers and in PostgreSQL, when their processes are known. */
  appMs?: number;
  dbMs?: number;
}

function pct(sorted: number[], p: number): number {
  if (sorted.length === 0) return Number.NaN;
  return sorted[Math.min(sorted.length - 1, Math.ceil((p / 100) * sorted.length) - 1)];
}

async function measured(run: () => Promise<Figures>): Promise<Figures> {
  const before = cpuNow();
  const f = await run();
  const after = cpuNow();
  if (serverPids.length && f.total) f.appMs = cpuUsed(before, after, "app") / f.total;
  if (benchDb && f.total) f.dbMs = cpuUsed(before, after, "db") / f.total;
  return f;
}

async function load(label: string, opts: { path: string; method?: "GET" | "POST"; body?: string; cookie?: string; connections: number; overallRate?: number }): Promise<Figures> {
  const times: number[] = [];
  let errors = 0;
  const headers: Record<string, string> = {};
  if (opts.cookie) headers.cookie = opts.cookie;
  if (opts.body) headers["content-type"] = "application/json";
  const instance = autocannon({
    url: urls.map((u) => u + opts.path),
    method: opts.method ?? "GET",
    body: opts.body,
    headers,
    connections: opts.connections,
    overallRate: opts.overallRate,
    duration: seconds,
    timeout: 30,
  });
  instance.on("response", (_client: unknown, status: number, _bytes: number, ms: number) => {
    if (status !== 200) errors++;
    times.push(ms);
  });
  const result = await instance;
  times.sort((a, b) => a - b);
  errors += result.errors + result.timeouts;
  return {
    label,
    connections: opts.overallRate ? `${opts.connections} @ ${opts.overallRate}/s` : opts.connections,
    rps: times.length / (result.duration || seconds),
    p50: pct(times, 50),
    p95: pct(times, 95),
    p99: pct(times, 99),
    errors,
    total: times.length,
  };
}

/**
 * Open-loop load at a fixed rate: requests leave evenly spaced (every 1000/rate ms, round-robin
 * over the URLs) whether or not earlier ones have answered, and each latency counts from when
 * its request was due, so a server that falls behind shows it. (autocannon's own rate limit
 * sends each second's requests in one burst, which measures the burst, not the rate.)
 */
async function paced(label: string, opts: { path: string; cookie: string; rate: number }): Promise<Figures> {
  const agent = new Agent({ keepAlive: true, maxSockets: 256 });
  const times: number[] = [];
  let errors = 0;
  const total = Math.round(opts.rate * seconds);
  const gap = 1000 / opts.rate;
  const start = performance.now();
  await new Promise<void>((resolve) => {
    let sent = 0;
    let done = 0;
    const one = (i: number) => {
      const due = start + i * gap;
      const u = new URL(urls[i % urls.length] + opts.path);
      const req = request(u, { agent, method: "GET", headers: { cookie: opts.cookie } }, (res) => {
        res.resume();
        res.on("end", () => {
          if (res.statusCode !== 200) errors++;
          times.push(performance.now() - due);
          if (++done === total) resolve();
        });
      });
      req.on("error", () => {
        errors++;
        if (++done === total) resolve();
      });
      req.end();
    };
    const tick = () => {
      const due = Math.min(total, Math.floor((performance.now() - start) / gap) + 1);
      while (sent < due) one(sent++);
      if (sent < total) setTimeout(tick, Math.max(0, Math.min(gap, start + sent * gap - performance.now())));
    };
    tick();
  });
  const elapsed = (performance.now() - start) / 1000;
  agent.destroy();
  times.sort((a, b) => a - b);
  return { label, connections: `paced ${opts.rate}/s`, rps: times.length / elapsed, p50: pct(times, 50), p95: pct(times, 95), p99: pct(times, 99), errors, total: times.length };
}

const row = (f: Figures) =>
  `${f.label.padEnd(11)} ${String(f.connections).padStart(12)} ${f.rps.toFixed(1).padStart(9)} ${f.p50.toFixed(1).padStart(8)} ${f.p95.toFixed(1).padStart(8)} ${f.p99.toFixed(1).padStart(8)} ${String(f.errors).padStart(7)}` +
  `${f.appMs !== undefined ? f.appMs.toFixed(2).padStart(9) : ""}${f.dbMs !== undefined ? f.dbMs.toFixed(2).padStart(8) : ""}`;

const cookie = await signIn(urls[0]);
for (const u of urls.slice(1)) {
  const me = await fetch(`${u}/api/v1/me`, { headers: { cookie } });
  if (me.status !== 200) throw new Error(`the session made on ${urls[0]} is refused by ${u} (${me.status})`);
}
const list = (await (await fetch(`${urls[0]}/api/v1/workspaces/${WS}/facilities`, { headers: { cookie } })).json()) as { facilities: { id: string; name: string }[] };
const demo = list.facilities.find((f) => f.name.startsWith("Harrowfield")) ?? list.facilities[0];
if (!demo) throw new Error("no facility in the demo workspace: run the seed first");
const modelPath = `/api/v1/workspaces/${WS}/facilities/${demo.id}/model`;
const m = (await (await fetch(urls[0] + modelPath, { headers: { cookie } })).json()) as { doc: ModelDoc; site: SiteConditions };
const calcBody = JSON.stringify(toEngineInput(m.doc, m.site));
const check = await fetch(`${urls[0]}/api/v1/calculate`, { method: "POST", headers: { cookie, "content-type": "application/json" }, body: calcBody });
if (check.status !== 200) throw new Error(`calculate of the demo facility answered ${check.status}: ${(await check.text()).slice(0, 300)}`);

console.log(`API load test — ${urls.length} instance(s): ${urls.join(", ")}; ${seconds} s per case; Node ${process.version}`);
console.log(`demo facility "${demo.name}": model document ${JSON.stringify(m.doc).length} bytes, calculate body ${calcBody.length} bytes`);
console.log(`${"route".padEnd(11)} ${"connections".padStart(12)} ${"req/s".padStart(9)} ${"p50 ms".padStart(8)} ${"p95 ms".padStart(8)} ${"p99 ms".padStart(8)} ${"non-200".padStart(7)}${serverPids.length ? "  app CPU" : ""}${benchDb ? "  db CPU" : ""}`);
if (serverPids.length || benchDb) console.log("(app CPU and db CPU: milliseconds of processor time per request in the app servers and in PostgreSQL)");

// A short warm-up so the first case does not pay for Next's lazy route compilation.
await load("warm-up", { path: modelPath, cookie, connections: 4 }).catch(() => undefined);

const all: Figures[] = [];
for (const connections of connectionsList) {
  const trivial = routes.has("trivial") ? await measured(() => load("trivial", { path: "/api/v1/health", connections })) : null;
  const read = routes.has("read") ? await measured(() => load("model read", { path: modelPath, cookie, connections })) : null;
  const calc = routes.has("calculate") ? await measured(() => load("calculate", { path: "/api/v1/calculate", method: "POST", body: calcBody, cookie, connections })) : null;
  for (const f of [trivial, read, calc]) if (f) console.log(row(f));
  if (trivial && calc) console.log(`${"".padEnd(11)} calculate / trivial = ${(calc.rps / trivial.rps).toFixed(3)}`);
  all.push(...[trivial, read, calc].filter((f): f is Figures => f !== null));
}
if (fixedRate > 0 && routes.has("read")) {
  const fixed = await measured(() => paced("model read", { path: modelPath, cookie, rate: fixedRate }));
  console.log(row(fixed));
  console.log(`target: model read p95 < 50 ms at ${fixedRate} requests/s — ${fixed.p95 < 50 && fixed.rps >= fixedRate * 0.95 ? "met" : "NOT met"} (served ${fixed.rps.toFixed(1)}/s, p95 ${fixed.p95.toFixed(1)} ms)`);
  all.push(fixed);
}
const bestCalc = Math.max(...all.filter((f) => f.label === "calculate").map((f) => f.rps));
console.log(`target: calculate of the demo facility ≥ 100 requests/s — best ${bestCalc.toFixed(1)}/s on ${urls.length} instance(s)`);
if (process.env.BENCH_JSON) {
  const { writeFileSync } = await import("node:fs");
  writeFileSync(process.env.BENCH_JSON, JSON.stringify({ urls, seconds, figures: all }, null, 2));
}
const failed = all.reduce((n, f) => n + f.errors, 0);
if (failed > 0) {
  console.error(`${failed} answer(s) were not 200: the figures above are not valid`);
  process.exitCode = 1;
}
