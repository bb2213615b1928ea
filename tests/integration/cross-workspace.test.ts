/**
 * Cross-workspace access by id. Two workspaces, each with a facility (model, revisions, layout,
 * site plan, installed plant, stocking check), an export job with a file, a pending invitation
 * and a second member. The owner of workspace A — who may do everything in A — sends every
 * route that takes an id with workspace B's ids, under A's slug and under B's slug, and with A's
 * facility but B's stocking check: every answer must be 404 with nothing of B in it, and
 * nothing stored in either workspace may change. Route handlers run in-process with a real
 * database and a mocked session (as in fuzz.test.ts).
 */
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { readFileSync } from "node:fs";
import path from "node:path";
import { eq, getTableName, sql, type Table } from "drizzle-orm";
import { db } from "@/db/client";
import { annualResults, auditLog, exportsLog, facilities, facilityLayouts, facilityRevisions, invites, jobs, memberships, scenarios, weatherYears, workspaces } from "@/db/schema";
import { storeWeather } from "@/features/energy/weather";
import { env } from "@/lib/env";
import type { CurrentUser } from "@/lib/session";
import { enqueue, stopSender } from "@/lib/jobs/queue";
import { createFacility } from "@/features/facilities/queries";
import { saveFacilityModel } from "@/features/facilities/model";
import type { ModelDoc } from "@/features/facilities/engine-model";
import { putBackground, putLayout } from "@/features/layout-canvas/queries";
import { acceptScenario, createScenario } from "@/features/stocking-check/queries";
import { createInvite } from "@/features/team/queries";
import { scenarioChangesSchema } from "@/lib/engine/stocking";
import { addMember, makeUser, makeWorkspace, SITE } from "../factories";

const session = vi.hoisted(() => ({ user: null as CurrentUser | null }));
vi.mock("@/lib/session", () => ({ currentUser: async () => session.user, requireUser: async () => session.user }));

import * as facilitiesRoute from "@/app/api/v1/workspaces/[ws]/facilities/route";
import * as facilityRoute from "@/app/api/v1/workspaces/[ws]/facilities/[id]/route";
import * as archiveRoute from "@/app/api/v1/workspaces/[ws]/facilities/[id]/archive/route";
import * as duplicateRoute from "@/app/api/v1/workspaces/[ws]/facilities/[id]/duplicate/route";
import * as exportsRoute from "@/app/api/v1/workspaces/[ws]/facilities/[id]/exports/route";
import * as importRoomsRoute from "@/app/api/v1/workspaces/[ws]/facilities/[id]/import/rooms/route";
import * as importStockingRoute from "@/app/api/v1/workspaces/[ws]/facilities/[id]/import/stocking/route";
import * as installedRoute from "@/app/api/v1/workspaces/[ws]/facilities/[id]/installed/route";
import * as backgroundRoute from "@/app/api/v1/workspaces/[ws]/facilities/[id]/layout/background/route";
import * as layoutRoute from "@/app/api/v1/workspaces/[ws]/facilities/[id]/layout/route";
import * as modelRoute from "@/app/api/v1/workspaces/[ws]/facilities/[id]/model/route";
import * as resultsRoute from "@/app/api/v1/workspaces/[ws]/facilities/[id]/results/route";
import * as issueRoute from "@/app/api/v1/workspaces/[ws]/facilities/[id]/revisions/[n]/issue/route";
import * as restoreRoute from "@/app/api/v1/workspaces/[ws]/facilities/[id]/revisions/[n]/restore/route";
import * as revisionsRoute from "@/app/api/v1/workspaces/[ws]/facilities/[id]/revisions/route";
import * as scenarioAcceptRoute from "@/app/api/v1/workspaces/[ws]/facilities/[id]/scenarios/[sid]/accept/route";
import * as scenarioApplyRoute from "@/app/api/v1/workspaces/[ws]/facilities/[id]/scenarios/[sid]/apply/route";
import * as scenarioEmailRoute from "@/app/api/v1/workspaces/[ws]/facilities/[id]/scenarios/[sid]/email/route";
import * as scenarioRoute from "@/app/api/v1/workspaces/[ws]/facilities/[id]/scenarios/[sid]/route";
import * as scenariosRoute from "@/app/api/v1/workspaces/[ws]/facilities/[id]/scenarios/route";
import * as scheduleRoute from "@/app/api/v1/workspaces/[ws]/facilities/[id]/schedule/route";
import * as inviteRoute from "@/app/api/v1/workspaces/[ws]/invites/[inviteId]/route";
import * as invitesRoute from "@/app/api/v1/workspaces/[ws]/invites/route";
import * as jobResultRoute from "@/app/api/v1/workspaces/[ws]/jobs/[id]/result/route";
import * as jobRoute from "@/app/api/v1/workspaces/[ws]/jobs/[id]/route";
import * as memberRoute from "@/app/api/v1/workspaces/[ws]/members/[userId]/route";
import * as membersRoute from "@/app/api/v1/workspaces/[ws]/members/route";
import * as auditRoute from "@/app/api/v1/workspaces/[ws]/audit/route";
import * as optionsRoute from "@/app/api/v1/workspaces/[ws]/facilities/[id]/options/route";
import * as optionRoute from "@/app/api/v1/workspaces/[ws]/facilities/[id]/options/[oid]/route";
import * as optionDesignRoute from "@/app/api/v1/workspaces/[ws]/facilities/[id]/options/[oid]/design/route";
import * as settingsRoute from "@/app/api/v1/workspaces/[ws]/settings/route";
import * as weatherRoute from "@/app/api/v1/workspaces/[ws]/facilities/[id]/weather/route";
import * as energyRoute from "@/app/api/v1/workspaces/[ws]/facilities/[id]/energy/route";

