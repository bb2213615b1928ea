import "server-only";
import PgBoss from "pg-boss";
import type { PoolClient } from "pg";
import { and, eq, inArray, sql } from "drizzle-orm";
import { drizzle } from "drizzle-orm/node-postgres";
import { pool } from "@/db/client";
import * as schema from "@/db/schema";
import { jobs } from "@/db/schema";
import { env } from "../env";
import { log } from "../log";

/**
 * Slow work goes through pg-boss, a job queue kept in PostgreSQL (schema `pgboss`): a job is a
 * row there, so it survives a restart of the app or the worker; a failed attempt is retried
 * with exponential backoff; a job is fetched by exactly one worker (`FOR UPDATE SKIP LOCKED`).
 *
 * What the user sees of a job is our own `jobs` row (status, progress, stage, error, result),
 * written in the same transaction as the pg-boss job so that one never exists without the
 * other. The pg-boss job carries only `{ jobId }`; inputs (and an uploaded file) live in the row.
 *
 * Adding a kind of job (for example the annual energy run, `energy.annual`):
 *   1. add its retry and expiry options to JOB_KINDS below (a year-long run: few retries, a
 *      long `expireInSeconds`);
 *   2. write its handler in the feature that owns the work (e.g. `features/energy/job.ts`:
 *      `async (ctx) => { await ctx.progress(month / 12, "Simulating March"); … return { json } }`)
 *      and register it in `features/jobs/handlers.ts`;
 *   3. name the permission that may see it in `features/jobs/queries.ts` (JOB_ACTION), and
 *      create it from a route with `enqueue({ kind: "energy.annual", … })` answering 202.
 * The UI needs nothing new: `JobProgress` shows any job's stage, progress, result or failure.
 */
export interface KindOptions {
  /** Attempts after the first. */
  retryLimit: number;
  /** Seconds before the first retry; doubled (with jitter) for each later one. */
  retryDelay: number;
  retryBackoff: boolean;
  /** An attempt running longer than this is given up (and retried). */
  expireInSeconds: number;
  /** Forget the job's input once it is done or has failed for good (e-mail: the links in it are credentials). */
  clearInputWhenDone?: boolean;
}

export const JOB_KINDS = {
  "mail.send": { retryLimit: 5, retryDelay: 10, retryBackoff: true, expireInSeconds: 120, clearInputWhenDone: true },
  "schedule.export": { retryLimit: 2, retryDelay: 5, retryBackoff: true, expireInSeconds: 900 },
  "import.rooms": { retryLimit: 2, retryDelay: 5, retryBackoff: true, expireInSeconds: 600 },
  "import.stocking": { retryLimit: 2, retryDelay: 5, retryBackoff: true, expireInSeconds: 600 },
  // A year of hours: one retry (a bad model fails at once with an AppError), ten minutes at most.
  "energy.annual": { retryLimit: 1, retryDelay: 5, retryBackoff: true, expireInSeconds: 600 },
} satisfies Record<string, KindOptions>;

const DEFAULT_KIND: KindOptions = { retryLimit: 2, retryDelay: 5, retryBackoff: true, expireInSeconds: 600 };

export type JobKind = keyof typeof JOB_KINDS;
export type JobRow = typeof jobs.$inferSelect;

/** Channel on which a new job wakes idle workers at once (they also poll every JOBS_POLL_SECONDS). */
export const WAKE_CHANNEL = "rimeplan_jobs";

/** pg-boss queue names allow letters, digits, `_` and `-`. */
export const queueName = (kind: string) => kind.replace(/[^\w-]/g, "_");

export function kindOptions(kind: string, override?: Partial<KindOptions>): KindOptions {
  const base: KindOptions | undefined = (JOB_KINDS as Record<string, KindOptions>)[kind];
  if (!base && !override) throw new Error(`Unknown job kind "${kind}": add it to JOB_KINDS.`);
  return { ...DEFAULT_KIND, ...base, ...override };
}

/** A pg-boss instance on the app's database; the worker supervises (maintenance), the app only sends. */
export function newBoss(opts: { supervise: boolean; max?: number }): PgBoss {
  const boss = new PgBoss({
    connectionString: env.DATABASE_URL,
    schema: "pgboss",
    application_name: opts.supervise ? "rimeplan-worker" : "rimeplan-app",
    max: opts.max ?? 2,
    supervise: opts.supervise,
    schedule: false,
    migrate: true,
    // Finished pg-boss jobs are archived after a day; ours (`jobs`) are cleaned by the worker.
    archiveCompletedAfterSeconds: 86_400,
    archiveFailedAfterSeconds: 7 * 86_400,
    deleteAfterDays: 7,
  });
  boss.on("error", (e) => log("error", "job queue error", { error: String((e as Error)?.message ?? e) }));
  return boss;
}

