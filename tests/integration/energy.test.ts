/**
 * Weather years, the workspace currency, the operation section and the annual run, against a
 * real database: an uploaded file is stored only when every row is right (a gap, text in a
 * number, RH over 100 % or 8000 rows store nothing and queue nothing), a year from monthly
 * means is labelled an approximation, the run is stored with its stamps and re-used while they
 * match, and a model edit makes the stored figures stale and queues the year again. Route
 * handlers run in-process with a mocked session (as in cross-workspace.test.ts).
 */
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { readFileSync } from "node:fs";
import path from "node:path";
import { and, count, eq } from "drizzle-orm";
import { db } from "@/db/client";
import { annualResults, facilityRevisions, jobs, weatherYears } from "@/db/schema";
import { env } from "@/lib/env";
import type { CurrentUser } from "@/lib/session";
import { stopSender } from "@/lib/jobs/queue";
import { ANNUAL_ENGINE_VERSION } from "@/lib/engine/annual";
import { createFacility } from "@/features/facilities/queries";
import { inputHashOf, loadFacilityModel, saveFacilityModel } from "@/features/facilities/model";
import type { ModelDoc } from "@/features/facilities/engine-model";
import { runAnnualJob } from "@/features/energy/job";
import { HARROWFIELD_CLIMATE, inventYear, yearToCsv } from "@/seeds/invented-weather";
import { addMember, makeUser, makeWorkspace, SITE } from "../factories";

const session = vi.hoisted(() => ({ user: null as CurrentUser | null }));
vi.mock("@/lib/session", () => ({ currentUser: async () => session.user, requireUser: async () => session.user }));

import * as weatherRoute from "@/app/api/v1/workspaces/[ws]/facilities/[id]/weather/route";
import * as energyRoute from "@/app/api/v1/workspaces/[ws]/facilities/[id]/energy/route";
import * as modelRoute from "@/app/api/v1/workspaces/[ws]/facilities/[id]/model/route";
import * as settingsRoute from "@/app/api/v1/workspaces/[ws]/settings/route";

const OWN = new URL(env.APP_URL).origin;
const demo = JSON.parse(readFileSync(path.resolve(import.meta.dirname, "../../seeds/data/harrowfield-model.json"), "utf8")) as ModelDoc;
const CSV = yearToCsv(inventYear(HARROWFIELD_CLIMATE, { year: 2025, seed: 3 }));
const LINES = CSV.trimEnd().split("\n");

type Handler = (req: Request, ctx: { params: Promise<Record<string, string>> }) => Promise<Response>;
let slug: string;
let wsId: string;
let facilityId: string;
let owner: CurrentUser;
let designer: CurrentUser;
let viewer: CurrentUser;

const asUser = (u: { id: string; email: string; name: string | null }, tag: string): CurrentUser => ({ id: u.id, email: u.email, name: u.name ?? tag, unitSystem: "SI", theme: "system", sessionId: `energy-${tag}` });

async function call(mod: Record<string, unknown>, method: string, who: CurrentUser, params: Record<string, string>, body?: { json: unknown } | { form: FormData }) {
  session.user = who;
  const init: RequestInit = { method, headers: {} };
  if (body && "json" in body) {
    init.body = JSON.stringify(body.json);
    (init.headers as Record<string, string>)["content-type"] = "application/json";
  } else if (body) init.body = body.form;
  const res = await (mod[method] as Handler)(new Request(`${OWN}/energy-test`, init), { params: Promise.resolve(params) });
  const text = await res.text();
  return { status: res.status, body: text ? JSON.parse(text) : null };
}

const fileForm = (text: string, name = "year.csv") => {
  const f = new FormData();
  f.set("file", new File([text], name, { type: "text/csv" }));
  return f;
};
const fac = () => ({ ws: slug, id: facilityId });
const stored = async () => (await db.select({ n: count() }).from(weatherYears).where(eq(weatherYears.facilityId, facilityId)))[0].n;
const energyJobs = async () => (await db.select({ n: count() }).from(jobs).where(and(eq(jobs.facilityId, facilityId), eq(jobs.kind, "energy.annual"))))[0].n;