const read = (p: string) => JSON.parse(readFileSync(path.resolve(import.meta.dirname, "../..", p), "utf8"));
const demo = read("seeds/data/harrowfield-model.json") as ModelDoc;
const { $comment: _c, ...installed } = read("lib/engine/stocking/fixtures/harrowfield-installed.json");
void _c;
const OWN = new URL(env.APP_URL).origin;
const PNG = new Uint8Array([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0, 0, 13, 0x49, 0x48, 0x44, 0x52]);

type Handler = (req: Request, ctx: { params: Promise<Record<string, string>> }) => Promise<Response>;
type Body = { json: unknown } | { raw: Uint8Array; type: string } | { form: () => FormData };

interface Side {
  slug: string;
  wsId: string;
  owner: CurrentUser;
  facility: string;
  scenario: string;
  /** A plant option of the facility (its id lives in the model document). */
  option: string;
  job: string;
  invite: string;
  member: string;
  /** Strings that only this workspace's data holds: none may appear in an answer to the other's owner. */
  secrets: string[];
}
let A: Side;
let B: Side;

async function makeSide(tag: string): Promise<Side> {
  const ws = await makeWorkspace(`Workspace ${tag}`);
  const owner = await makeUser(`Owner ${tag}`);
  await addMember(ws.id, owner.id, "owner");
  const member = await makeUser(`Member ${tag}`);
  await addMember(ws.id, member.id, "designer");
  const name = `Secret facility ${tag} ${ws.slug}`;
  const f = await createFacility(ws.id, owner.id, { name, site: SITE });
  const option = `opt-${tag.toLowerCase()}`;
  const plant = { ...(demo.plant ?? {}), installed };
  await saveFacilityModel({
    workspaceId: ws.id,
    facilityId: f.id,
    userId: owner.id,
    baseVersion: 1,
    doc: { ...demo, plant, plantOptions: [{ id: option, name: `Secret option ${tag}`, plant }] } as ModelDoc,
    summary: "demo",
  });
  await putLayout(f.id, { positions: { "room:apples": { x: 10, y: 20 } }, viewport: { x: 0, y: 0, zoom: 1 } });
  await putBackground(f.id, PNG);
  const s = await createScenario(ws.id, f.id, owner.id, { name: `Secret check ${tag}`, changes: scenarioChangesSchema.parse({ rooms: [{ roomId: "apples", tonnesPerDay: 10 }] }) });
  await acceptScenario(ws.id, f.id, s.id);
  const { job } = await enqueue({ kind: "schedule.export", workspaceId: ws.id, facilityId: f.id, createdBy: owner.id, input: { format: "csv" } });
  // Finished with a file, as the worker leaves it (no worker runs in this test).
  await db.update(jobs).set({ status: "done", progress: 1, finishedAt: new Date(), resultName: `secret-${tag}.csv`, resultMime: "text/csv", resultBytes: Buffer.from(`secret file ${tag}`) }).where(eq(jobs.id, job.id));
  await storeWeather(ws.id, f.id, owner, { kind: "file", label: `Secret weather ${tag}`, year: 2025, startWeekday: 2, dryBulbC: Array(8760).fill(10), rhPct: Array(8760).fill(70), notes: [] });
  const { invite } = await createInvite(ws.id, owner.id, `invitee-${tag.toLowerCase()}-${ws.slug}@example.test`, "viewer");
  return {
    slug: ws.slug,
    wsId: ws.id,
    owner: { id: owner.id, email: owner.email, name: owner.name, unitSystem: "SI", theme: "system", sessionId: `cross-${tag}` },
    facility: f.id,
    scenario: s.id,
    option,
    job: job.id,
    invite: invite.id,
    member: member.id,
    secrets: [name, `Secret weather ${tag}`, `Secret check ${tag}`, `Secret option ${tag}`, `secret-${tag}.csv`, `secret file ${tag}`, member.email, `invitee-${tag.toLowerCase()}`],
  };
}

