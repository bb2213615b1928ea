import { afterAll, afterEach, describe, expect, it } from "vitest";
import { readFileSync } from "node:fs";
import path from "node:path";
import { eq, sql } from "drizzle-orm";
import ExcelJS from "exceljs";
import { db } from "@/db/client";
import { exportsLog, jobs } from "@/db/schema";
import { enqueue, queueName, stopSender } from "@/lib/jobs/queue";
import { startWorker, type JobContext, type JobHandler, type WorkerHandle } from "@/lib/jobs/worker";
import { JOB_HANDLERS } from "@/features/jobs/handlers";
import { createFacility } from "@/features/facilities/queries";
import { saveFacilityModel } from "@/features/facilities/model";
import type { ModelDoc } from "@/features/facilities/engine-model";
import { enqueueImport } from "@/features/import/job";
import { addMember, makeUser, makeWorkspace } from "../factories";

/** The job queue against the real database: retries with backoff, restarts, one run per job. */

const running: WorkerHandle[] = [];
async function worker(handlers: Record<string, JobHandler>, concurrency = 1) {
  const w = await startWorker({ handlers, concurrency, pollSeconds: 0.5 });
  running.push(w);
  return w;
}
afterEach(async () => {
  while (running.length) await running.pop()!.stop();
});
afterAll(async () => {
  await stopSender();
});

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

async function waitFor(id: string, statuses: string[], timeoutMs = 30_000) {
  const until = Date.now() + timeoutMs;
  for (;;) {
    const [row] = await db.select().from(jobs).where(eq(jobs.id, id));
    if (row && statuses.includes(row.status)) return row;
    if (Date.now() > until) throw new Error(`job ${id} is ${row?.status} (${row?.stage}), not ${statuses.join("/")}, after ${timeoutMs} ms`);
    await sleep(100);
  }
}

/** Waits until every pg-boss delivery of our job is in `state` (pg-boss records completion just after our row). */
async function bossSettled(id: string, state: string) {
  let rows = await bossJob(id);
  for (let i = 0; i < 100 && !(rows.length && rows.every((d) => d.state === state)); i++) {
    await sleep(100);
    rows = await bossJob(id);
  }
  return rows;
}

/** The pg-boss side of our job (its state and retry count), found by the id in its data. */
async function bossJob(id: string) {
  const r = await db.execute<{ state: string; retry_count: number; completed_on: string }>(sql`select state, retry_count, completed_on from pgboss.job where data->>'jobId' = ${id}`);
  return r.rows;
}

