import { test, expect, request as pwRequest, type APIRequestContext } from "@playwright/test";
import { readdirSync, readFileSync } from "node:fs";
import path from "node:path";
import { emailOf, ROLES, stateOf, WS, type Role } from "./roles";
import { waitForMailLink } from "./mail";

/**
 * The authorization matrix over HTTP: every route handler in the tree (every route.ts under
 * app/, each exported HTTP method) has one row in COVERED, and the first test below fails when a handler
 * has no row (or a row names a handler that is gone), so a new route cannot slip in unchecked.
 *
 * The expectations are written out by hand from PRODUCT.md's role descriptions — deliberately
 * not derived from lib/authz.ts, which is what this checks:
 *   designer   models the facility, sets site conditions, reads the results, issues the design;
 *   operations runs stocking checks against the installed plant and shares them by e-mail;
 *   purchaser  reviews the equipment schedule and exports it;
 *   owner      everything, and alone invites people, sets roles and reads the audit log;
 *   viewer     reads everything, changes nothing.
 * Jobs (GET …/jobs/[id], its result) are seen by the roles that may do their work, so an export
 * job by owner, designer and purchaser only.
 *
 * A row is either `roles("…")` — five letters for owner, designer, operations, purchaser, viewer:
 * A = allowed (2xx), D = denied (403) — and 401 without signing in; or `open(statuses, why)` —
 * a public route that answers anyone, signed in or not, with one of the given statuses (never
 * 401 or 403).
 */
type Cell = "A" | "D";
type Who = Role | "anon";
type Send = (c: APIRequestContext, who: Who) => Promise<number>;
type Row = { kind: "roles"; expect: Record<Role, Cell> } | { kind: "open"; statuses: number[]; why: string };

function roles(cells: string): Row {
  const c = cells.split("");
  if (c.length !== 5 || c.some((x) => x !== "A" && x !== "D")) throw new Error(`a row needs five A/D letters: ${cells}`);
  return { kind: "roles", expect: Object.fromEntries(ROLES.map((r, i) => [r, c[i] as Cell])) as Record<Role, Cell> };
}
const open = (statuses: number[], why: string): Row => ({ kind: "open", statuses, why });

const W = "/api/v1/workspaces/[ws]";
const F = `${W}/facilities/[id]`;