/** Everything stored for both workspaces, as one digest per table. */
async function fingerprint(): Promise<Record<string, string>> {
  const ws = [A.wsId, B.wsId];
  const inWs = sql.join(ws.map((w) => sql`${w}::uuid`), sql`, `);
  const fac = sql`(select id from ${facilities} where workspace_id in (${inWs}))`;
  const q = async (table: Table, where: ReturnType<typeof sql>) => {
    const r = await db.execute(sql`select count(*)::int as n, coalesce(md5(string_agg(t::text, '|' order by t::text)), '') as h from ${sql.identifier(getTableName(table))} t where ${where}`);
    const row = r.rows[0] as { n: number; h: string };
    return `${row.n}:${row.h}`;
  };
  return {
    facilities: await q(facilities, sql`workspace_id in (${inWs})`),
    revisions: await q(facilityRevisions, sql`facility_id in ${fac}`),
    layouts: await q(facilityLayouts, sql`facility_id in ${fac}`),
    scenarios: await q(scenarios, sql`workspace_id in (${inWs})`),
    exports: await q(exportsLog, sql`facility_id in ${fac}`),
    jobs: await q(jobs, sql`workspace_id in (${inWs}) or facility_id in ${fac}`),
    memberships: await q(memberships, sql`workspace_id in (${inWs})`),
    invites: await q(invites, sql`workspace_id in (${inWs})`),
    audit: await q(auditLog, sql`workspace_id in (${inWs})`),
    workspaces: await q(workspaces, sql`id in (${inWs})`),
    weather: await q(weatherYears, sql`workspace_id in (${inWs}) or facility_id in ${fac}`),
    annual: await q(annualResults, sql`workspace_id in (${inWs}) or facility_id in ${fac}`),
  };
}

interface Case {
  name: string;
  mod: Record<string, unknown>;
  method: string;
  /** The route's path parameters given the workspace slug and the side whose ids are used. */
  params: (slug: string, ids: Side) => Record<string, string>;
  body?: (ids: Side) => Body;
}