beforeAll(async () => {
  const ws = await makeWorkspace("Energy workspace");
  slug = ws.slug;
  wsId = ws.id;
  const o = await makeUser("Energy owner");
  const d = await makeUser("Energy designer");
  const v = await makeUser("Energy viewer");
  await addMember(ws.id, o.id, "owner");
  await addMember(ws.id, d.id, "designer");
  await addMember(ws.id, v.id, "viewer");
  owner = asUser(o, "owner");
  designer = asUser(d, "designer");
  viewer = asUser(v, "viewer");
  const f = await createFacility(ws.id, o.id, { name: "Energy facility", site: SITE });
  facilityId = f.id;
  await saveFacilityModel({ workspaceId: ws.id, facilityId, userId: o.id, baseVersion: 1, doc: demo, summary: "demo model" });
});

afterAll(async () => {
  session.user = null;
  await stopSender();
});

describe("weather files: stored whole or not at all", () => {
  it("refuses a gap, text in a number, RH over 100 % and a year of 8000 rows, naming row and column; nothing is stored or queued", async () => {
    const cases: { text: string; field: string; message: RegExp }[] = [
      { text: [...LINES.slice(0, 300), ...LINES.slice(302)].join("\n"), field: "row 301 · Timestamp", message: /2 hour\(s\) missing \(a gap\)/ },
      { text: LINES.map((l, i) => (i === 40 ? l.replace(/,([^,]+),/, ",1O.5,") : l)).join("\n"), field: "row 41 · Dry bulb [°C]", message: /"1O\.5" is not a number/ },
      { text: LINES.map((l, i) => (i === 4000 ? l.replace(/,[^,]+$/, ",100.5") : l)).join("\n"), field: "row 4001 · Relative humidity [%]", message: /over 100 %/ },
      { text: LINES.slice(0, 8001).join("\n"), field: "row 8001 · Timestamp", message: /8000 hourly rows/ },
    ];
    for (const c of cases) {
      const r = await call(weatherRoute, "POST", designer, fac(), { form: fileForm(c.text) });
      expect(r.status, JSON.stringify(r.body).slice(0, 300)).toBe(400);
      expect(r.body.error.code).toBe("validation");
      expect(r.body.error.message).toMatch(/nothing was stored/);
      const hit = r.body.error.fields.find((f: { field: string }) => f.field === c.field);
      expect(hit, `${c.field} in ${JSON.stringify(r.body.error.fields.slice(0, 3))}`).toBeTruthy();
      expect(hit.message).toMatch(c.message);
    }
    expect(await stored()).toBe(0);
    expect(await energyJobs()).toBe(0);
  });

  it("refuses a file that is too large while it arrives (413) and a viewer's upload (403)", async () => {
    const big = "x".repeat(4 * 1024 * 1024 + 70 * 1024);
    expect((await call(weatherRoute, "POST", designer, fac(), { form: fileForm(big) })).status).toBe(413);
    expect((await call(weatherRoute, "POST", viewer, fac(), { form: fileForm(CSV) })).status).toBe(403);
    expect(await stored()).toBe(0);
  });

  it("stores a valid year with its source, and queues the year's run", async () => {
    const r = await call(weatherRoute, "POST", designer, fac(), { form: fileForm(CSV, "invented-2025.csv") });
    expect(r.status, JSON.stringify(r.body).slice(0, 300)).toBe(201);
    expect(r.body.weather).toMatchObject({ kind: "file", label: "invented-2025.csv (hourly CSV, 2025)", year: 2025, hours: 8760, startWeekday: 2 });
    expect(r.body.weather.summary.months).toHaveLength(12);
    expect(r.body.job).toMatchObject({ kind: "energy.annual", status: "queued" });
    const [row] = await db.select().from(weatherYears).where(eq(weatherYears.facilityId, facilityId));
    expect(row.dryBulbC).toHaveLength(8760);
    expect(row.dryBulbC[10]).toBe(Number(LINES[11].split(",")[1]));
    // the viewer reads it
    const g = await call(weatherRoute, "GET", viewer, fac());
    expect(g.status).toBe(200);
    expect(g.body.weather.id).toBe(row.id);
    expect(g.body.weather.dryBulbC).toBeUndefined();
  });

  it("builds a year from monthly means, labelled an approximation; a month out of range is named and nothing stored", async () => {
    const before = await stored();
    const bad = await call(weatherRoute, "PUT", designer, fac(), {
      json: { year: 2025, climate: { label: "Test climate", meanDryBulbC: Array(12).fill(8), dailyRangeK: Array(12).fill(7), meanRhPct: [80, 80, 120, 80, 80, 80, 80, 80, 80, 80, 80, 80] } },
    });
    expect(bad.status).toBe(400);
    expect(bad.body.error.field).toBe("climate.meanRhPct.2");
    expect(bad.body.error.message).toMatch(/between 1 and 100 %/);
    expect(await stored()).toBe(before);
    const ok = await call(weatherRoute, "PUT", designer, fac(), { json: { year: 2024, climate: { label: "Test climate", meanDryBulbC: HARROWFIELD_CLIMATE.map((m) => m.meanDryBulbC), dailyRangeK: HARROWFIELD_CLIMATE.map((m) => m.dailyRangeK), meanRhPct: HARROWFIELD_CLIMATE.map((m) => m.meanRhPct) } } });
    expect(ok.status, JSON.stringify(ok.body).slice(0, 300)).toBe(200);
    expect(ok.body.weather).toMatchObject({ kind: "monthly", year: 2024, hours: 8784, startWeekday: 0 });
    expect(ok.body.weather.label).toMatch(/Test climate — sine-day year 2024 from monthly means \(an approximation\)/);
    // each month's mean dry bulb is the input (the sine-day method keeps it)
    ok.body.weather.summary.months.forEach((m: { meanDryBulbC: number }, i: number) => expect(m.meanDryBulbC).toBeCloseTo(HARROWFIELD_CLIMATE[i].meanDryBulbC, 1));
  });
});