describe("job queue", () => {
  it("retries a failing job with growing delays and ends failed with its reason after the retry limit", async () => {
    const starts: number[] = [];
    const seenErrors: (string | null)[] = [];
    const { job } = await enqueue({ kind: "test.always-fails", input: {}, options: { retryLimit: 2, retryDelay: 1, retryBackoff: true, expireInSeconds: 30 } });
    await worker({
      "test.always-fails": async (ctx: JobContext) => {
        starts.push(Date.now());
        seenErrors.push(ctx.job.error);
        throw new Error("the relay refused the connection");
      },
    });
    const row = await waitFor(job.id, ["failed"], 40_000);
    expect(starts).toHaveLength(3);
    expect(row.attempts).toBe(3);
    expect(row.error).toBe("It failed after 3 attempts: the relay refused the connection");
    expect(row.finishedAt).not.toBeNull();
    // While it waited for a retry, the row said why the last attempt failed.
    expect(seenErrors).toEqual([null, "the relay refused the connection", "the relay refused the connection"]);
    // Backoff: delay × 2^n × (1…2) with delay 1 s → the first wait ≥ 1 s, the second ≥ 2 s.
    expect(starts[1] - starts[0]).toBeGreaterThanOrEqual(950);
    expect(starts[2] - starts[1]).toBeGreaterThanOrEqual(1950);
    expect(await bossSettled(job.id, "failed")).toMatchObject([{ state: "failed", retry_count: 2 }]);
  });

  it("a job that fails once is retried and done; a refusal in words (AppError) fails at once without retry", async () => {
    let calls = 0;
    const { AppError } = await import("@/lib/errors");
    const flaky = await enqueue({ kind: "test.fails-once", options: { retryLimit: 3, retryDelay: 1, retryBackoff: false, expireInSeconds: 30 } });
    const refused = await enqueue({ kind: "test.refused", options: { retryLimit: 3, retryDelay: 1, retryBackoff: false, expireInSeconds: 30 } });
    let refusals = 0;
    await worker({
      "test.fails-once": async (ctx) => {
        calls++;
        if (ctx.attempt === 1) throw new Error("timeout");
        await ctx.progress(0.5, "Halfway");
        return { json: { ok: true }, stage: "All done" };
      },
      "test.refused": async () => {
        refusals++;
        throw new AppError("validation", "Row 3 · Intake: must be a number of t/day from 0 to 500.", "file");
      },
    });
    const done = await waitFor(flaky.job.id, ["done"]);
    expect(calls).toBe(2);
    expect(done).toMatchObject({ attempts: 2, progress: 1, stage: "All done", error: null, resultJson: { ok: true } });
    const failed = await waitFor(refused.job.id, ["failed"]);
    expect(refusals).toBe(1);
    expect(failed.error).toBe("Row 3 · Intake: must be a number of t/day from 0 to 500.");
  });

  it("a job queued while no worker runs is kept in the database and done once a worker starts (it survives a restart)", async () => {
    const { job } = await enqueue({ kind: "test.later", input: { n: 41 }, options: { retryLimit: 1, retryDelay: 1, retryBackoff: false, expireInSeconds: 30 } });
    // The app's queue connection goes away (a restart): the job is only in PostgreSQL now.
    await stopSender();
    await sleep(1500);
    const [queued] = await db.select().from(jobs).where(eq(jobs.id, job.id));
    expect(queued.status).toBe("queued");
    expect(queued.stage).toBe("Waiting for a worker");
    expect(await bossJob(job.id)).toMatchObject([{ state: "created" }]);
    await worker({ "test.later": async (ctx) => ({ json: { answer: (ctx.job.input.n as number) + 1 } }) });
    const row = await waitFor(job.id, ["done"]);
    expect(row.resultJson).toEqual({ answer: 42 });
    expect(await bossSettled(job.id, "completed")).toMatchObject([{ state: "completed" }]);
  });

  it("two workers share the jobs and never run the same job twice, even when a job is delivered twice", async () => {
    const runs: { id: string; worker: string; start: number; end: number }[] = [];
    const handler = (name: string): JobHandler => async (ctx) => {
      const start = Date.now();
      await sleep(ctx.job.input.slow ? 4000 : 150);
      runs.push({ id: ctx.job.id, worker: name, start, end: Date.now() });
    };
    await worker({ "test.exclusive": handler("A") }, 2);
    await worker({ "test.exclusive": handler("B") }, 2);
    const opts = { retryLimit: 3, retryDelay: 1, retryBackoff: false, expireInSeconds: 30 };
    const ids = (await Promise.all(Array.from({ length: 12 }, () => enqueue({ kind: "test.exclusive", options: opts })))).map((r) => r.job.id);
    // A duplicate delivery of one job (as after an expiry while it still runs): a second pg-boss
    // job pointing at the same row, sent while the first is in hand.
    const { job: slow } = await enqueue({ kind: "test.exclusive", input: { slow: true }, options: opts });
    await waitFor(slow.id, ["running"]);
    const { newBoss } = await import("@/lib/jobs/queue");
    const extra = newBoss({ supervise: false });
    await extra.start();
    await extra.send(queueName("test.exclusive"), { jobId: slow.id }, { retryLimit: 3, retryDelay: 1 });
    await extra.stop({ graceful: false });
    for (const id of [...ids, slow.id]) await waitFor(id, ["done"]);
    // The duplicate was fetched by another worker loop while the first ran and ended without
    // running (the row was claimed and alive): it completed before the job itself finished.
    const deliveries = await bossSettled(slow.id, "completed");
    expect(deliveries.map((d) => d.state)).toEqual(["completed", "completed"]);
    const [finished] = await db.select({ at: jobs.finishedAt }).from(jobs).where(eq(jobs.id, slow.id));
    const completedOn = deliveries.map((d) => new Date(d.completed_on).getTime()).sort();
    expect(completedOn[0]).toBeLessThan(finished.at!.getTime());
    const perJob = new Map<string, number>();
    for (const r of runs) perJob.set(r.id, (perJob.get(r.id) ?? 0) + 1);
    expect(perJob.size).toBe(13);
    expect([...perJob.values()].every((n) => n === 1)).toBe(true);
    expect(new Set(runs.map((r) => r.worker))).toEqual(new Set(["A", "B"]));
    const [row] = await db.select().from(jobs).where(eq(jobs.id, slow.id));
    expect(row).toMatchObject({ status: "done", attempts: 1 });
  });

  it("a backlog is worked through one job after another, not one job per polling interval", async () => {
    const opts = { retryLimit: 0, retryDelay: 1, retryBackoff: false, expireInSeconds: 30 };
    const ids: string[] = [];
    for (let i = 0; i < 20; i++) ids.push((await enqueue({ kind: "test.backlog", options: opts })).job.id);
    const t0 = Date.now();
    // One loop, polling every 2 s, no wake-up: waiting a poll per job would take about 40 s.
    const w = await startWorker({ handlers: { "test.backlog": async () => undefined }, concurrency: 1, pollSeconds: 2, listen: false });
    running.push(w);
    for (const id of ids) await waitFor(id, ["done"]);
    expect(Date.now() - t0).toBeLessThan(8_000);
  });

  it("a new job wakes an idle worker at once, also after its wake-up connection was cut and came back", async () => {
    const opts = { retryLimit: 0, retryDelay: 1, retryBackoff: false, expireInSeconds: 30 };
    // Polling every 30 s: a pickup within 3 s can only come from the wake-up.
    const w = await startWorker({ handlers: { "test.wake": async () => undefined }, concurrency: 1, pollSeconds: 30 });
    running.push(w);
    await sleep(300);
    let t0 = Date.now();
    const first = await enqueue({ kind: "test.wake", options: opts });
    await waitFor(first.job.id, ["done"], 3_000);
    expect(Date.now() - t0).toBeLessThan(3_000);
    const cut = await db.execute<{ n: number }>(
      sql`select count(pg_terminate_backend(pid))::int as n from pg_stat_activity where application_name = 'rimeplan-worker-listen' and datname = current_database()`,
    );
    expect(cut.rows[0].n).toBeGreaterThanOrEqual(1);
    await sleep(6_500); // the listener reconnects after 5 s
    t0 = Date.now();
    const second = await enqueue({ kind: "test.wake", options: opts });
    await waitFor(second.job.id, ["done"], 3_000);
    expect(Date.now() - t0).toBeLessThan(3_000);
  });

  it("the same export asked for twice while queued is one job; another format or person is another", async () => {
    const ws = await makeWorkspace();
    const u = await makeUser();
    const f = await createFacility(ws.id, u.id, { name: "Dedupe", site: { designDryBulbC: 30, coincidentWetBulbC: 21, groundTempC: 10, elevationM: 100 } });
    const ask = (format: string, user = u.id) =>
      enqueue({ kind: "schedule.export", workspaceId: ws.id, facilityId: f.id, createdBy: user, input: { format }, dedupeKey: `${f.id}:${user}:${format}` });
    const [a, b] = await Promise.all([ask("xlsx"), ask("xlsx")]);
    expect(a.job.id).toBe(b.job.id);
    expect([a.reused, b.reused].sort()).toEqual([false, true]);
    const c = await ask("csv");
    expect(c.job.id).not.toBe(a.job.id);
    const other = await makeUser();
    expect((await ask("xlsx", other.id)).job.id).not.toBe(a.job.id);
  });
});