const fac = (slug: string, s: Side) => ({ ws: slug, id: s.facility });
const sce = (slug: string, s: Side) => ({ ws: slug, id: s.facility, sid: s.scenario });
const rev = (slug: string, s: Side) => ({ ws: slug, id: s.facility, n: "2" });
const opt = (slug: string, s: Side) => ({ ws: slug, id: s.facility, oid: s.option });
const csvForm = (text: string, mode: "preview" | "commit") => () => {
  const f = new FormData();
  f.set("file", new File([text], "plan.csv", { type: "text/csv" }));
  f.set("mode", mode);
  return f;
};
const ROOMS_CSV = "Name,Length [m],Width [m],Height [m],Set point [°C],Construction\nNew chiller,20,10,8,4,PIR 120\n";
const STOCKING_CSV = "Room;Intake [t/day];Entering [°C]\napples;12,5;18\n";
const WEATHER_CSV = ["Hour,Dry bulb [°C],Relative humidity [%]", ...Array.from({ length: 8760 }, (_, i) => `${i + 1},12.5,70`)].join("\n");
const weatherForm = () => {
  const f = new FormData();
  f.set("file", new File([WEATHER_CSV], "year.csv", { type: "text/csv" }));
  return f;
};
const MONTHLY = { year: 2025, climate: { label: "Stranger's climate", meanDryBulbC: Array(12).fill(10), dailyRangeK: Array(12).fill(8), meanRhPct: Array(12).fill(75) } };

/** Every route that names a resource of a workspace by id, each method (bodies valid, so only the ids can refuse). */
const CASES: Case[] = [
  { name: "facility GET", mod: facilityRoute, method: "GET", params: fac },
  { name: "facility PATCH", mod: facilityRoute, method: "PATCH", params: fac, body: () => ({ json: { name: "Renamed by a stranger" } }) },
  { name: "facility archive", mod: archiveRoute, method: "POST", params: fac, body: () => ({ json: { archived: true } }) },
  { name: "facility duplicate", mod: duplicateRoute, method: "POST", params: fac, body: () => ({ json: { name: "Copied by a stranger" } }) },
  { name: "model GET", mod: modelRoute, method: "GET", params: fac },
  { name: "model PUT", mod: modelRoute, method: "PUT", params: fac, body: () => ({ json: { baseVersion: 2, doc: demo, summary: "stranger" } }) },
  { name: "results GET", mod: resultsRoute, method: "GET", params: fac },
  { name: "revisions GET", mod: revisionsRoute, method: "GET", params: fac },
  { name: "revision issue", mod: issueRoute, method: "POST", params: rev, body: () => ({ json: { letter: "A", status: "for comment", checkedBy: "Stranger" } }) },
  { name: "revision restore", mod: restoreRoute, method: "POST", params: rev },
  { name: "layout GET", mod: layoutRoute, method: "GET", params: fac },
  { name: "layout PUT", mod: layoutRoute, method: "PUT", params: fac, body: () => ({ json: { positions: { "room:apples": { x: 99, y: 99 } } } }) },
  { name: "background GET", mod: backgroundRoute, method: "GET", params: fac },
  { name: "background PUT", mod: backgroundRoute, method: "PUT", params: fac, body: () => ({ raw: PNG, type: "image/png" }) },
  { name: "background DELETE", mod: backgroundRoute, method: "DELETE", params: fac },
  { name: "installed GET", mod: installedRoute, method: "GET", params: fac },
  { name: "installed PUT", mod: installedRoute, method: "PUT", params: fac, body: () => ({ json: { baseVersion: 2, installed } }) },
  { name: "schedule GET", mod: scheduleRoute, method: "GET", params: fac },
  { name: "export start", mod: exportsRoute, method: "POST", params: fac, body: () => ({ json: { format: "csv" } }) },
  { name: "import rooms preview", mod: importRoomsRoute, method: "POST", params: fac, body: () => ({ form: csvForm(ROOMS_CSV, "preview") }) },
  { name: "import rooms commit", mod: importRoomsRoute, method: "POST", params: fac, body: () => ({ form: csvForm(ROOMS_CSV, "commit") }) },
  { name: "import stocking preview", mod: importStockingRoute, method: "POST", params: fac, body: () => ({ form: csvForm(STOCKING_CSV, "preview") }) },
  { name: "import stocking commit", mod: importStockingRoute, method: "POST", params: fac, body: () => ({ form: csvForm(STOCKING_CSV, "commit") }) },
  { name: "scenarios GET", mod: scenariosRoute, method: "GET", params: fac },
  { name: "scenarios POST", mod: scenariosRoute, method: "POST", params: fac, body: () => ({ json: { name: "Stranger's check", changes: { rooms: [{ roomId: "apples", tonnesPerDay: 5 }] } } }) },
  { name: "scenario GET", mod: scenarioRoute, method: "GET", params: sce },
  { name: "scenario accept", mod: scenarioAcceptRoute, method: "POST", params: sce },
  { name: "scenario apply", mod: scenarioApplyRoute, method: "POST", params: sce },
  { name: "scenario email", mod: scenarioEmailRoute, method: "POST", params: sce, body: () => ({ json: { to: ["stranger@example.test"] } }) },
  { name: "weather GET", mod: weatherRoute, method: "GET", params: fac },
  { name: "weather upload", mod: weatherRoute, method: "POST", params: fac, body: () => ({ form: weatherForm }) },
  { name: "weather monthly", mod: weatherRoute, method: "PUT", params: fac, body: () => ({ json: MONTHLY }) },
  { name: "energy GET", mod: energyRoute, method: "GET", params: fac },
  { name: "energy run", mod: energyRoute, method: "POST", params: fac },
  { name: "job GET", mod: jobRoute, method: "GET", params: (slug, s) => ({ ws: slug, id: s.job }) },
  { name: "job result GET", mod: jobResultRoute, method: "GET", params: (slug, s) => ({ ws: slug, id: s.job }) },
  { name: "invite DELETE", mod: inviteRoute, method: "DELETE", params: (slug, s) => ({ ws: slug, inviteId: s.invite }) },
  { name: "member PATCH", mod: memberRoute, method: "PATCH", params: (slug, s) => ({ ws: slug, userId: s.member }), body: () => ({ json: { role: "viewer" } }) },
  { name: "member DELETE", mod: memberRoute, method: "DELETE", params: (slug, s) => ({ ws: slug, userId: s.member }) },
  { name: "options GET", mod: optionsRoute, method: "GET", params: fac },
  { name: "options POST", mod: optionsRoute, method: "POST", params: fac, body: () => ({ json: { name: "Stranger's option" } }) },
  { name: "options PATCH", mod: optionsRoute, method: "PATCH", params: fac, body: () => ({ json: { years: 20 } }) },
  { name: "option PATCH", mod: optionRoute, method: "PATCH", params: opt, body: () => ({ json: { name: "Renamed by a stranger", leakPctPerYear: 50 } }) },
  { name: "option make design", mod: optionDesignRoute, method: "POST", params: opt },
  { name: "option DELETE", mod: optionRoute, method: "DELETE", params: opt },
];