//                                                                      owner designer operations purchaser viewer
const COVERED: Record<string, Row> = {
  "GET /api/auth/[...nextauth]": open([200], "next-auth's own pages: the session read answers anyone (null when signed out)"),
  "POST /api/auth/[...nextauth]": open([302], "next-auth's sign-in callback: without its CSRF token it redirects to the error page"),
  "POST /api/v1/auth/link": open([200, 429], "asks for a sign-in link by e-mail; throttled per address and client"),
  "POST /api/v1/auth/reset-request": open([200, 429], "asks for a password-reset link; throttled per address and client"),
  "POST /api/v1/auth/reset": open([400], "sets a password with a reset token; a bad token is refused as such"),
  "POST /api/v1/calculate": roles("AAAAA"),
  "GET /api/v1/fluids": open([200], "refrigerant data: public"),
  "GET /api/v1/fluids/[id]/chart": open([200], "refrigerant data: public"),
  "GET /api/v1/fluids/[id]/state": open([200], "refrigerant data: public"),
  "GET /api/v1/health": open([200], "for monitors and load balancers"),
  "GET /api/v1/openapi.json": open([200], "the API description: public"),
  "GET /api/v1/invites/[token]": open([400], "reads an invitation by its secret token; a bad token is refused as such"),
  "POST /api/v1/invites/accept": open([400], "accepts an invitation by its secret token; a bad token is refused as such"),
  "GET /api/v1/me": roles("AAAAA"),
  "PATCH /api/v1/me": roles("AAAAA"),
  "GET /api/v1/workspaces": roles("AAAAA"),
  [`GET ${W}/audit`]: roles("ADDDD"),
  [`GET ${W}/members`]: roles("AAAAA"),
  [`PATCH ${W}/members/[userId]`]: roles("ADDDD"),
  [`DELETE ${W}/members/[userId]`]: roles("ADDDD"),
  [`POST ${W}/invites`]: roles("ADDDD"),
  [`DELETE ${W}/invites/[inviteId]`]: roles("ADDDD"),
  [`GET ${W}/settings`]: roles("AAAAA"),
  [`PATCH ${W}/settings`]: roles("ADDDD"),
  [`GET ${W}/jobs/[id]`]: roles("AADAD"),
  [`GET ${W}/jobs/[id]/result`]: roles("AADAD"),
  [`GET ${W}/facilities`]: roles("AAAAA"),
  [`POST ${W}/facilities`]: roles("AADDD"),
  [`GET ${F}`]: roles("AAAAA"),
  [`PATCH ${F}`]: roles("AADDD"),
  [`POST ${F}/duplicate`]: roles("AADDD"),
  [`POST ${F}/archive`]: roles("AADDD"),
  [`GET ${F}/model`]: roles("AAAAA"),
  [`PUT ${F}/model`]: roles("AADDD"),
  [`GET ${F}/results`]: roles("AAAAA"),
  [`GET ${F}/revisions`]: roles("AAAAA"),
  [`POST ${F}/revisions/[n]/issue`]: roles("AADDD"),
  [`POST ${F}/revisions/[n]/restore`]: roles("AADDD"),
  [`GET ${F}/layout`]: roles("AAAAA"),
  [`PUT ${F}/layout`]: roles("AADDD"),
  [`GET ${F}/layout/background`]: roles("AAAAA"),
  [`PUT ${F}/layout/background`]: roles("AADDD"),
  [`DELETE ${F}/layout/background`]: roles("AADDD"),
  [`GET ${F}/installed`]: roles("AAAAA"),
  [`PUT ${F}/installed`]: roles("AADDD"),
  [`POST ${F}/import/rooms`]: roles("AADDD"),
  [`POST ${F}/import/stocking`]: roles("AAADD"),
  [`GET ${F}/scenarios`]: roles("AAAAA"),
  [`POST ${F}/scenarios`]: roles("AAADD"),
  [`GET ${F}/scenarios/[sid]`]: roles("AAAAA"),
  [`POST ${F}/scenarios/[sid]/accept`]: roles("AAADD"),
  [`POST ${F}/scenarios/[sid]/apply`]: roles("AADDD"),
  [`POST ${F}/scenarios/[sid]/email`]: roles("AAADD"),
  [`GET ${F}/schedule`]: roles("AAAAA"),
  [`POST ${F}/exports`]: roles("AADAD"),
  [`GET ${F}/options`]: roles("AAAAA"),
  [`POST ${F}/options`]: roles("AADDD"),
  [`PATCH ${F}/options`]: roles("AADDD"),
  [`PATCH ${F}/options/[oid]`]: roles("AADDD"),
  [`DELETE ${F}/options/[oid]`]: roles("AADDD"),
  [`POST ${F}/options/[oid]/design`]: roles("AADDD"),
  [`GET ${F}/weather`]: roles("AAAAA"),
  [`POST ${F}/weather`]: roles("AADDD"),
  [`PUT ${F}/weather`]: roles("AADDD"),
  [`GET ${F}/energy`]: roles("AAAAA"),
  [`POST ${F}/energy`]: roles("AADDD"),
};