describe("the annual run", () => {
  it("stores the year with its stamps, re-uses it while they match, and a model edit makes it stale and queues the year again", async () => {
    const [job] = await db.select().from(jobs).where(and(eq(jobs.facilityId, facilityId), eq(jobs.kind, "energy.annual"))).limit(1);
    const stages: string[] = [];
    const ctx = { job, attempt: 1, progress: async (_p: number, s: string) => void stages.push(s) };
    const out = await runAnnualJob(ctx);
    expect(out.json).toMatchObject({ reused: false });
    expect(stages.some((s) => /Running 8784 hours/.test(s))).toBe(true);
    const m = await loadFacilityModel(wsId, facilityId);
    const rows = await db.select().from(annualResults).where(eq(annualResults.facilityId, facilityId));
    expect(rows).toHaveLength(1);
    const weather = (await db.select().from(weatherYears).where(eq(weatherYears.facilityId, facilityId))).sort((a, b) => +b.createdAt - +a.createdAt)[0];
    expect(rows[0]).toMatchObject({ modelVersion: m.version, inputHash: inputHashOf(m.engineModel()), weatherId: weather.id, engineVersion: ANNUAL_ENGINE_VERSION });
    const annual = rows[0].result as { facility: { kWh: number; monthly: unknown[] } };
    expect(annual.facility.kWh).toBeGreaterThan(0);
    expect(annual.facility.monthly).toHaveLength(12);

    // the same stamps: nothing new stored
    expect((await runAnnualJob(ctx)).json).toMatchObject({ reused: true, resultId: rows[0].id });
    expect(await db.select({ n: count() }).from(annualResults).where(eq(annualResults.facilityId, facilityId))).toEqual([{ n: 1 }]);

    // a viewer reads it, not stale
    const v = await call(energyRoute, "GET", viewer, fac());
    expect(v.status).toBe(200);
    expect(v.body).toMatchObject({ stale: [], canRun: false, currency: "EUR", result: { id: rows[0].id, weather: { id: weather.id } } });
    expect(v.body.result.annual.facility.kWh).toBeCloseTo(annual.facility.kWh, 6);

    // an edit through the model route: stale, and the year is queued for the new version
    const jobsBefore = await energyJobs();
    const cur = await call(modelRoute, "GET", designer, fac());
    const put = await call(modelRoute, "PUT", designer, fac(), { json: { baseVersion: cur.body.version, doc: { ...cur.body.doc, operation: { tariff: { kind: "flat", pricePerKWh: 0.2, demandChargePerKWMonth: 10 } } }, summary: "tariff" } });
    expect(put.status, JSON.stringify(put.body).slice(0, 300)).toBe(200);
    expect(await energyJobs()).toBe(jobsBefore + 1);
    const after = await call(energyRoute, "GET", viewer, fac());
    expect(after.body.stale).toEqual([`the model changed since version ${m.version}`]);
    expect(after.body.job).toMatchObject({ kind: "energy.annual", status: "queued" });

    // the run for the new version prices the year with the tariff
    const [next] = await db.select().from(jobs).where(eq(jobs.id, after.body.job.id));
    expect((await runAnnualJob({ job: next, attempt: 1, progress: async () => undefined })).json).toMatchObject({ reused: false });
    const priced = await call(energyRoute, "GET", viewer, fac());
    expect(priced.body.stale).toEqual([]);
    const f = priced.body.result.annual.facility;
    // energy charge = 0.2 per kWh × the year's kWh (flat tariff)
    expect(f.cost.energy).toBeCloseTo(0.2 * f.kWh, 3);
    expect(f.cost.demand).toBeGreaterThan(0);
  });

  it("a designer asks for a run (202, the same job while queued); a viewer may not (403); without weather it says what to do", async () => {
    const a = await call(energyRoute, "POST", designer, fac());
    expect(a.status).toBe(202);
    const b = await call(energyRoute, "POST", owner, fac());
    expect(b.status).toBe(202);
    expect(b.body.job.id).toBe(a.body.job.id);
    expect(b.body.reused).toBe(false);
    expect((await call(energyRoute, "POST", viewer, fac())).status).toBe(403);
    const other = await createFacility(wsId, owner.id, { name: "No weather", site: SITE });
    const none = await call(energyRoute, "POST", designer, { ws: slug, id: other.id });
    expect(none.status).toBe(400);
    expect(none.body.error).toMatchObject({ field: "weather", message: expect.stringMatching(/no weather year yet/) });
  });
});

