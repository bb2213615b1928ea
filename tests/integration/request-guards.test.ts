/**
 * What route() refuses before a handler runs, and the races that must end in one winner and
 * clear 409s. The route modules' handlers are called in-process with Request objects; the
 * session is a real user of a real workspace (only how the cookie is read is replaced).
 */
import { beforeEach, describe, expect, it, vi } from "vitest";
import { readFileSync } from "node:fs";
import path from "node:path";
import { and, count, eq, sql } from "drizzle-orm";
import { db } from "@/db/client";
import { auditLog, facilities, facilityLayouts, facilityRevisions, invites, memberships, scenarios, users } from "@/db/schema";
import { env } from "@/lib/env";
import { authorize } from "@/lib/authz";
import type { CurrentUser } from "@/lib/session";
import { newToken } from "@/lib/tokens";
import { createFacility } from "@/features/facilities/queries";
import { loadFacilityModel, saveFacilityModel } from "@/features/facilities/model";
import type { ModelDoc } from "@/features/facilities/engine-model";
import { acceptScenario, createScenario } from "@/features/stocking-check/queries";
import { scenarioChangesSchema } from "@/lib/engine/stocking";
import { addMember, makeUser, makeWorkspace, SITE } from "../factories";

const session = vi.hoisted(() => ({ user: null as CurrentUser | null }));
vi.mock("@/lib/session", () => ({ currentUser: async () => session.user, requireUser: async () => session.user }));
// next-auth itself is not loaded here: its POST answers 200 when a request reaches it.
const nextAuth = vi.hoisted(() => ({ reached: 0 }));
vi.mock("@/lib/auth", () => ({
  handlers: {
    GET: async () => new Response("next-auth"),
    POST: async () => {
      nextAuth.reached++;
      return new Response("next-auth");
    },
  },
}));

import * as facilitiesRoute from "@/app/api/v1/workspaces/[ws]/facilities/route";
import * as facilityRoute from "@/app/api/v1/workspaces/[ws]/facilities/[id]/route";
import * as invitesRoute from "@/app/api/v1/workspaces/[ws]/invites/route";
import * as modelRoute from "@/app/api/v1/workspaces/[ws]/facilities/[id]/model/route";
import * as issueRoute from "@/app/api/v1/workspaces/[ws]/facilities/[id]/revisions/[n]/issue/route";
import * as backgroundRoute from "@/app/api/v1/workspaces/[ws]/facilities/[id]/layout/background/route";
import * as importRoomsRoute from "@/app/api/v1/workspaces/[ws]/facilities/[id]/import/rooms/route";
import * as applyRoute from "@/app/api/v1/workspaces/[ws]/facilities/[id]/scenarios/[sid]/apply/route";
import * as acceptRoute from "@/app/api/v1/invites/accept/route";
import * as auditRoute from "@/app/api/v1/workspaces/[ws]/audit/route";
import * as nextAuthRoute from "@/app/api/auth/[...nextauth]/route";

const read = (p: string) => JSON.parse(readFileSync(path.resolve(import.meta.dirname, "../..", p), "utf8"));
const demo = read("seeds/data/harrowfield-model.json") as ModelDoc;
const OWN = new URL(env.APP_URL).origin;

type Handler = (req: Request, ctx: { params: Promise<Record<string, string>> }) => Promise<Response>;

interface CallOpts {
  method?: string;
  headers?: Record<string, string>;
  json?: unknown;
  body?: BodyInit | null;
  params?: Record<string, string>;
  query?: string;
}

async function call(h: unknown, path: string, o: CallOpts = {}) {
  const headers: Record<string, string> = { ...(o.json !== undefined ? { "content-type": "application/json" } : {}), ...(o.headers ?? {}) };
  const init: RequestInit & { duplex?: "half" } = { method: o.method ?? "POST", headers };
  if (o.json !== undefined) init.body = JSON.stringify(o.json);
  else if (o.body !== undefined) init.body = o.body;
  if (init.body instanceof ReadableStream) init.duplex = "half";
  const res = await (h as Handler)(new Request(`${OWN}${path}${o.query ?? ""}`, init), { params: Promise.resolve(o.params ?? {}) });
  const text = await res.text();
  return { status: res.status, body: text ? JSON.parse(text) : null };
}

function asSession(u: typeof users.$inferSelect): CurrentUser {
  return { id: u.id, email: u.email, name: u.name, unitSystem: u.unitSystem as "SI", theme: u.theme as "system", sessionId: "test" };
}

