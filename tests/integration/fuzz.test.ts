/**
 * Fuzz test of the JSON routes (fast-check, fixed seeds): generated bodies — valid ones with one
 * part replaced, added or removed (wrong types, "NaN"/"Infinity" strings, huge and negative
 * numbers, NUL characters, prototype keys, deep nesting), raw texts (nesting thousands deep,
 * 1e999, not JSON) and a few 10 MB bodies — sent to the route modules' handlers in-process
 * with a real database. Every answer must be a success or a 4xx (a 400 names its field), never
 * a 5xx; afterwards every stored row still passes the schemas that guard it.
 */
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { readFileSync } from "node:fs";
import path from "node:path";
import fc from "fast-check";
import { eq, inArray } from "drizzle-orm";
import { db } from "@/db/client";
import { facilities, facilityLayouts, facilityRevisions, invites, scenarios, users } from "@/db/schema";
import { env } from "@/lib/env";
import type { CurrentUser } from "@/lib/session";
import { strippedKeys } from "@/lib/validation";
import { createFacility, toDto } from "@/features/facilities/queries";
import { saveFacilityModel } from "@/features/facilities/model";
import { facilityNameSchema, siteConditionsSchema } from "@/features/facilities/schema";
import { issueSchema } from "@/features/facilities/model-schema";
import { parseEngineModel, toEngineInput, type ModelDoc } from "@/features/facilities/engine-model";
import { layoutPutSchema } from "@/features/layout-canvas/schema";
import { createScenarioSchema } from "@/features/stocking-check/schema";
import { createScenario } from "@/features/stocking-check/queries";
import { inviteSchema } from "@/features/team/schema";
import { scenarioChangesSchema } from "@/lib/engine/stocking";
import { addMember, makeUser, makeWorkspace, SITE } from "../factories";

const session = vi.hoisted(() => ({ user: null as CurrentUser | null }));
vi.mock("@/lib/session", () => ({ currentUser: async () => session.user, requireUser: async () => session.user }));

import * as facilitiesRoute from "@/app/api/v1/workspaces/[ws]/facilities/route";
import * as facilityRoute from "@/app/api/v1/workspaces/[ws]/facilities/[id]/route";
import * as duplicateRoute from "@/app/api/v1/workspaces/[ws]/facilities/[id]/duplicate/route";
import * as archiveRoute from "@/app/api/v1/workspaces/[ws]/facilities/[id]/archive/route";
import * as modelRoute from "@/app/api/v1/workspaces/[ws]/facilities/[id]/model/route";
import * as layoutRoute from "@/app/api/v1/workspaces/[ws]/facilities/[id]/layout/route";
import * as issueRoute from "@/app/api/v1/workspaces/[ws]/facilities/[id]/revisions/[n]/issue/route";
import * as scenariosRoute from "@/app/api/v1/workspaces/[ws]/facilities/[id]/scenarios/route";
import * as emailRoute from "@/app/api/v1/workspaces/[ws]/facilities/[id]/scenarios/[sid]/email/route";
import * as installedRoute from "@/app/api/v1/workspaces/[ws]/facilities/[id]/installed/route";
import * as invitesRoute from "@/app/api/v1/workspaces/[ws]/invites/route";
import * as memberRoute from "@/app/api/v1/workspaces/[ws]/members/[userId]/route";
import * as meRoute from "@/app/api/v1/me/route";
import * as calculateRoute from "@/app/api/v1/calculate/route";
import * as acceptRoute from "@/app/api/v1/invites/accept/route";
import * as resetRoute from "@/app/api/v1/auth/reset/route";
import * as linkRoute from "@/app/api/v1/auth/link/route";
import * as resetRequestRoute from "@/app/api/v1/auth/reset-request/route";
import * as weatherRoute from "@/app/api/v1/workspaces/[ws]/facilities/[id]/weather/route";
import * as settingsRoute from "@/app/api/v1/workspaces/[ws]/settings/route";

const read = (p: string) => JSON.parse(readFileSync(path.resolve(import.meta.dirname, "../..", p), "utf8"));
const demo = read("seeds/data/harrowfield-model.json") as ModelDoc;
const { $comment: _c, ...installed } = read("lib/engine/stocking/fixtures/harrowfield-installed.json");
void _c;
const calcModel = read("seeds/data/harrowfield-facility.json");
const OWN = new URL(env.APP_URL).origin;

type Handler = (req: Request, ctx: { params: Promise<Record<string, string>> }) => Promise<Response>;

interface Target {
  name: string;
  handler: unknown;
  method: string;
  params: () => Record<string, string>;
  base: () => unknown;
  runs: number;
}