/** Routes of a workspace without an id: only the slug names the workspace. */
const WS_CASES: Case[] = [
  { name: "facilities GET", mod: facilitiesRoute, method: "GET", params: (slug) => ({ ws: slug }) },
  { name: "facilities POST", mod: facilitiesRoute, method: "POST", params: (slug) => ({ ws: slug }), body: () => ({ json: { name: "Made by a stranger", site: SITE } }) },
  { name: "members GET", mod: membersRoute, method: "GET", params: (slug) => ({ ws: slug }) },
  { name: "invites POST", mod: invitesRoute, method: "POST", params: (slug) => ({ ws: slug }), body: () => ({ json: { email: "stranger-friend@example.test", role: "owner" } }) },
  { name: "audit GET", mod: auditRoute, method: "GET", params: (slug) => ({ ws: slug }) },
  { name: "settings GET", mod: settingsRoute, method: "GET", params: (slug) => ({ ws: slug }) },
  { name: "settings PATCH", mod: settingsRoute, method: "PATCH", params: (slug) => ({ ws: slug }), body: () => ({ json: { currency: "JPY" } }) },
];

async function send(c: Case, params: Record<string, string>, ids: Side): Promise<{ status: number; text: string }> {
  const headers: Record<string, string> = {};
  const init: RequestInit = { method: c.method, headers };
  const b = c.body?.(ids);
  if (b && "json" in b) {
    init.body = JSON.stringify(b.json);
    headers["content-type"] = "application/json";
  } else if (b && "raw" in b) {
    init.body = b.raw as BodyInit;
    headers["content-type"] = b.type;
  } else if (b && "form" in b) init.body = b.form();
  const handler = c.mod[c.method] as Handler;
  expect(handler, `${c.name}: the module exports ${c.method}`).toBeTypeOf("function");
  const res = await handler(new Request(`${OWN}/cross/${c.name.replace(/ /g, "-")}`, init), { params: Promise.resolve(params) });
  return { status: res.status, text: await res.text() };
}