async function setup() {
  const ws = await makeWorkspace();
  const owner = await makeUser("Owner Person");
  await addMember(ws.id, owner.id, "owner");
  const f = await createFacility(ws.id, owner.id, { name: "Guarded", site: SITE });
  session.user = asSession(owner);
  return { ws, owner, f, base: `/api/v1/workspaces/${ws.slug}` };
}

/** A body that never ends on its own: counts how many bytes were pulled from it. */
function endless(chunk: Uint8Array) {
  const state = { pulled: 0 };
  const stream = new ReadableStream<Uint8Array>({
    pull(c) {
      state.pulled += chunk.byteLength;
      c.enqueue(chunk);
    },
  });
  return { stream, state };
}

beforeEach(() => {
  session.user = null;
});

describe("forged requests from another site", () => {
  it("refuses a foreign Origin (another port, a sibling subdomain) with 403, storing nothing", async () => {
    const { ws, base } = await setup();
    const own = new URL(OWN);
    const otherPort = `${own.protocol}//${own.hostname}:${Number(own.port || 80) + 1}`;
    const sibling = `${own.protocol}//evil.${own.hostname}${own.port ? `:${own.port}` : ""}`;
    for (const origin of [otherPort, sibling, "null"]) {
      const r = await call(invitesRoute.POST, `${base}/invites`, {
        params: { ws: ws.slug },
        headers: { origin },
        json: { email: "new-owner@example.test", role: "owner" },
      });
      expect(r.status, origin).toBe(403);
      expect(r.body.error.code).toBe("forbidden");
      expect(r.body.error.message).toContain("another site");
      expect(r.body.error.message).toContain(OWN);
    }
    const [n] = await db.select({ n: count() }).from(invites).where(eq(invites.workspaceId, ws.id));
    expect(n.n).toBe(0);
  });

  it("without Origin, refuses Sec-Fetch-Site cross-site and same-site; same-origin and header-less requests pass", async () => {
    const { ws, base } = await setup();
    for (const site of ["cross-site", "same-site"]) {
      const r = await call(facilitiesRoute.POST, `${base}/facilities`, { params: { ws: ws.slug }, headers: { "sec-fetch-site": site }, json: { name: "Forged", site: SITE } });
      expect(r.status, site).toBe(403);
      expect(r.body.error.message).toContain(`Sec-Fetch-Site: ${site}`);
    }
    const same = await call(facilitiesRoute.POST, `${base}/facilities`, { params: { ws: ws.slug }, headers: { "sec-fetch-site": "same-origin", origin: OWN }, json: { name: "From our page", site: SITE } });
    expect(same.status).toBe(201);
    const script = await call(facilitiesRoute.POST, `${base}/facilities`, { params: { ws: ws.slug }, json: { name: "From a script", site: SITE } });
    expect(script.status).toBe(201);
    const names = (await db.select({ name: facilities.name }).from(facilities).where(eq(facilities.workspaceId, ws.id))).map((r) => r.name).sort();
    expect(names).toEqual(["From a script", "From our page", "Guarded"]);
  });

  it("refuses a JSON body sent as text/plain (what a cross-site form can send) with 415", async () => {
    const { ws, base } = await setup();
    for (const ct of ["text/plain", "application/x-www-form-urlencoded", "application/json; charset=latin1"]) {
      const r = await call(invitesRoute.POST, `${base}/invites`, {
        params: { ws: ws.slug },
        headers: { "content-type": ct },
        body: JSON.stringify({ email: "new-owner@example.test", role: "owner" }),
      });
      expect(r.status, ct).toBe(415);
      expect(r.body.error.code).toBe("unsupported_media_type");
      expect(r.body.error.message).toContain("application/json");
    }
    const ok = await call(facilitiesRoute.POST, `${base}/facilities`, {
      params: { ws: ws.slug },
      headers: { "content-type": "application/json; charset=UTF-8" },
      body: JSON.stringify({ name: "Charset given", site: SITE }),
    });
    expect(ok.status).toBe(201);
    const [n] = await db.select({ n: count() }).from(invites).where(eq(invites.workspaceId, ws.id));
    expect(n.n).toBe(0);
  });

  it("next-auth's POST (sign-in, sign-out) refuses a foreign Origin too", async () => {
    const res = await nextAuthRoute.POST(
      new Request(`${OWN}/api/auth/callback/credentials`, {
        method: "POST",
        headers: { origin: "http://localhost:1", "content-type": "application/x-www-form-urlencoded" },
        body: "email=a%40b.test&password=xxxxxxxxxx",
      }) as never,
    );
    expect(res.status).toBe(403);
    expect((await res.json()).error.message).toContain("another site");
    expect(nextAuth.reached).toBe(0);
    const own = await nextAuthRoute.POST(new Request(`${OWN}/api/auth/signout`, { method: "POST", headers: { origin: OWN } }) as never);
    expect(own.status).toBe(200);
    expect(nextAuth.reached).toBe(1);
  });
});