/** Every answer seen, by status; the failures kept for the message. */
const seen = { calls: 0, byStatus: new Map<number, number>(), byRoute: new Map<string, Record<number, number>>(), bad: [] as string[] };

async function send(t: Target, params: Record<string, string>, raw: string): Promise<void> {
  const req = new Request(`${OWN}/fuzz/${t.name}`, { method: t.method, headers: { "content-type": "application/json" }, body: raw });
  const res = await (t.handler as Handler)(req, { params: Promise.resolve(params) });
  seen.calls++;
  seen.byStatus.set(res.status, (seen.byStatus.get(res.status) ?? 0) + 1);
  const r = seen.byRoute.get(t.name) ?? {};
  r[res.status] = (r[res.status] ?? 0) + 1;
  seen.byRoute.set(t.name, r);
  const text = await res.text();
  const problem = (why: string) => void seen.bad.push(`${t.name} ${res.status} ${why}: ${raw.slice(0, 160)} → ${text.slice(0, 200)}`);
  if (res.status >= 500) return problem("server error");
  if (res.status >= 400) {
    let body: { error?: { code?: string; field?: string; message?: string } };
    try {
      body = JSON.parse(text);
    } catch {
      return problem("error body not JSON");
    }
    if (!body.error?.code || !body.error.message) return problem("error without code or message");
    if (res.status === 400 && !body.error.field) problem("400 without a field");
  }
}

// ---- generators -------------------------------------------------------------------------

const protoObject = (k: string) => JSON.parse(`{"${k}":{"polluted":true,"isAdmin":true}}`) as unknown;

const weird: fc.Arbitrary<unknown> = fc.oneof(
  fc.constantFrom("NaN", "Infinity", "-Infinity", "1e309", "-0", "0x10", "", " ", "\u0000", "a\u0000b", "null", "true", "__proto__", "constructor", "'; drop table users; --", "\uD800", "💧".repeat(50)),
  fc.constantFrom(1e308, -1e308, 2 ** 31, 2 ** 31 - 1, -(2 ** 31) - 1, 2 ** 53 + 2, Number.MAX_SAFE_INTEGER, -1, 0, -0.5, 1e-320, 99999999999, 4.2),
  fc.integer(),
  fc.double({ noNaN: true, noDefaultInfinity: true }),
  // Plausible values too, so that a share of the bodies stays valid and reaches the database.
  fc.integer({ min: 0, max: 40 }),
  fc.double({ min: -30, max: 40, noNaN: true }),
  fc.constantFrom("A", "B2", "Cold room", "designer", "viewer", "light", "IP", "for tender", "apples", "someone@example.test"),
  fc.string({ maxLength: 300 }),
  fc.string({ unit: "grapheme", maxLength: 40 }),
  fc.boolean(),
  fc.constant(null),
  fc.array(fc.jsonValue({ maxDepth: 3 }), { maxLength: 5 }),
  fc.dictionary(fc.string({ maxLength: 10 }), fc.jsonValue({ maxDepth: 2 }), { maxKeys: 4 }),
  fc.constantFrom("__proto__", "constructor", "prototype").map(protoObject),
  fc.integer({ min: 70, max: 400 }).map((d) => {
    let v: unknown = 1;
    for (let i = 0; i < d; i++) v = i % 2 ? [v] : { a: v };
    return v;
  }),
);

const newKey = fc.oneof(fc.constantFrom("__proto__", "constructor", "prototype", "extra", "k\u0000", "", "toString"), fc.string({ maxLength: 12 }));

type Op = { op: "replace" | "add" | "delete" | "wrap" | "whole"; at: number; value: unknown; key: string };
const opArb: fc.Arbitrary<Op> = fc.record({
  op: fc.constantFrom("replace", "replace", "replace", "add", "delete", "wrap", "whole"),
  at: fc.nat(),
  value: weird,
  key: newKey,
});

type PathT = (string | number)[];
function containers(v: unknown, p: PathT = [], out: PathT[] = []): PathT[] {
  out.push(p);
  if (v && typeof v === "object") for (const [k, x] of Object.entries(v)) if (x && typeof x === "object") containers(x, [...p, Array.isArray(v) ? Number(k) : k], out);
  return out;
}
function leaves(v: unknown, p: PathT = [], out: PathT[] = []): PathT[] {
  if (v && typeof v === "object") for (const [k, x] of Object.entries(v)) leaves(x, [...p, Array.isArray(v) ? Number(k) : k], out);
  else if (p.length) out.push(p);
  return out;
}
const at = (root: unknown, p: PathT): unknown => p.reduce<unknown>((o, k) => (o as Record<string | number, unknown>)[k], root);

