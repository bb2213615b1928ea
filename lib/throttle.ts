import "server-only";
import { sql } from "drizzle-orm";
import { db } from "@/db/client";
import { AppError } from "./errors";
import { env } from "./env";
import { humanWait } from "./human-wait";

/**
 * Every throttle of the app, kept in PostgreSQL (table throttle_events) so that it holds across
 * app instances and restarts: sign-in failures (slowed down, never locked out), requests for
 * sign-in and reset links, and e-mails sent per user and per workspace.
 *
 * Each check runs in one transaction holding an advisory lock per (bucket, key), so parallel
 * requests on several instances are counted one after another and a cap is never overrun.
 */

/** At most `max` events per `windowSeconds` (sliding window). */
export interface Cap {
  kind: "cap";
  bucket: string;
  key: string;
  max: number;
  windowSeconds: number;
}

/**
 * Slow-down: the first `free` events in the window need no wait; after that the next one must
 * wait `baseSeconds` × 2^(n − free) after the latest (n = events in the window), at most
 * `maxSeconds`. Nothing is ever refused for longer than `maxSeconds`.
 */
export interface Backoff {
  kind: "backoff";
  bucket: string;
  key: string;
  free: number;
  windowSeconds: number;
  baseSeconds: number;
  maxSeconds: number;
}

export type Limit = Cap | Backoff;

export type Taken = { ok: true; ids: string[] } | { ok: false; retryAfterSeconds: number; limit: Limit };

/** Rows older than this are no use to any limit (the longest window is a day) and are pruned now and then. */
const KEEP_DAYS = 31;

export interface Stats {
  n: number;
  /** Epoch ms of the latest event in the window. */
  latest: number | null;
  /** Epoch ms of the event whose expiry lets one more `count` events fit under a cap. */
  freeingAt: number | null;
}

async function stats(tx: Tx, l: Limit, count: number): Promise<Stats> {
  const since = sql`now() - make_interval(secs => ${l.windowSeconds})`;
  const r = await tx.execute<{ n: string; latest: string | null }>(
    sql`select count(*)::text as n, (extract(epoch from max(at)) * 1000)::text as latest
        from throttle_events where bucket = ${l.bucket} and key = ${l.key} and at > ${since}`,
  );
  const n = Number(r.rows[0].n);
  const latest = r.rows[0].latest == null ? null : Number(r.rows[0].latest);
  let freeingAt: number | null = null;
  if (l.kind === "cap" && n + count > l.max && n > 0) {
    // the (n + count − max)-th oldest event in the window must leave it first
    const f = await tx.execute<{ at: string }>(
      sql`select (extract(epoch from at) * 1000)::text as at from throttle_events
          where bucket = ${l.bucket} and key = ${l.key} and at > ${since}
          order by at asc offset ${Math.max(0, n + count - l.max - 1)} limit 1`,
    );
    freeingAt = f.rows[0] ? Number(f.rows[0].at) : null;
  }
  return { n, latest, freeingAt };
}

/** Seconds to wait before `count` more events are allowed under `l` (0: allowed now). */
export function waitSeconds(l: Limit, s: Stats, nowMs: number, count = 1): number {
  if (l.kind === "cap") {
    if (count > l.max) return l.windowSeconds;
    if (s.n + count <= l.max) return 0;
    if (s.freeingAt == null) return l.windowSeconds;
    return Math.max(1, Math.ceil((s.freeingAt + l.windowSeconds * 1000 - nowMs) / 1000));
  }
  if (s.n < l.free || s.latest == null) return 0;
  const need = Math.min(l.maxSeconds, l.baseSeconds * 2 ** (s.n - l.free));
  const waited = (nowMs - s.latest) / 1000;
  return need > waited ? Math.max(1, Math.ceil(need - waited)) : 0;
}

type Tx = Parameters<Parameters<typeof db.transaction>[0]>[0];

