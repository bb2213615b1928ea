import "server-only";
import type PgBoss from "pg-boss";
import { Client } from "pg";
import { and, eq, lt, or, sql } from "drizzle-orm";
import { db } from "@/db/client";
import { jobs } from "@/db/schema";
import { AppError, type FieldError } from "../errors";
import { env } from "../env";
import { log } from "../log";
import { ensureQueue, kindOptions, newBoss, queueName, WAKE_CHANNEL, type JobRow } from "./queue";

export interface JobContext {
  job: JobRow;
  /** 1 for the first attempt. */
  attempt: number;
  /** Reports how far the job is (0…1) and what it is doing, in words the user reads. */
  progress(fraction: number, stage: string): Promise<void>;
}

export interface JobOutput {
  json?: Record<string, unknown>;
  file?: { name: string; mime: string; bytes: Buffer };
  /** The last stage shown (default "Done"). */
  stage?: string;
}

export type JobHandler = (ctx: JobContext) => Promise<JobOutput | void>;

/** A running attempt touches its row this often; a row untouched for STALE_MS is not running any more. */
const HEARTBEAT_MS = 10_000;
const STALE_MS = 45_000;

/**
 * Errors that will not go away by trying again (the file is wrong, the facility is gone, the
 * user lost the right): the job fails at once with the message. Anything else is retried.
 */
function isPermanent(e: unknown): e is AppError {
  return e instanceof AppError && !["internal", "unavailable"].includes(e.code);
}

function words(e: unknown): string {
  const m = e instanceof Error ? e.message : String(e);
  return m.length > 500 ? `${m.slice(0, 500)}…` : m;
}

async function patch(id: string, values: Partial<typeof jobs.$inferInsert>) {
  await db.update(jobs).set({ ...values, updatedAt: new Date() }).where(eq(jobs.id, id));
}

/**
 * Runs one pg-boss job against its `jobs` row: claims the row (so a second delivery of the
 * same job cannot run beside a live one), runs the handler with a heartbeat, and records the
 * outcome. Throwing hands the attempt back to pg-boss, which retries it with backoff.
 */
async function runOne(kind: string, handler: JobHandler, bossJob: PgBoss.JobWithMetadata<{ jobId: string }>): Promise<void> {
  const id = bossJob.data?.jobId;
  if (!id) return;
  const stale = new Date(Date.now() - STALE_MS);
  const [row] = await db
    .update(jobs)
    .set({ status: "running", attempts: sql`${jobs.attempts} + 1`, startedAt: sql`coalesce(${jobs.startedAt}, now())`, stage: "Starting", updatedAt: new Date() })
    .where(and(eq(jobs.id, id), or(eq(jobs.status, "queued"), and(eq(jobs.status, "running"), lt(jobs.updatedAt, stale)))))
    .returning();
  if (!row) {
    // Finished, deleted, or running elsewhere with a live heartbeat (a second delivery, as after
    // an expiry while the first attempt still works): the run in hand owns the row, so this
    // delivery ends without running. If that run dies, its heartbeat stops; the row is then
    // taken by pg-boss's next retry of it, or marked failed by the cleanup below.
    log("info", "job delivered while finished or running elsewhere; not run again", { kind, jobId: id });
    return;
  }
  const beat = setInterval(() => {
    patch(id, {}).catch(() => undefined);
  }, HEARTBEAT_MS);
  const attempt = bossJob.retryCount + 1;
  try {
    const out = (await handler({
      job: row,
      attempt,
      progress: (fraction, stage) => patch(id, { progress: Math.max(0, Math.min(1, fraction)), stage }),
    })) ?? {};
    await patch(id, {
      status: "done",
      progress: 1,
      stage: out.stage ?? "Done",
      error: null,
      finishedAt: new Date(),
      resultJson: out.json ?? null,
      resultName: out.file?.name ?? null,
      resultMime: out.file?.mime ?? null,
      resultBytes: out.file?.bytes ?? null,
      inputBytes: null,
      ...(kindOptions(kind, {}).clearInputWhenDone ? { input: {} } : {}),
    });
    log("info", "job done", { kind, jobId: id, attempt });
  } catch (e) {
    if (isPermanent(e)) {
      const fields: FieldError[] | undefined = e.fieldErrors;
      await patch(id, { status: "failed", stage: "Failed", error: e.message, finishedAt: new Date(), resultJson: fields?.length ? { fields } : null, inputBytes: null, ...(kindOptions(kind, {}).clearInputWhenDone ? { input: {} } : {}) });
      log("warn", "job refused", { kind, jobId: id, attempt, error: e.message });
      return;
    }
    const last = bossJob.retryCount >= bossJob.retryLimit;
    log(last ? "error" : "warn", last ? "job failed" : "job attempt failed", { kind, jobId: id, attempt, error: words(e), stack: (e as Error)?.stack });
    if (last) {
      const tries = attempt === 1 ? "" : ` after ${attempt} attempts`;
      await patch(id, { status: "failed", stage: "Failed", error: `It failed${tries}: ${words(e)}`, finishedAt: new Date(), inputBytes: null, ...(kindOptions(kind, {}).clearInputWhenDone ? { input: {} } : {}) });
    } else {
      await patch(id, { status: "queued", stage: `Attempt ${attempt} failed (${words(e)}); trying again shortly`, error: words(e) });
    }
    throw e;
  } finally {
    clearInterval(beat);
  }
}