/** One change to a clone of a valid body; JSON text (prototype keys survive as own keys). */
function mutate(base: unknown, m: Op): string {
  if (m.op === "whole") return JSON.stringify(m.value) ?? "null";
  const body = structuredClone(base);
  if (m.op === "add") {
    const objs = containers(body).filter((p) => { const c = at(body, p); return c && typeof c === "object" && !Array.isArray(c); });
    const target = at(body, objs[m.at % objs.length]) as Record<string, unknown>;
    Object.defineProperty(target, m.key, { value: m.value, enumerable: true, configurable: true, writable: true });
    return JSON.stringify(body);
  }
  const ls = leaves(body).concat(containers(body).filter((p) => p.length > 0));
  if (ls.length === 0) return JSON.stringify(m.value) ?? "null";
  const p = ls[m.at % ls.length];
  const parent = at(body, p.slice(0, -1)) as Record<string | number, unknown>;
  const k = p[p.length - 1];
  if (m.op === "delete") {
    if (Array.isArray(parent)) parent.splice(Number(k), 1);
    else delete parent[k];
  } else if (m.op === "wrap") parent[k] = [parent[k]];
  else Object.defineProperty(parent, k, { value: m.value, enumerable: true, configurable: true, writable: true });
  return JSON.stringify(body);
}

const RAW = [
  "[".repeat(5000) + "]".repeat(5000),
  '{"a":'.repeat(3000) + "1" + "}".repeat(3000),
  '{"baseVersion":1e999,"doc":{"schemaVersion":1,"rooms":[],"doors":[]}}',
  '{"name":"x","site":{"designDryBulbC":1e999,"groundTempC":-1e999,"elevationM":0,"coincidentWetBulbC":0}}',
  '{"__proto__":{"polluted":true},"name":"proto"}',
  '{"constructor":{"prototype":{"polluted":true}}}',
  "not json",
  "",
  "\u0000",
  "null",
  "[]",
  '"text"',
  "123456789012345678901234567890",
  '{"name":"\\u0000"}',
  '{"email":"a@b.test","email":"c@d.test"}',
  "\uFEFF{}",
];

// ---- the workspace under test --------------------------------------------------------------

const ctx = {} as {
  slug: string;
  wsId: string;
  facA: string;
  facB: string;
  sid: string;
  memberId: string;
};

const P = () => ({ ws: ctx.slug });
const PA = () => ({ ws: ctx.slug, id: ctx.facA });
const PB = () => ({ ws: ctx.slug, id: ctx.facB });