/**
 * Checks every limit and, only if all allow it, records `count` events under each (in one
 * transaction). Answers the longest wait when one refuses. The ids of the recorded events
 * let a caller take them back (`release`), e.g. a sign-in attempt that turned out right.
 */
export async function take(limits: Limit[], count = 1): Promise<Taken> {
  if (Math.random() < 0.01) await prune();
  return db.transaction(async (tx) => {
    const ordered = [...limits].sort((a, b) => `${a.bucket}\u0000${a.key}`.localeCompare(`${b.bucket}\u0000${b.key}`));
    for (const l of ordered) await tx.execute(sql`select pg_advisory_xact_lock(hashtextextended(${`throttle:${l.bucket}:${l.key}`}, 0))`);
    const nowR = await tx.execute<{ now: string }>(sql`select (extract(epoch from now()) * 1000)::text as now`);
    const nowMs = Number(nowR.rows[0].now);
    let worst: { s: number; limit: Limit } | null = null;
    for (const l of ordered) {
      const w = waitSeconds(l, await stats(tx, l, count), nowMs, count);
      if (w > 0 && (!worst || w > worst.s)) worst = { s: w, limit: l };
    }
    if (worst) return { ok: false as const, retryAfterSeconds: worst.s, limit: worst.limit };
    const ids: string[] = [];
    for (const l of ordered) {
      const rows = Array.from({ length: count }, () => sql`(${l.bucket}, ${l.key})`);
      const r = await tx.execute<{ id: string }>(sql`insert into throttle_events (bucket, key) values ${sql.join(rows, sql`, `)} returning id`);
      ids.push(...r.rows.map((x) => x.id));
    }
    return { ok: true as const, ids };
  });
}

/** Takes back events recorded by `take`. */
export async function release(ids: string[]): Promise<void> {
  if (ids.length === 0) return;
  await db.execute(sql`delete from throttle_events where id in (${sql.join(ids.map((id) => sql`${id}::uuid`), sql`, `)})`);
}

/** Forgets every event of one (bucket, key). */
export async function clear(bucket: string, key: string): Promise<void> {
  await db.execute(sql`delete from throttle_events where bucket = ${bucket} and key = ${key}`);
}

/** Whether any event of (bucket, key) happened within the window. */
export async function seen(bucket: string, key: string, windowSeconds: number): Promise<boolean> {
  const r = await db.execute<{ x: number }>(
    sql`select 1 as x from throttle_events where bucket = ${bucket} and key = ${key} and at > now() - make_interval(secs => ${windowSeconds}) limit 1`,
  );
  return r.rows.length > 0;
}

async function prune(): Promise<void> {
  await db.execute(sql`delete from throttle_events where at < now() - make_interval(days => ${KEEP_DAYS})`);
}

function refuse(message: string, retryAfterSeconds: number): never {
  throw new AppError("rate_limited", message, undefined, undefined, { retryAfterSeconds });
}

// ── Sign-in by password ──────────────────────────────────────────────────────────────────────
//
// The rule: failures are counted per (address, client) and per client, within
// SIGNIN_WINDOW_MINUTES. From one client, the first SIGNIN_MAX_ATTEMPTS failures for an address
// (and 4× that for all addresses together) need no wait; after that each further attempt must
// wait SIGNIN_WAIT_SECONDS after the latest failure, doubling with every further failure, at most
// the window. Nobody is locked out: the wait is stated ("try again in N seconds"), and a stranger's
// failures from another client never slow the real person down. A success clears that client's
// failures for that address. Failures against one address from all clients together are also
// slowed after 10× SIGNIN_MAX_ATTEMPTS in the window (a guess spread over many machines), except
// for a client that has signed in to that address within the last 30 days.

const KNOWN_CLIENT_DAYS = 30;