/** Every exported HTTP method of every route.ts under app/, as "METHOD /path" (route groups dropped). */
function handlersInTree(): string[] {
  const app = path.resolve("app");
  const out: string[] = [];
  for (const rel of readdirSync(app, { recursive: true, encoding: "utf8" })) {
    if (path.basename(rel) !== "route.ts" && path.basename(rel) !== "route.tsx" && path.basename(rel) !== "route.js") continue;
    const src = readFileSync(path.join(app, rel), "utf8");
    const url = "/" + path.dirname(rel).split(path.sep).filter((s) => s !== "." && !/^\(.*\)$/.test(s)).join("/");
    const methods = new Set<string>();
    for (const m of src.matchAll(/export\s+(?:const|let|var|async\s+function|function)\s+(GET|POST|PUT|PATCH|DELETE|HEAD|OPTIONS)\b/g)) methods.add(m[1]);
    // export const { GET, POST } = handlers;  export { GET } from "…";  export { x as GET };
    for (const m of src.matchAll(/export\s+(?:const\s+)?\{([^}]*)\}/g))
      for (const name of m[1].split(",").map((x) => x.trim().split(/\s+as\s+|\s*:\s*/).pop()!.trim()))
        if (/^(GET|POST|PUT|PATCH|DELETE|HEAD|OPTIONS)$/.test(name)) methods.add(name);
    for (const m of methods) out.push(`${m} ${url}`);
  }
  return out.sort();
}

test("every route handler in the tree has a row in the role matrix, and every row a handler", () => {
  const found = handlersInTree();
  // the scan itself must see the tree: the public routes and the workspace routes are there
  expect(found).toContain("GET /api/v1/health");
  expect(found).toContain(`PUT ${F}/model`);
  expect(found).toContain("GET /api/auth/[...nextauth]");
  expect(found.length).toBeGreaterThanOrEqual(50);
  const covered = Object.keys(COVERED).sort();
  expect(found.filter((k) => !(k in COVERED)), "route handlers without a row in COVERED").toEqual([]);
  expect(covered.filter((k) => !found.includes(k)), "rows in COVERED for handlers that do not exist").toEqual([]);
  expect(covered.filter((k) => typeof SEND[k] !== "function"), "rows without a request that exercises them").toEqual([]);
});

const site = { designDryBulbC: 30, coincidentWetBulbC: 21, groundTempC: 10, elevationM: 100 };
const base = `/api/v1/workspaces/${WS}`;
const fixture = (p: string) => {
  const { $comment, ...rest } = JSON.parse(readFileSync(path.resolve(p), "utf8"));
  void $comment;
  return rest;
};
const PNG = Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0, 0, 13, 0x49, 0x48, 0x44, 0x52]);
const ROOMS_CSV = "Name,Length [m],Width [m],Height [m],Set point [°C],Construction\nMatrix chiller,20,10,8,4,PIR 120\n";
const STOCKING_CSV = "Room;Intake [t/day];Entering [°C]\napples;5;18\n";
const BAD_TOKEN = "not-a-real-token-".repeat(3);
/** A valid hourly year (hours without dates) and a valid monthly climate, both invented. */
const WEATHER_CSV = ["Hour,Dry bulb [°C],Relative humidity [%]", ...Array.from({ length: 8760 }, (_, i) => `${i + 1},${(10 + 8 * Math.sin((i / 24) * 2 * Math.PI)).toFixed(1)},70`)].join("\n");
const MONTHLY = { year: 2025, climate: { label: "Matrix climate (invented)", meanDryBulbC: Array(12).fill(10), dailyRangeK: Array(12).fill(8), meanRhPct: Array(12).fill(75) } };
let ctx: Record<Role, APIRequestContext>;
let anon: APIRequestContext;
/** The demo facility (read only here) and a facility of this spec's own that the changes go to. */
let facilityId: string;
let scratchId: string;
let scenarioId: string;
let viewerId: string;
const letters: Record<Who, string> = { owner: "MA", designer: "MB", operations: "MC", purchaser: "MD", viewer: "ME", anon: "MF" };