const targets: Target[] = [
  { name: "facilities.create", handler: facilitiesRoute.POST, method: "POST", params: P, base: () => ({ name: "Fuzzed store", site: SITE }), runs: 800 },
  { name: "facility.update", handler: facilityRoute.PATCH, method: "PATCH", params: PB, base: () => ({ name: "Renamed", site: SITE, baseVersion: 1 }), runs: 800 },
  { name: "facility.duplicate", handler: duplicateRoute.POST, method: "POST", params: PB, base: () => ({ name: "Copy" }), runs: 300 },
  { name: "facility.archive", handler: archiveRoute.POST, method: "POST", params: PB, base: () => ({ archived: false }), runs: 300 },
  { name: "model.save", handler: modelRoute.PUT, method: "PUT", params: PA, base: () => ({ baseVersion: 2, doc: demo, summary: "fuzz" }), runs: 1500 },
  { name: "layout.save", handler: layoutRoute.PUT, method: "PUT", params: PA, base: () => ({ positions: { "room:apples": { x: 10, y: 20 }, outdoors: { x: 0, y: 0 } }, viewport: { x: 0, y: 0, zoom: 1 }, backgroundWidthM: 100 }), runs: 800 },
  { name: "revision.issue", handler: issueRoute.POST, method: "POST", params: () => ({ ...PA(), n: "1" }), base: () => ({ letter: "P1", status: "for comment", checkedBy: "Fuzz Checker" }), runs: 800 },
  { name: "scenario.create", handler: scenariosRoute.POST, method: "POST", params: PA, base: () => ({ name: "Fuzz check", changes: { rooms: [{ roomId: "apples", tonnesPerDay: 5 }] } }), runs: 500 },
  { name: "scenario.email", handler: emailRoute.POST, method: "POST", params: () => ({ ...PA(), sid: ctx.sid }), base: () => ({ to: ["reader@example.test"], note: "fuzz" }), runs: 250 },
  { name: "installed.save", handler: installedRoute.PUT, method: "PUT", params: PA, base: () => ({ baseVersion: 2, installed }), runs: 500 },
  { name: "invites.create", handler: invitesRoute.POST, method: "POST", params: P, base: () => ({ email: "fuzz-invitee@example.test", role: "viewer" }), runs: 400 },
  { name: "member.role", handler: memberRoute.PATCH, method: "PATCH", params: () => ({ ws: ctx.slug, userId: ctx.memberId }), base: () => ({ role: "designer" }), runs: 400 },
  { name: "me.prefs", handler: meRoute.PATCH, method: "PATCH", params: () => ({}), base: () => ({ unitSystem: "SI", theme: "light", name: "Fuzz Owner" }), runs: 500 },
  { name: "calculate", handler: calculateRoute.POST, method: "POST", params: () => ({}), base: () => calcModel, runs: 500 },
  { name: "invite.accept", handler: acceptRoute.POST, method: "POST", params: () => ({}), base: () => ({ token: "t".repeat(43), name: "Someone", password: "a-long-password" }), runs: 500 },
  { name: "auth.reset", handler: resetRoute.POST, method: "POST", params: () => ({}), base: () => ({ token: "t".repeat(43), password: "a-long-password" }), runs: 400 },
  { name: "auth.link", handler: linkRoute.POST, method: "POST", params: () => ({}), base: () => ({ email: "nobody@example.test" }), runs: 300 },
  { name: "weather.monthly", handler: weatherRoute.PUT, method: "PUT", params: PB, base: () => ({ year: 2025, climate: { label: "Fuzz climate", meanDryBulbC: Array(12).fill(10), dailyRangeK: Array(12).fill(8), meanRhPct: Array(12).fill(75) } }), runs: 200 },
  { name: "workspace.settings", handler: settingsRoute.PATCH, method: "PATCH", params: P, base: () => ({ currency: "EUR" }), runs: 300 },
  { name: "auth.reset-request", handler: resetRequestRoute.POST, method: "POST", params: () => ({}), base: () => ({ email: "nobody@example.test" }), runs: 300 },
];

/** Path parameters that are not what the route expects, for a share of the requests. */
const badParam = fc.constantFrom("99999999999", "-1", "0", "1.5", "NaN", "Infinity", "1e3", "\u0000", "a\u0000b", "not-a-uuid", "", "00000000-0000-0000-0000-000000000000");

let owner: typeof users.$inferSelect;
const started = performance.now();

beforeAll(async () => {
  const ws = await makeWorkspace("Fuzz workspace");
  owner = await makeUser("Fuzz Owner");
  await addMember(ws.id, owner.id, "owner");
  const member = await makeUser("Fuzz Member");
  await addMember(ws.id, member.id, "viewer");
  const a = await createFacility(ws.id, owner.id, { name: "Fuzz A", site: SITE });
  const b = await createFacility(ws.id, owner.id, { name: "Fuzz B", site: SITE });
  await saveFacilityModel({ workspaceId: ws.id, facilityId: a.id, userId: owner.id, baseVersion: 1, doc: { ...demo, plant: { ...(demo.plant ?? {}), installed } } as ModelDoc });
  const s = await createScenario(ws.id, a.id, owner.id, { name: "Fuzz base", changes: scenarioChangesSchema.parse({ rooms: [{ roomId: "apples", tonnesPerDay: 10 }] }) });
  Object.assign(ctx, { slug: ws.slug, wsId: ws.id, facA: a.id, facB: b.id, sid: s.id, memberId: member.id });
  session.user = { id: owner.id, email: owner.email, name: owner.name, unitSystem: "SI", theme: "system", sessionId: "fuzz" };
});

afterAll(() => {
  const s = ((performance.now() - started) / 1000).toFixed(1);
  console.log(`fuzz: ${seen.calls} requests in ${s} s; by status ${JSON.stringify(Object.fromEntries([...seen.byStatus].sort((x, y) => x[0] - y[0])))}`);
  for (const [name, r] of seen.byRoute) console.log(`  ${name}: ${JSON.stringify(r)}`);
});