describe("bounded input", () => {
  it("refuses a JSON body over 1 MB with 413 naming the limit, declared or chunked; the chunked one is not read to its end", async () => {
    const { ws, base } = await setup();
    const big = await call(facilitiesRoute.POST, `${base}/facilities`, { params: { ws: ws.slug }, json: { name: "x", site: SITE, pad: "y".repeat(1_100_000) } });
    expect(big.status).toBe(413);
    expect(big.body.error.code).toBe("payload_too_large");
    expect(big.body.error.message).toContain("at most 1 MB");

    const { stream, state } = endless(new Uint8Array(64 * 1024).fill(0x20));
    const chunked = await call(facilitiesRoute.POST, `${base}/facilities`, { params: { ws: ws.slug }, headers: { "content-type": "application/json" }, body: stream });
    expect(chunked.status).toBe(413);
    // Refused once past the limit: at most the limit plus a chunk or two of read-ahead was pulled.
    expect(state.pulled).toBeLessThan(1024 * 1024 + 4 * 64 * 1024);
  });

  it("model documents may be larger (4 MB) but a 10 MB one is refused before it is parsed", async () => {
    const { ws, f, base } = await setup();
    const r = await call(modelRoute.PUT, `${base}/facilities/${f.id}/model`, {
      method: "PUT",
      params: { ws: ws.slug, id: f.id },
      json: { baseVersion: 1, doc: { ...demo, junk: "z".repeat(10 * 1024 * 1024) } },
    });
    expect(r.status).toBe(413);
    expect(r.body.error.message).toContain("at most 4 MB");
    expect((await loadFacilityModel(ws.id, f.id)).version).toBe(1);
  });

  it("caps uploads while streaming: a chunked site plan or import without a length is refused past its limit", async () => {
    const { ws, f, base } = await setup();
    const bg = endless(new Uint8Array(256 * 1024).fill(0xff));
    const r = await call(backgroundRoute.PUT, `${base}/facilities/${f.id}/layout/background`, { method: "PUT", params: { ws: ws.slug, id: f.id }, headers: { "content-type": "application/octet-stream" }, body: bg.stream });
    expect(r.status).toBe(413);
    expect(r.body.error.message).toContain("at most 5 MB");
    expect(bg.state.pulled).toBeLessThan(5 * 1024 * 1024 + 4 * 256 * 1024);
    expect(await db.select().from(facilityLayouts).where(eq(facilityLayouts.facilityId, f.id))).toEqual([]);

    const imp = endless(new TextEncoder().encode("Name,Length\r\n" + "Room,10\r\n".repeat(8000)));
    const r2 = await call(importRoomsRoute.POST, `${base}/facilities/${f.id}/import/rooms`, {
      params: { ws: ws.slug, id: f.id },
      headers: { "content-type": "multipart/form-data; boundary=xyz" },
      body: imp.stream,
    });
    expect(r2.status).toBe(413);
    expect(r2.body.error.message).toMatch(/at most 2\.1 MB/);
    expect(imp.state.pulled).toBeLessThan(3 * 1024 * 1024);
  });

  it("refuses an unknown key in a model (naming it) and in other bodies; the model is not stored", async () => {
    const { ws, f, base } = await setup();
    const rooms = (demo.rooms as Record<string, unknown>[]).map((r, i) => (i === 1 ? { ...r, colour: "blue" } : r));
    const inRoom = await call(modelRoute.PUT, `${base}/facilities/${f.id}/model`, { method: "PUT", params: { ws: ws.slug, id: f.id }, json: { baseVersion: 1, doc: { ...demo, rooms } } });
    expect(inRoom.status).toBe(400);
    expect(inRoom.body.error.field).toBe("model.rooms.1.colour");
    expect(inRoom.body.error.message).toContain('unknown key "colour"');
    const top = await call(modelRoute.PUT, `${base}/facilities/${f.id}/model`, { method: "PUT", params: { ws: ws.slug, id: f.id }, json: { baseVersion: 1, doc: { ...demo, extra: "x".repeat(1000) } } });
    expect(top.status).toBe(400);
    expect(top.body.error.field).toBe("model.extra");
    expect((await loadFacilityModel(ws.id, f.id)).version).toBe(1);
    // The demo document itself (with its "$comment") is accepted.
    const ok = await call(modelRoute.PUT, `${base}/facilities/${f.id}/model`, { method: "PUT", params: { ws: ws.slug, id: f.id }, json: { baseVersion: 1, doc: demo } });
    expect(ok.status).toBe(200);

    const other = await call(facilitiesRoute.POST, `${base}/facilities`, { params: { ws: ws.slug }, json: { name: "Extra key", site: { ...SITE, altitude: 3 } } });
    expect(other.status).toBe(400);
    expect(other.body.error.field).toBe("site.altitude");
  });
});