const g = globalThis as unknown as { rimeplanSender?: Promise<PgBoss> };
const created = new WeakMap<PgBoss, Map<string, Promise<void>>>();

/** The app's sending instance, started on first use; a failed start is retried on the next call. */
async function sender(): Promise<PgBoss> {
  if (!g.rimeplanSender) {
    const p = newBoss({ supervise: false }).start();
    g.rimeplanSender = p;
    p.catch(() => {
      if (g.rimeplanSender === p) g.rimeplanSender = undefined;
    });
  }
  return g.rimeplanSender;
}

/**
 * Creates the pg-boss queue of a kind once per instance. Creation is idempotent in pg-boss, but
 * two processes creating the same queue at once can deadlock on its tables: PostgreSQL cancels
 * one, which tries again and finds the queue made.
 */
export function ensureQueue(boss: PgBoss, kind: string): Promise<void> {
  const made = created.get(boss) ?? new Map<string, Promise<void>>();
  created.set(boss, made);
  let p = made.get(kind);
  if (!p) {
    p = (async () => {
      for (let attempt = 1; ; attempt++) {
        try {
          if (await boss.getQueue(queueName(kind))) return;
          await boss.createQueue(queueName(kind), { name: queueName(kind), policy: "standard" });
          return;
        } catch (e) {
          const code = (e as { code?: string }).code;
          if (attempt >= 5 || (code !== "40P01" && code !== "23505")) throw e;
          await new Promise((r) => setTimeout(r, 50 * attempt));
        }
      }
    })();
    made.set(kind, p);
    p.catch(() => made.delete(kind));
  }
  return p;
}

export interface EnqueueArgs {
  kind: JobKind | (string & {});
  workspaceId?: string | null;
  facilityId?: string | null;
  createdBy?: string | null;
  input?: Record<string, unknown>;
  inputBytes?: Buffer | null;
  /** What the user sees before a worker picks it up. */
  stage?: string;
  /**
   * When set, a job of the same kind with the same key that is still queued or running is
   * returned instead of a new one (the same person asking twice for the same export).
   */
  dedupeKey?: string;
  /** Overrides of the kind's retry options (tests, or a caller that knows better). */
  options?: Partial<KindOptions>;
}

/**
 * Records a job and queues it in one transaction; answers the row (status "queued"), or the
 * running one it duplicates (`reused: true`).
 */
export async function enqueue(args: EnqueueArgs): Promise<{ job: JobRow; reused: boolean }> {
  const opts = kindOptions(args.kind, args.options);
  const boss = await sender();
  await ensureQueue(boss, args.kind);
  const client: PoolClient = await pool.connect();
  try {
    await client.query("begin");
    const tx = drizzle(client, { schema });
    const input = { ...(args.input ?? {}), ...(args.dedupeKey ? { dedupeKey: args.dedupeKey } : {}) };
    if (args.dedupeKey) {
      // One request at a time per key, so two simultaneous clicks cannot both insert.
      await client.query("select pg_advisory_xact_lock(hashtextextended($1, 0))", [`job:${args.kind}:${args.dedupeKey}`]);
      const [same] = await tx
        .select()
        .from(jobs)
        .where(and(eq(jobs.kind, args.kind), inArray(jobs.status, ["queued", "running"]), sql`${jobs.input}->>'dedupeKey' = ${args.dedupeKey}`))
        .limit(1);
      if (same) {
        await client.query("commit");
        return { job: same, reused: true };
      }
    }
    const [row] = await tx
      .insert(jobs)
      .values({
        kind: args.kind,
        workspaceId: args.workspaceId ?? null,
        facilityId: args.facilityId ?? null,
        createdBy: args.createdBy ?? null,
        input,
        inputBytes: args.inputBytes ?? null,
        stage: args.stage ?? "Waiting for a worker",
      })
      .returning();
    const executor = { executeSql: (text: string, values: unknown[]) => client.query(text, values) };
    await boss.send(
      queueName(args.kind),
      { jobId: row.id },
      { retryLimit: opts.retryLimit, retryDelay: opts.retryDelay, retryBackoff: opts.retryBackoff, expireInSeconds: opts.expireInSeconds, db: executor },
    );
    await client.query("select pg_notify($1, $2)", [WAKE_CHANNEL, queueName(args.kind)]);
    await client.query("commit");
    return { job: row, reused: false };
  } catch (e) {
    await client.query("rollback").catch(() => undefined);
    throw e;
  } finally {
    client.release();
  }
}

/** Stops the app's sending instance (tests, shutdown). */
export async function stopSender(): Promise<void> {
  const p = g.rimeplanSender;
  g.rimeplanSender = undefined;
  if (p) await (await p.catch(() => null))?.stop({ graceful: false, wait: true });
}