async function newMember(owner: APIRequestContext, tag: string): Promise<string> {
  const email = `tmp-${tag}-${Date.now()}@example.test`;
  expect((await owner.post(`${base}/invites`, { data: { email, role: "viewer" } })).status()).toBe(201);
  const link = await waitForMailLink(email, "invited you");
  const token = new URL(link).searchParams.get("token")!;
  const r = await anon.post("/api/v1/invites/accept", { data: { token, name: `Temp ${tag}`, password: "temporary-password-1" } });
  expect(r.status()).toBe(200);
  const members = await (await owner.get(`${base}/members`)).json();
  return members.members.find((m: { email: string }) => m.email === email).userId;
}

test.beforeAll(async ({ baseURL }) => {
  ctx = {} as Record<Role, APIRequestContext>;
  for (const r of ROLES) ctx[r] = await pwRequest.newContext({ baseURL, storageState: stateOf(r) });
  anon = await pwRequest.newContext({ baseURL });
  const list = await (await ctx.owner.get(`${base}/facilities`)).json();
  facilityId = list.facilities[0].id;
  const members = await (await ctx.owner.get(`${base}/members`)).json();
  viewerId = members.members.find((m: { email: string }) => m.email === emailOf("viewer")).userId;
  // The facility the allowed changes go to: the invented demo model with its installed plant.
  const made = await ctx.owner.post(`${base}/facilities`, { data: { name: `Role matrix ${Date.now()}`, site } });
  expect(made.status(), await made.text()).toBe(201);
  scratchId = (await made.json()).facility.id;
  const doc = { ...fixture("seeds/data/harrowfield-model.json") };
  doc.plant = { ...(doc.plant ?? {}), installed: fixture("lib/engine/stocking/fixtures/harrowfield-installed.json") };
  const saved = await ctx.owner.put(`${base}/facilities/${scratchId}/model`, { data: { baseVersion: 1, doc, summary: "role matrix" } });
  expect(saved.status(), await saved.text()).toBe(200);
  scenarioId = await newScenario();
  expect((await ctx.owner.put(`${base}/facilities/${scratchId}/layout/background`, { data: PNG, headers: { "content-type": "image/png" } })).status()).toBe(200);
});

test.afterAll(async () => {
  for (const r of ROLES) await ctx[r].dispose();
  await anon.dispose();
});

/** A stocking check on the scratch facility, made by the owner (accepted when asked). */
async function newScenario(accept = false): Promise<string> {
  const r = await ctx.owner.post(`${base}/facilities/${scratchId}/scenarios`, { data: { name: "Matrix check", changes: { rooms: [{ roomId: "apples", tonnesPerDay: 5 }] } } });
  expect(r.status(), await r.text()).toBe(201);
  const id = (await r.json()).id as string;
  if (accept) expect((await ctx.owner.post(`${base}/facilities/${scratchId}/scenarios/${id}/accept`)).status()).toBe(200);
  return id;
}

/** One CSV export made by the owner and finished by the worker, shared by the job rows. */
let exportJob: Promise<{ id: string }> | null = null;
function ownerExport(): Promise<{ id: string }> {
  exportJob ??= (async () => {
    const r = await ctx.owner.post(`${base}/facilities/${facilityId}/exports`, { data: { format: "csv" } });
    expect(r.status()).toBe(202);
    const { job } = await r.json();
    await expect.poll(async () => (await (await ctx.owner.get(job.url)).json()).job.status, { timeout: 30_000 }).toBe("done");
    return { id: job.id as string };
  })();
  return exportJob;
}

const f = (id = facilityId) => `${base}/facilities/${id}`;

/** A plant option of the scratch facility made by the owner (older ones pruned so the facility stays under its limit of 8). */
async function ownerOption(tag: string): Promise<string> {
  const list = await (await ctx.owner.get(`${s()}/options`)).json();
  const options = (list.comparison.options as { id: string; isDesign: boolean }[]).filter((o) => !o.isDesign);
  for (const o of options.slice(0, Math.max(0, options.length - 4))) expect((await ctx.owner.delete(`${s()}/options/${o.id}`)).status()).toBe(200);
  const r = await ctx.owner.post(`${s()}/options`, { data: { name: `Matrix ${tag} ${Date.now()}` } });
  expect(r.status(), await r.text()).toBe(201);
  return (await r.json()).option.id as string;
}
const s = () => f(scratchId);
const st = (r: { status(): number }) => r.status();