describe("bad input answers 4xx naming the field, never 500", () => {
  it("a NUL character in a text field, a path segment or a query value", async () => {
    const { ws, f, base } = await setup();
    const field = await call(facilityRoute.PATCH, `${base}/facilities/${f.id}`, { method: "PATCH", params: { ws: ws.slug, id: f.id }, json: { name: "Cold\u0000store" } });
    expect(field.status).toBe(400);
    expect(field.body.error.field).toBe("name");
    expect(field.body.error.message).toContain("NUL");
    const seg = await call(facilityRoute.GET, `${base}/facilities/${f.id}`, { method: "GET", params: { ws: `${ws.slug}\u0000`, id: f.id } });
    expect(seg.status).toBe(400);
    expect(seg.body.error.field).toBe("ws");
    const q = await call(auditRoute.GET, `${base}/audit`, { method: "GET", params: { ws: ws.slug }, query: "?limit=5%00" });
    expect(q.status).toBe(400);
    expect(q.body.error.field).toBe("limit");
    const [row] = await db.select({ name: facilities.name }).from(facilities).where(eq(facilities.id, f.id));
    expect(row.name).toBe("Guarded");
    // Pages look the workspace up through authorize() too: a NUL in the address is "not found".
    await expect(authorize(session.user!.id, `${ws.slug}\u0000`, "facility.read")).rejects.toMatchObject({ code: "not_found" });
  });

  it("a revision number or base version beyond PostgreSQL's integer range", async () => {
    const { ws, f, base } = await setup();
    const rev = await call(issueRoute.POST, `${base}/facilities/${f.id}/revisions/99999999999/issue`, {
      params: { ws: ws.slug, id: f.id, n: "99999999999" },
      json: { letter: "A", status: "for comment", checkedBy: "Checker" },
    });
    expect(rev.status).toBe(400);
    expect(rev.body.error.field).toBe("n");
    expect(rev.body.error.message).toContain("2147483647");
    const bv = await call(modelRoute.PUT, `${base}/facilities/${f.id}/model`, { method: "PUT", params: { ws: ws.slug, id: f.id }, json: { baseVersion: 2 ** 31, doc: demo } });
    expect(bv.status).toBe(400);
    expect(bv.body.error.field).toBe("baseVersion");
    const before = await call(auditRoute.GET, `${base}/audit`, { method: "GET", params: { ws: ws.slug }, query: "?before=1e300" });
    expect(before.status).toBe(400);
    expect(before.body.error.field).toBe("before");
  });

  it("a model document nested thousands of levels deep, and numbers that are not finite", async () => {
    const { ws, f, base } = await setup();
    const deep = "[".repeat(5000) + "]".repeat(5000);
    const raw = `{"baseVersion":1,"doc":{"schemaVersion":1,"rooms":${deep},"doors":[]}}`;
    const r = await call(modelRoute.PUT, `${base}/facilities/${f.id}/model`, { method: "PUT", params: { ws: ws.slug, id: f.id }, headers: { "content-type": "application/json" }, body: raw });
    expect(r.status).toBe(400);
    expect(r.body.error.message).toContain("nested too deeply");
    expect(r.body.error.field).toMatch(/^doc\.rooms(\.0)+$/);
    const inf = await call(modelRoute.PUT, `${base}/facilities/${f.id}/model`, { method: "PUT", params: { ws: ws.slug, id: f.id }, headers: { "content-type": "application/json" }, body: '{"baseVersion":1e999,"doc":{}}' });
    expect(inf.status).toBe(400);
    expect(inf.body.error.field).toBe("baseVersion");
    expect((await loadFacilityModel(ws.id, f.id)).version).toBe(1);
  });
});