describe("jobs of the app", () => {
  const read = (p: string) => JSON.parse(readFileSync(path.resolve(import.meta.dirname, "../..", p), "utf8"));

  it("an Excel export runs on the worker with its stages, records the export, and keeps the workbook as the result", async () => {
    const ws = await makeWorkspace();
    const u = await makeUser("Pat Purchaser");
    await addMember(ws.id, u.id, "purchaser");
    const f = await createFacility(ws.id, u.id, { name: "Export job", site: { designDryBulbC: 32, coincidentWetBulbC: 23, groundTempC: 12, elevationM: 150 } });
    await saveFacilityModel({ workspaceId: ws.id, facilityId: f.id, userId: u.id, baseVersion: 1, doc: read("seeds/data/harrowfield-model.json") as ModelDoc, summary: "demo" });
    const stages: string[] = [];
    const { job } = await enqueue({ kind: "schedule.export", workspaceId: ws.id, facilityId: f.id, createdBy: u.id, input: { format: "xlsx" } });
    await worker({
      "schedule.export": async (ctx) => JOB_HANDLERS["schedule.export"]({ ...ctx, progress: async (p, s) => (stages.push(s), ctx.progress(p, s)) }),
    });
    const row = await waitFor(job.id, ["done"], 60_000);
    expect(stages[0]).toMatch(/Computing room loads/);
    expect(stages).toContain("Recording the export");
    expect(stages.some((s) => /Writing the workbook: \d+ items on 5 sheets/.test(s))).toBe(true);
    expect(row.resultName).toMatch(/^export-job-schedule-v2\.xlsx$/);
    const wb = new ExcelJS.Workbook();
    await wb.xlsx.load(row.resultBytes as unknown as ArrayBuffer);
    expect(wb.worksheets).toHaveLength(5);
    expect(row.stage).toMatch(/the export is recorded/);
    const logged = await db.select().from(exportsLog).where(eq(exportsLog.facilityId, f.id));
    expect(logged).toMatchObject([{ kind: "schedule.xlsx", actorId: u.id, revisionNumber: 2 }]);
  });

  it("a job is seen only in its own workspace, by the roles that may do its work; e-mail jobs never", async () => {
    const { jobFor } = await import("@/features/jobs/queries");
    const a = await makeWorkspace();
    const b = await makeWorkspace();
    const u = await makeUser();
    const f = await createFacility(a.id, u.id, { name: "Scoped", site: { designDryBulbC: 30, coincidentWetBulbC: 21, groundTempC: 10, elevationM: 100 } });
    const { job } = await enqueue({ kind: "schedule.export", workspaceId: a.id, facilityId: f.id, createdBy: u.id, input: { format: "csv" } });
    const access = (w: typeof a, role: "owner" | "purchaser" | "viewer" | "operations") => ({ workspace: { id: w.id, slug: w.slug, name: w.name }, role });
    expect((await jobFor(access(a, "purchaser"), job.id, false)).id).toBe(job.id);
    await expect(jobFor(access(b, "owner"), job.id, false)).rejects.toMatchObject({ code: "not_found" });
    await expect(jobFor(access(a, "viewer"), job.id, false)).rejects.toMatchObject({ code: "forbidden" });
    await expect(jobFor(access(a, "operations"), job.id, false)).rejects.toMatchObject({ code: "forbidden" });
    const mail = await enqueue({ kind: "mail.send", workspaceId: a.id, input: { to: "x@example.test", subject: "s", text: "t" } });
    await expect(jobFor(access(a, "owner"), mail.job.id, false)).rejects.toMatchObject({ code: "not_found" });
  });

  it("sendMail only queues the mail; the worker delivers it to the relay and forgets the link", async () => {
    const { sendMail } = await import("@/lib/mail");
    const { readdirSync, readFileSync: read } = await import("node:fs");
    const to = `queued-${Date.now()}@example.test`;
    await sendMail({ to, subject: "Queued sign-in link", text: "Sign in: http://localhost:3000/signin/link?token=not-a-real-token" });
    const [row] = await db.select().from(jobs).where(sql`${jobs.kind} = 'mail.send' and ${jobs.input}->>'to' = ${to}`);
    expect(row).toMatchObject({ status: "queued", stage: "Waiting to be sent" });
    await worker({ "mail.send": JOB_HANDLERS["mail.send"] });
    const done = await waitFor(row.id, ["done"]);
    expect(done).toMatchObject({ stage: "Sent", input: {} });
    const dir = process.env.MAIL_CATCHER_DIR!;
    let caught: { to: string[]; subject: string } | undefined;
    for (let i = 0; i < 50 && !caught; i++) {
      caught = readdirSync(dir)
        .filter((f) => f.endsWith(".json"))
        .map((f) => JSON.parse(read(path.join(dir, f), "utf8")))
        .find((m) => m.to.includes(to));
      if (!caught) await sleep(100);
    }
    expect(caught?.subject).toBe("Queued sign-in link");
  });

  it("an export whose requester lost the right fails with the reason; a bad import fails naming the rows and changes nothing", async () => {
    const ws = await makeWorkspace();
    const u = await makeUser();
    await addMember(ws.id, u.id, "viewer");
    const f = await createFacility(ws.id, u.id, { name: "Refusals", site: { designDryBulbC: 30, coincidentWetBulbC: 21, groundTempC: 10, elevationM: 100 } });
    const exp = await enqueue({ kind: "schedule.export", workspaceId: ws.id, facilityId: f.id, createdBy: u.id, input: { format: "csv" } });
    const bad = "Name;Length [m];Width [m];Height [m];Set point [°C]\nCold 1;-4;10;6;2\n";
    const imp = await enqueueImport({ kind: "rooms", workspaceId: ws.id, facilityId: f.id, userId: u.id, upload: { buf: Buffer.from(bad), fileName: "rooms.csv", mode: "commit", name: null } });
    await worker({ "schedule.export": JOB_HANDLERS["schedule.export"], "import.rooms": JOB_HANDLERS["import.rooms"] });
    const e = await waitFor(exp.job.id, ["done", "failed"]);
    expect(e).toMatchObject({ status: "failed", attempts: 1, error: "The person who asked for this export may no longer export the equipment schedule." });
    const i = await waitFor(imp.id, ["done", "failed"]);
    expect(i.status).toBe("failed");
    expect(i.error).toMatch(/problem.* in the file; nothing was imported/);
    expect((i.resultJson as { fields: { field: string }[] }).fields[0].field).toMatch(/^row 2 · /);
    expect(i.inputBytes).toBeNull();
    const { loadFacilityModel } = await import("@/features/facilities/model");
    expect((await loadFacilityModel(ws.id, f.id)).version).toBe(1);
  });
});