describe("operation section and currency", () => {
  it("a tariff out of range is refused naming the field and range, and no revision is written", async () => {
    const revs = async () => (await db.select({ n: count() }).from(facilityRevisions).where(eq(facilityRevisions.facilityId, facilityId)))[0].n;
    const before = await revs();
    const cur = await call(modelRoute, "GET", designer, fac());
    const r = await call(modelRoute, "PUT", designer, fac(), { json: { baseVersion: cur.body.version, doc: { ...cur.body.doc, operation: { tariff: { kind: "flat", pricePerKWh: 500 } } } } });
    expect(r.status).toBe(400);
    expect(r.body.error.field).toBe("model.operation.tariff.pricePerKWh");
    expect(r.body.error.message).toMatch(/must be between 0 and 100/);
    const cond = await call(modelRoute, "PUT", designer, fac(), { json: { baseVersion: cur.body.version, doc: { ...cur.body.doc, operation: { circuits: { lt: { minCondensingC: 80 } } } } } });
    expect(cond.status).toBe(400);
    expect(cond.body.error.field).toBe("model.operation.circuits.lt.minCondensingC");
    expect(cond.body.error.message).toMatch(/between -10 and 50 °C/);
    expect(await revs()).toBe(before);
  });

  it("the owner sets the workspace currency (ISO 4217, named when wrong); others read it and may not change it", async () => {
    const ws = { ws: slug };
    expect((await call(settingsRoute, "PATCH", owner, ws, { json: { currency: "gbp" } })).body).toEqual({ settings: { currency: "GBP" } });
    const bad = await call(settingsRoute, "PATCH", owner, ws, { json: { currency: "XQZ" } });
    expect(bad.status).toBe(400);
    expect(bad.body.error).toMatchObject({ field: "currency", message: expect.stringMatching(/ISO 4217/) });
    expect((await call(settingsRoute, "PATCH", designer, ws, { json: { currency: "USD" } })).status).toBe(403);
    expect((await call(settingsRoute, "GET", viewer, ws)).body).toEqual({ settings: { currency: "GBP" }, canEdit: false });
    expect((await call(energyRoute, "GET", viewer, fac())).body.currency).toBe("GBP");
  });
});