/** How each row is exercised: a request that succeeds for an allowed caller (valid body, state prepared). */
const SEND: Record<keyof typeof COVERED, Send> = {
  "GET /api/auth/[...nextauth]": async (c) => st(await c.get("/api/auth/session")),
  "POST /api/auth/[...nextauth]": async (c) =>
    st(await c.post("/api/auth/callback/password", { form: { email: `nobody-${Date.now()}@example.test`, password: "not-the-password" }, maxRedirects: 0 })),
  "POST /api/v1/auth/link": async (c, who) => st(await c.post("/api/v1/auth/link", { data: { email: `matrix-${who}-${Date.now()}@example.test` } })),
  "POST /api/v1/auth/reset-request": async (c, who) => st(await c.post("/api/v1/auth/reset-request", { data: { email: `matrix-${who}-${Date.now()}@example.test` } })),
  "POST /api/v1/auth/reset": async (c) => st(await c.post("/api/v1/auth/reset", { data: { token: BAD_TOKEN, password: "a-long-enough-password" } })),
  "POST /api/v1/calculate": async (c) => st(await c.post("/api/v1/calculate", { data: JSON.parse(readFileSync("seeds/data/harrowfield-facility.json", "utf8")) })),
  "GET /api/v1/fluids": async (c) => st(await c.get("/api/v1/fluids")),
  "GET /api/v1/fluids/[id]/chart": async (c) => st(await c.get("/api/v1/fluids/R717/chart")),
  "GET /api/v1/fluids/[id]/state": async (c) => st(await c.get("/api/v1/fluids/R717/state?by=PT&pPa=101325&tK=300")),
  "GET /api/v1/health": async (c) => st(await c.get("/api/v1/health")),
  "GET /api/v1/openapi.json": async (c) => st(await c.get("/api/v1/openapi.json")),
  "GET /api/v1/invites/[token]": async (c) => st(await c.get(`/api/v1/invites/${BAD_TOKEN}`)),
  "POST /api/v1/invites/accept": async (c) => st(await c.post("/api/v1/invites/accept", { data: { token: BAD_TOKEN, name: "Nobody", password: "a-long-enough-password" } })),
  "GET /api/v1/me": async (c) => st(await c.get("/api/v1/me")),
  "PATCH /api/v1/me": async (c) => {
    const me = await c.get("/api/v1/me");
    const unitSystem = me.ok() ? (await me.json()).user.unitSystem : "SI";
    return st(await c.patch("/api/v1/me", { data: { unitSystem } }));
  },
  "GET /api/v1/workspaces": async (c) => st(await c.get("/api/v1/workspaces")),
  [`GET ${W}/audit`]: async (c) => st(await c.get(`${base}/audit`)),
  [`GET ${W}/members`]: async (c) => st(await c.get(`${base}/members`)),
  [`PATCH ${W}/members/[userId]`]: async (c) => st(await c.patch(`${base}/members/${viewerId}`, { data: { role: "viewer" } })),
  [`DELETE ${W}/members/[userId]`]: async (c, who) => st(await c.delete(`${base}/members/${await newMember(ctx.owner, who)}`)),
  [`POST ${W}/invites`]: async (c, who) => st(await c.post(`${base}/invites`, { data: { email: `matrix-${who}-${Date.now()}@example.test`, role: "viewer" } })),
  [`DELETE ${W}/invites/[inviteId]`]: async (c, who) => {
    const made = await (await ctx.owner.post(`${base}/invites`, { data: { email: `revoke-${who}-${Date.now()}@example.test`, role: "viewer" } })).json();
    return st(await c.delete(`${base}/invites/${made.invite.id}`));
  },
  [`GET ${W}/settings`]: async (c) => st(await c.get(`${base}/settings`)),
  [`PATCH ${W}/settings`]: async (c) => st(await c.patch(`${base}/settings`, { data: { currency: "EUR" } })),
  [`GET ${W}/jobs/[id]`]: async (c) => st(await c.get(`${base}/jobs/${(await ownerExport()).id}`)),
  [`GET ${W}/jobs/[id]/result`]: async (c) => st(await c.get(`${base}/jobs/${(await ownerExport()).id}/result`)),
  [`GET ${W}/facilities`]: async (c) => st(await c.get(`${base}/facilities`)),
  [`POST ${W}/facilities`]: async (c, who) => st(await c.post(`${base}/facilities`, { data: { name: `Matrix ${who}`, site } })),
  [`GET ${F}`]: async (c) => st(await c.get(f())),
  [`PATCH ${F}`]: async (c) => {
    const cur = await (await ctx.owner.get(s())).json();
    return st(await c.patch(s(), { data: { name: cur.facility.name } }));
  },
  [`POST ${F}/duplicate`]: async (c) => st(await c.post(`${s()}/duplicate`, { data: {} })),
  [`POST ${F}/archive`]: async (c) => {
    const created = await (await ctx.designer.post(`${base}/facilities`, { data: { name: "To archive", site } })).json();
    return st(await c.post(`${f(created.facility.id)}/archive`, { data: { archived: true } }));
  },
  [`GET ${F}/model`]: async (c) => st(await c.get(`${f()}/model`)),
  [`PUT ${F}/model`]: async (c) => {
    const m = await (await ctx.owner.get(`${s()}/model`)).json();
    return st(await c.put(`${s()}/model`, { data: { baseVersion: m.version, doc: m.doc, summary: "matrix" } }));
  },
  [`GET ${F}/results`]: async (c) => st(await c.get(`${f()}/results`)),
  [`GET ${F}/revisions`]: async (c) => st(await c.get(`${f()}/revisions`)),
  [`POST ${F}/revisions/[n]/issue`]: async (c, who) => {
    // A fresh unissued revision to issue: the owner restores revision 1 (the empty model) and then
    // revision 2 (the demo model), so the second always makes a new version with the demo model.
    for (const n of [1, 2]) expect((await ctx.owner.post(`${s()}/revisions/${n}/restore`)).status()).toBe(200);
    const { current } = await (await ctx.owner.get(`${s()}/revisions`)).json();
    return st(await c.post(`${s()}/revisions/${current}/issue`, { data: { letter: letters[who], status: "for comment", checkedBy: "Matrix checker" } }));
  },
  // revision 2 holds the demo model with its installed plant, which the later rows need
  [`POST ${F}/revisions/[n]/restore`]: async (c) => st(await c.post(`${s()}/revisions/2/restore`)),
  [`GET ${F}/layout`]: async (c) => st(await c.get(`${f()}/layout`)),
  [`PUT ${F}/layout`]: async (c) => st(await c.put(`${s()}/layout`, { data: { positions: { "room:apples": { x: 12, y: 34 } } } })),
  [`GET ${F}/layout/background`]: async (c) => st(await c.get(`${s()}/layout/background`)),
  [`PUT ${F}/layout/background`]: async (c) => st(await c.put(`${s()}/layout/background`, { data: PNG, headers: { "content-type": "image/png" } })),
  [`DELETE ${F}/layout/background`]: async (c) => {
    expect((await ctx.owner.put(`${s()}/layout/background`, { data: PNG, headers: { "content-type": "image/png" } })).status()).toBe(200);
    return st(await c.delete(`${s()}/layout/background`));
  },
  [`GET ${F}/installed`]: async (c) => st(await c.get(`${s()}/installed`)),
  [`PUT ${F}/installed`]: async (c) => {
    const { version } = await (await ctx.owner.get(`${s()}/installed`)).json();
    return st(await c.put(`${s()}/installed`, { data: { baseVersion: version, installed: fixture("lib/engine/stocking/fixtures/harrowfield-installed.json") } }));
  },
  [`POST ${F}/import/rooms`]: async (c) =>
    st(await c.post(`${s()}/import/rooms`, { multipart: { file: { name: "rooms.csv", mimeType: "text/csv", buffer: Buffer.from(ROOMS_CSV) }, mode: "preview" } })),
  [`POST ${F}/import/stocking`]: async (c) =>
    st(await c.post(`${s()}/import/stocking`, { multipart: { file: { name: "plan.csv", mimeType: "text/csv", buffer: Buffer.from(STOCKING_CSV) }, mode: "preview" } })),
  [`GET ${F}/scenarios`]: async (c) => st(await c.get(`${s()}/scenarios`)),
  [`POST ${F}/scenarios`]: async (c, who) => st(await c.post(`${s()}/scenarios`, { data: { name: `Matrix ${who}`, changes: { rooms: [{ roomId: "apples", tonnesPerDay: 6 }] } } })),
  [`GET ${F}/scenarios/[sid]`]: async (c) => st(await c.get(`${s()}/scenarios/${scenarioId}`)),
  [`POST ${F}/scenarios/[sid]/accept`]: async (c) => st(await c.post(`${s()}/scenarios/${await newScenario()}/accept`)),
  [`POST ${F}/scenarios/[sid]/apply`]: async (c) => st(await c.post(`${s()}/scenarios/${await newScenario(true)}/apply`)),
  [`POST ${F}/scenarios/[sid]/email`]: async (c, who) => st(await c.post(`${s()}/scenarios/${scenarioId}/email`, { data: { to: [`matrix-reader-${who}@example.test`] } })),
  [`GET ${F}/schedule`]: async (c) => st(await c.get(`${f()}/schedule`)),
  [`POST ${F}/exports`]: async (c) => st(await c.post(`${f()}/exports`, { data: { format: "csv" } })),
  [`GET ${F}/options`]: async (c) => st(await c.get(`${f()}/options`)),
  [`POST ${F}/options`]: async (c, who) => {
    await ownerOption(`pre-${who}`); // prunes, so the allowed create always has room
    return st(await c.post(`${s()}/options`, { data: { name: `Matrix option ${who} ${Date.now()}` } }));
  },
  [`PATCH ${F}/options`]: async (c) => st(await c.patch(`${s()}/options`, { data: { years: 15, gridKgCo2PerKWh: 0.25 } })),
  [`PATCH ${F}/options/[oid]`]: async (c, who) => st(await c.patch(`${s()}/options/${await ownerOption(who)}`, { data: { name: `Renamed ${who} ${Date.now()}`, leakPctPerYear: 4 } })),
  [`DELETE ${F}/options/[oid]`]: async (c, who) => st(await c.delete(`${s()}/options/${await ownerOption(who)}`)),
  [`POST ${F}/options/[oid]/design`]: async (c, who) => st(await c.post(`${s()}/options/${await ownerOption(who)}/design`)),
  [`GET ${F}/weather`]: async (c) => st(await c.get(`${f()}/weather`)),
  [`POST ${F}/weather`]: async (c) => st(await c.post(`${s()}/weather`, { multipart: { file: { name: "year.csv", mimeType: "text/csv", buffer: Buffer.from(WEATHER_CSV) } } })),
  [`PUT ${F}/weather`]: async (c) => st(await c.put(`${s()}/weather`, { data: MONTHLY })),
  [`GET ${F}/energy`]: async (c) => st(await c.get(`${f()}/energy`)),
  [`POST ${F}/energy`]: async (c) => {
    // the scratch facility needs a weather year to run
    expect((await ctx.owner.put(`${s()}/weather`, { data: MONTHLY })).status()).toBe(200);
    return st(await c.post(`${s()}/energy`));
  },
};