function signInLimits(email: string, client: string, known: boolean): Limit[] {
  const windowSeconds = env.SIGNIN_WINDOW_MINUTES * 60;
  const common = { kind: "backoff" as const, windowSeconds, baseSeconds: env.SIGNIN_WAIT_SECONDS, maxSeconds: windowSeconds };
  const limits: Limit[] = [
    { ...common, bucket: "signin.fail", key: `${email}|${client}`, free: env.SIGNIN_MAX_ATTEMPTS },
    { ...common, bucket: "signin.fail.client", key: client, free: env.SIGNIN_MAX_ATTEMPTS * 4 },
  ];
  if (!known) limits.push({ ...common, bucket: "signin.fail.address", key: email, free: env.SIGNIN_MAX_ATTEMPTS * 10 });
  return limits;
}

export type SignInOutcome = { outcome: "ok" } | { outcome: "bad" } | { outcome: "wait"; seconds: number };

/**
 * Runs one password check under the sign-in limits. The attempt is counted as a failure before
 * `verify` runs (so a burst of parallel guesses is counted one by one) and taken back if it was right.
 */
export async function signInAttempt(email: string, client: string, verify: () => Promise<boolean>): Promise<SignInOutcome> {
  const known = await seen("signin.ok", `${email}|${client}`, KNOWN_CLIENT_DAYS * 86_400);
  const t = await take(signInLimits(email, client, known));
  if (!t.ok) return { outcome: "wait", seconds: t.retryAfterSeconds };
  if (!(await verify())) return { outcome: "bad" };
  await release(t.ids);
  await clear("signin.fail", `${email}|${client}`);
  await clear("signin.ok", `${email}|${client}`);
  await db.execute(sql`insert into throttle_events (bucket, key) values ('signin.ok', ${`${email}|${client}`})`);
  return { outcome: "ok" };
}

// ── Requests for sign-in and reset links ─────────────────────────────────────────────────────
//
// Counted per address asked for (whether or not it has an account, so the answer reveals
// nothing) and per client, both kinds together.

export async function takeLinkRequest(email: string, client: string): Promise<void> {
  const windowSeconds = env.LINK_REQUEST_WINDOW_MINUTES * 60;
  const t = await take([
    { kind: "cap", bucket: "link.address", key: email, max: env.LINK_REQUESTS_PER_ADDRESS, windowSeconds },
    { kind: "cap", bucket: "link.client", key: client, max: env.LINK_REQUESTS_PER_CLIENT, windowSeconds },
  ]);
  if (!t.ok) {
    const who = t.limit.bucket === "link.address" ? "for this address" : "from here";
    refuse(`Too many link requests ${who}. Try again in ${humanWait(t.retryAfterSeconds)}.`, t.retryAfterSeconds);
  }
}

// ── E-mails people send (scenario summaries, invitations) ────────────────────────────────────

/** Counts `recipients` e-mails against the sender's and the workspace's hourly limits, or refuses them all. */
export async function takeMail(userId: string, workspaceId: string, recipients: number): Promise<void> {
  const windowSeconds = env.MAIL_LIMIT_WINDOW_MINUTES * 60;
  const t = await take(
    [
      { kind: "cap", bucket: "mail.user", key: userId, max: env.MAIL_PER_USER, windowSeconds },
      { kind: "cap", bucket: "mail.workspace", key: workspaceId, max: env.MAIL_PER_WORKSPACE, windowSeconds },
    ],
    recipients,
  );
  if (!t.ok) {
    const l = t.limit as Cap;
    const whose = l.bucket === "mail.user" ? "you" : "this workspace";
    const per = windowSeconds === 3600 ? "hour" : humanWait(windowSeconds);
    const asked = recipients > 1 ? ` (this would send ${recipients})` : "";
    if (recipients > l.max) {
      throw new AppError("rate_limited", `E-mail limit: ${whose} can send at most ${l.max} e-mails per ${per}; send to fewer recipients.`, "to", undefined, {
        retryAfterSeconds: t.retryAfterSeconds,
      });
    }
    refuse(
      `E-mail limit reached: ${whose} can send at most ${l.max} e-mails per ${per}${asked}. Nothing was sent. Try again in ${humanWait(t.retryAfterSeconds)}.`,
      t.retryAfterSeconds,
    );
  }
}