describe("parallel requests: one winner, clear 409s", () => {
  it("ten parallel issues of one revision: exactly one succeeds, nine get 409", async () => {
    const { ws, f, base, owner } = await setup();
    await saveFacilityModel({ workspaceId: ws.id, facilityId: f.id, userId: owner.id, baseVersion: 1, doc: demo });
    // A warm pool, as on a running server: ten open connections, so the requests really overlap.
    await Promise.all(Array.from({ length: 10 }, () => db.execute(sql`select pg_sleep(0.05)`)));
    const results = await Promise.all(
      Array.from({ length: 10 }, (_, i) =>
        call(issueRoute.POST, `${base}/facilities/${f.id}/revisions/2/issue`, {
          params: { ws: ws.slug, id: f.id, n: "2" },
          json: { letter: String.fromCharCode(65 + i), status: "for comment", checkedBy: "Checker" },
        }),
      ),
    );
    const statuses = results.map((r) => r.status).sort();
    expect(statuses).toEqual([200, ...Array(9).fill(409)]);
    for (const r of results.filter((x) => x.status === 409)) expect(r.body.error.message).toMatch(/already issued/);
    const issued = await db.select().from(facilityRevisions).where(and(eq(facilityRevisions.facilityId, f.id), eq(facilityRevisions.number, 2)));
    expect(issued[0].issuedLetter).toBe(results.find((r) => r.status === 200)!.body.revision.issuedLetter);
    const [a] = await db.select({ n: count() }).from(auditLog).where(and(eq(auditLog.targetId, f.id), eq(auditLog.action, "revision.issued")));
    expect(a.n).toBe(1);
  });

  it("five parallel accepts of one invitation: one joins, four get 409, one account and one membership", async () => {
    const { ws } = await setup();
    const { token, hash } = newToken();
    const email = `joiner-${Date.now()}@example.test`;
    const [owner] = await db.select().from(memberships).where(eq(memberships.workspaceId, ws.id));
    await db.insert(invites).values({ workspaceId: ws.id, email, role: "owner", tokenHash: hash, invitedBy: owner.userId, expiresAt: new Date(Date.now() + 86_400_000) });
    session.user = null;
    const results = await Promise.all(
      Array.from({ length: 5 }, () => call(acceptRoute.POST, "/api/v1/invites/accept", { json: { token, name: "Joiner", password: "a-long-password-1" } })),
    );
    expect(results.map((r) => r.status).sort()).toEqual([200, 409, 409, 409, 409]);
    for (const r of results.filter((x) => x.status === 409)) expect(r.body.error.message).toContain("already accepted");
    const accounts = await db.select().from(users).where(eq(users.email, email));
    expect(accounts).toHaveLength(1);
    const [m] = await db.select({ n: count() }).from(memberships).where(and(eq(memberships.workspaceId, ws.id), eq(memberships.userId, accounts[0].id)));
    expect(m.n).toBe(1);
    const [a] = await db.select({ n: count() }).from(auditLog).where(and(eq(auditLog.workspaceId, ws.id), eq(auditLog.action, "member.joined")));
    expect(a.n).toBe(1);
  });

  it("parallel applications of one stocking check write one version and one audit row", async () => {
    const { ws, f, base, owner } = await setup();
    const { $comment, ...installed } = read("lib/engine/stocking/fixtures/harrowfield-installed.json");
    void $comment;
    await saveFacilityModel({ workspaceId: ws.id, facilityId: f.id, userId: owner.id, baseVersion: 1, doc: { ...demo, plant: { ...(demo.plant ?? {}), installed } } as ModelDoc });
    const s = await createScenario(ws.id, f.id, owner.id, { name: "more apples", changes: scenarioChangesSchema.parse({ rooms: [{ roomId: "apples", tonnesPerDay: 17 }] }) });
    await acceptScenario(ws.id, f.id, s.id);
    const before = (await loadFacilityModel(ws.id, f.id)).version;
    const results = await Promise.all(
      Array.from({ length: 5 }, () => call(applyRoute.POST, `${base}/facilities/${f.id}/scenarios/${s.id}/apply`, { params: { ws: ws.slug, id: f.id, sid: s.id } })),
    );
    expect(results.map((r) => r.status).sort()).toEqual([200, 409, 409, 409, 409]);
    for (const r of results.filter((x) => x.status === 409)) expect(r.body.error.message).toContain("already applied");
    expect((await loadFacilityModel(ws.id, f.id)).version).toBe(before + 1);
    const [a] = await db.select({ n: count() }).from(auditLog).where(and(eq(auditLog.targetId, s.id), eq(auditLog.action, "scenario.applied")));
    expect(a.n).toBe(1);
    const [row] = await db.select().from(scenarios).where(eq(scenarios.id, s.id));
    expect(row.appliedRevision).toBe(before + 1);
  });
});