for (const [key, row] of Object.entries(COVERED)) {
  const send = SEND[key];
  if (row.kind === "open") {
    test(`${key} is public (${row.why}): signed in or not it answers ${row.statuses.join(" or ")}`, async () => {
      for (const who of ["anon", "viewer", "owner"] as const) {
        const status = await send(who === "anon" ? anon : ctx[who], who);
        expect(row.statuses, `${key} as ${who} answered ${status}`).toContain(status);
      }
    });
    continue;
  }
  for (const role of ROLES) {
    test(`${key} as ${role} is ${row.expect[role] === "A" ? "allowed" : "denied"}`, async () => {
      const status = await send(ctx[role], role);
      if (row.expect[role] === "A") {
        expect(status, `${key} as ${role}`).toBeGreaterThanOrEqual(200);
        expect(status, `${key} as ${role}`).toBeLessThan(300);
      } else expect(status, `${key} as ${role}`).toBe(403);
    });
  }
  test(`${key} without signing in is 401`, async () => {
    expect(await send(anon, "anon")).toBe(401);
  });
}

test("a forbidden answer names the role and what is allowed", async () => {
  const r = await ctx.viewer.post(`${base}/facilities`, { data: { name: "No", site } });
  expect(r.status()).toBe(403);
  const body = await r.json();
  expect(body.error.code).toBe("forbidden");
  expect(body.error.message).toContain("viewer");
  expect(body.error.message).toContain("owner, designer");
});