export interface WorkerHandle {
  boss: PgBoss;
  stop(): Promise<void>;
}

/**
 * Starts a worker: one pg-boss instance that supervises the queue (retries, expiry, archive)
 * and runs every kind in `handlers`, `concurrency` jobs of a kind at a time. Several workers
 * (processes or instances in one process) may run side by side: each job goes to one of them.
 */
export async function startWorker(opts: { handlers: Record<string, JobHandler>; concurrency?: number; pollSeconds?: number; listen?: boolean }): Promise<WorkerHandle> {
  const boss = newBoss({ supervise: true, max: 4 });
  await boss.start();
  try {
    return await run(boss, opts);
  } catch (e) {
    await boss.stop({ graceful: false }).catch(() => undefined);
    throw e;
  }
}

async function run(boss: PgBoss, opts: { handlers: Record<string, JobHandler>; concurrency?: number; pollSeconds?: number; listen?: boolean }): Promise<WorkerHandle> {
  const byQueue = new Map<string, string[]>();
  const concurrency = opts.concurrency ?? env.JOBS_CONCURRENCY;
  for (const [kind, handler] of Object.entries(opts.handlers)) {
    await ensureQueue(boss, kind);
    const ids: string[] = [];
    for (let i = 0; i < concurrency; i++) {
      let self = "";
      self = await boss.work<{ jobId: string }>(
        queueName(kind),
        { includeMetadata: true, batchSize: 1, pollingIntervalSeconds: opts.pollSeconds ?? env.JOBS_POLL_SECONDS },
        async ([job]) => {
          try {
            await runOne(kind, handler, job);
          } finally {
            // pg-boss waits a polling interval after each job; with a backlog, fetch the next at once.
            boss.notifyWorker(self);
          }
        },
      );
      ids.push(self);
    }
    byQueue.set(queueName(kind), ids);
  }

  // A new job wakes its workers at once instead of at their next poll. If the connection is
  // lost (the database restarts), the workers poll meanwhile and the listener reconnects.
  let listener: Client | null = null;
  let stopped = false;
  let retry: NodeJS.Timeout | null = null;
  const listen = async () => {
    const c = new Client({ connectionString: env.DATABASE_URL, application_name: "rimeplan-worker-listen" });
    listener = c;
    const again = (e: unknown) => {
      if (stopped || listener !== c) return;
      listener = null;
      log("warn", "job wake-up listener lost; polling until it reconnects", { error: words(e) });
      c.end().catch(() => undefined);
      retry = setTimeout(() => void listen(), 5_000);
      retry.unref();
    };
    c.on("error", again);
    c.on("end", () => again("connection ended"));
    c.on("notification", (n) => {
      for (const id of byQueue.get(n.payload ?? "") ?? []) boss.notifyWorker(id);
    });
    try {
      await c.connect();
      await c.query(`listen ${WAKE_CHANNEL}`);
    } catch (e) {
      again(e);
    }
  };
  if (opts.listen !== false) await listen();

  // Finished jobs are kept a week for their results and history; e-mail jobs a day. A row left
  // "running" without a heartbeat for half an hour lost its worker for good (pg-boss has
  // retried and given up by then): it is marked failed so the user is not left waiting.
  const clean = async () => {
    await db.execute(sql`delete from jobs where status in ('done','failed') and (finished_at < now() - interval '7 days' or (kind = 'mail.send' and finished_at < now() - interval '1 day'))`);
    await db.execute(
      sql`update jobs set status = 'failed', stage = 'Failed', error = 'The worker running it stopped and it could not be finished; start it again.', finished_at = now(), updated_at = now() where status = 'running' and updated_at < now() - interval '30 minutes'`,
    );
  };
  const cleaner = setInterval(() => clean().catch((e) => log("warn", "job cleanup failed", { error: words(e) })), 600_000);
  cleaner.unref();

  return {
    boss,
    async stop() {
      stopped = true;
      clearInterval(cleaner);
      if (retry) clearTimeout(retry);
      await (listener as Client | null)?.end().catch(() => undefined);
      await boss.stop({ graceful: true, wait: true, timeout: 30_000 });
    },
  };
}