function expectNotFound(what: string, r: { status: number; text: string }) {
  expect(r.status, `${what}: ${r.text.slice(0, 300)}`).toBe(404);
  expect(JSON.parse(r.text).error.code, what).toBe("not_found");
  for (const s of B.secrets) expect(r.text, `${what} must not show B's data`).not.toContain(s);
}

beforeAll(async () => {
  A = await makeSide("A");
  B = await makeSide("B");
});

afterAll(async () => {
  session.user = null;
  await stopSender();
});

describe("a member of one workspace cannot reach another workspace's resources by id", () => {
  it("every route with an id answers 404 to B's ids under A's slug and under B's slug, and to A's facility with B's stocking check; nothing changes", async () => {
    const before = await fingerprint();
    session.user = A.owner;
    const answers: string[] = [];
    for (const c of CASES) {
      const underA = await send(c, c.params(A.slug, B), B);
      expectNotFound(`${c.name} with B's ids under A's slug`, underA);
      const underB = await send(c, c.params(B.slug, B), B);
      expectNotFound(`${c.name} with B's ids under B's slug`, underB);
      answers.push(`${c.name}: ${underA.status}/${underB.status}`);
    }
    for (const c of CASES.filter((x) => x.params === sce)) {
      // A's own facility, B's stocking check: the check is not found in A's facility either.
      const mixed = await send(c, { ws: A.slug, id: A.facility, sid: B.scenario }, B);
      expectNotFound(`${c.name} with A's facility and B's check`, mixed);
    }
    for (const c of CASES.filter((x) => x.params === opt)) {
      // A's own facility, B's option id: the option is not found in A's facility either.
      const mixed = await send(c, { ws: A.slug, id: A.facility, oid: B.option }, B);
      expectNotFound(`${c.name} with A's facility and B's option`, mixed);
    }
    for (const c of WS_CASES) expectNotFound(`${c.name} under B's slug`, await send(c, c.params(B.slug, B), B));
    expect(await fingerprint()).toEqual(before);
    expect(answers).toHaveLength(CASES.length);
  });

  it("the same requests reach the resources for B's own owner (so the ids and bodies above are real)", async () => {
    session.user = B.owner;
    // Reads first, then changes, so each finds what it needs; each must be a success.
    const order = [...CASES.filter((c) => c.method === "GET"), ...CASES.filter((c) => c.method !== "GET")];
    const skip = new Set(["member DELETE", "background DELETE"]); // run last, below
    for (const c of order.filter((x) => !skip.has(x.name))) {
      const r = await send(c, c.params(B.slug, B), B);
      expect(r.status, `${c.name} as B's owner: ${r.text.slice(0, 300)}`).toBeLessThan(300);
    }
    for (const name of skip) {
      const c = CASES.find((x) => x.name === name)!;
      const r = await send(c, c.params(B.slug, B), B);
      expect(r.status, `${c.name} as B's owner: ${r.text.slice(0, 300)}`).toBeLessThan(300);
    }
    // And A's owner still sees A's own things under A's slug.
    session.user = A.owner;
    for (const c of CASES.filter((x) => x.method === "GET")) {
      const r = await send(c, c.params(A.slug, A), A);
      expect(r.status, `${c.name} as A's owner on A: ${r.text.slice(0, 300)}`).toBe(200);
    }
  });
});