test("a job is found only under its own workspace and by its id: a made-up id is 404, a malformed one 400", async () => {
  const r = await ctx.owner.get(`${base}/jobs/00000000-0000-4000-8000-000000000000`);
  expect(r.status()).toBe(404);
  expect((await r.json()).error.message).toBe("Job not found in this workspace.");
  const bad = await ctx.owner.get(`${base}/jobs/not-a-uuid`);
  expect(bad.status()).toBe(400);
  expect((await bad.json()).error.message).toMatch(/Job id must be a UUID/);
  expect((await ctx.owner.get(`/api/v1/workspaces/no-such-workspace/jobs/${(await ownerExport()).id}`)).status()).toBe(404);
});

test("a non-member cannot see that another workspace exists", async () => {
  const r = await ctx.viewer.get(`/api/v1/workspaces/no-such-workspace/facilities`);
  expect(r.status()).toBe(404);
});

test("the role is read from the database on each request: a demoted member loses the right at once, a removed one is signed out", async ({ baseURL }) => {
  const id = await newMember(ctx.owner, "demote");
  const members = await (await ctx.owner.get(`${base}/members`)).json();
  const email = members.members.find((m: { userId: string }) => m.userId === id).email;
  // make them a designer, sign them in, then demote: the next request must be refused
  expect((await ctx.owner.patch(`${base}/members/${id}`, { data: { role: "designer" } })).status()).toBe(200);
  const c = await pwRequest.newContext({ baseURL });
  const csrf = (await (await c.get("/api/auth/csrf")).json()).csrfToken;
  await c.post("/api/auth/callback/password", { form: { csrfToken: csrf, email, password: "temporary-password-1" } });
  expect((await c.post(`${base}/facilities`, { data: { name: "By temp designer", site } })).status()).toBe(201);
  expect((await ctx.owner.patch(`${base}/members/${id}`, { data: { role: "viewer" } })).status()).toBe(200);
  expect((await c.post(`${base}/facilities`, { data: { name: "Refused", site } })).status()).toBe(403);
  // removing them ends the session itself
  expect((await ctx.owner.delete(`${base}/members/${id}`)).status()).toBe(200);
  expect((await c.get("/api/v1/me")).status()).toBe(401);
  await c.dispose();
});