describe("fuzzed JSON bodies on every JSON route", () => {
  targets.forEach((t, i) => {
    it(`${t.name}: ${t.runs} generated bodies, never a 5xx`, async () => {
      const base = t.base();
      await fc.assert(
        fc.asyncProperty(opArb, fc.oneof({ weight: 9, arbitrary: fc.constant(null) }, { weight: 1, arbitrary: badParam }), async (m, bad) => {
          const params = t.params();
          if (bad !== null) {
            const keys = Object.keys(params);
            if (keys.length) params[keys[m.at % keys.length]] = bad;
          }
          await send(t, params, mutate(base, m));
        }),
        { seed: 1200 + i, numRuns: t.runs, endOnFailure: true },
      );
      expect(seen.bad.filter((b) => b.startsWith(t.name + " "))).toEqual([]);
    }, 120_000);
  });

  it("raw texts on every route: nesting thousands deep, 1e999, prototype keys, not JSON", async () => {
    await fc.assert(
      fc.asyncProperty(fc.nat(targets.length - 1), fc.constantFrom(...RAW), async (ti, raw) => send(targets[ti], targets[ti].params(), raw)),
      { seed: 1299, numRuns: 500 },
    );
    expect(seen.bad).toEqual([]);
  }, 120_000);

  it("10 MB bodies are refused with 413 before they are parsed", async () => {
    const big = JSON.stringify({ baseVersion: 2, doc: { ...demo, filler: "x".repeat(10 * 1024 * 1024) } });
    for (const t of [targets[0], targets[4], targets[13]]) {
      const before = seen.byStatus.get(413) ?? 0;
      await send(t, t.params(), big);
      expect(seen.byStatus.get(413)).toBe(before + 1);
    }
    expect(seen.bad).toEqual([]);
  });

  it("sent at least 10 000 bodies, and nothing invalid was stored", async () => {
    expect(seen.calls).toBeGreaterThanOrEqual(10_000);
    expect(seen.bad).toEqual([]);
    expect(({} as Record<string, unknown>).polluted).toBeUndefined();
    expect(({} as Record<string, unknown>).isAdmin).toBeUndefined();

    const rows = await db.select().from(facilities).where(eq(facilities.workspaceId, ctx.wsId));
    expect(rows.length).toBeGreaterThan(2); // creations and duplicates went through
    const modelOk = (doc: unknown, site: ReturnType<typeof toDto>["site"], where: string) => {
      expect(JSON.stringify(doc), where).not.toContain("\\u0000");
      const { $comment: _x, ...d } = doc as ModelDoc;
      void _x;
      const parsed = parseEngineModel(d as ModelDoc, site);
      expect(parsed.success, `${where}: ${parsed.error?.issues[0]?.message}`).toBe(true);
      expect(strippedKeys(toEngineInput(d as ModelDoc, site), parsed.data), where).toEqual([]);
    };
    for (const r of rows) {
      expect(facilityNameSchema.parse(r.name)).toBe(r.name);
      const site = toDto(r).site;
      expect(siteConditionsSchema.safeParse(site).success, `site of ${r.name}`).toBe(true);
      if (r.model) modelOk(r.model, site, `facility ${r.name} v${r.version}`);
    }
    const revs = await db.select().from(facilityRevisions).where(inArray(facilityRevisions.facilityId, rows.map((r) => r.id)));
    for (const rev of revs) {
      if (rev.model && (rev.model as ModelDoc).rooms?.length) modelOk(rev.model, rev.site as never, `revision ${rev.number}`);
      if (rev.issuedAt) expect(issueSchema.safeParse({ letter: rev.issuedLetter, status: rev.issuedStatus, checkedBy: rev.checkedBy }).success).toBe(true);
    }
    const layouts = await db.select().from(facilityLayouts).where(inArray(facilityLayouts.facilityId, rows.map((r) => r.id)));
    for (const l of layouts) {
      const input = { positions: l.positions, viewport: l.viewport, ...(l.backgroundWidthM !== null ? { backgroundWidthM: l.backgroundWidthM } : {}) };
      const parsed = layoutPutSchema.safeParse(input);
      expect(parsed.success).toBe(true);
      expect(strippedKeys(input, parsed.data)).toEqual([]);
    }
    for (const s of await db.select().from(scenarios).where(eq(scenarios.workspaceId, ctx.wsId))) {
      const input = { name: s.name, changes: s.changes };
      const parsed = createScenarioSchema.safeParse(input);
      expect(parsed.success, s.name).toBe(true);
      expect(parsed.data!.name).toBe(s.name);
    }
    for (const inv of await db.select().from(invites).where(eq(invites.workspaceId, ctx.wsId))) {
      expect(inviteSchema.parse({ email: inv.email, role: inv.role }).email).toBe(inv.email);
    }
    const [me] = await db.select().from(users).where(eq(users.id, owner.id));
    expect(me.name.length).toBeGreaterThanOrEqual(1);
    expect(me.name.length).toBeLessThanOrEqual(80);
    expect(me.name).not.toContain("\u0000");
  });
});
