/**
 * Faults of the database itself: PostgreSQL's own errors are answered as 4xx or 503 (never a
 * 500), and a restart of the test cluster in the middle of a stream of saves loses no
 * acknowledged save, half-writes nothing, and the app's pool recovers by itself.
 *
 * The restart goes through scripts/lib.sh (pg_restart: pg_ctl restart -m fast, as the postgres
 * user when root) with the PGPORT / RIMEPLAN_PG_DIR that scripts/test.sh exports.
 */
import { describe, expect, it } from "vitest";
import { execFile } from "node:child_process";
import path from "node:path";
import { promisify } from "node:util";
import { readFileSync } from "node:fs";
import { Pool } from "pg";
import { and, eq, sql } from "drizzle-orm";
import { db, pool } from "@/db/client";
import { facilities, facilityRevisions, workspaces } from "@/db/schema";
import { dbErrorToAppError, DATABASE_UNAVAILABLE_MESSAGE } from "@/lib/db-errors";
import { createFacility } from "@/features/facilities/queries";
import { loadFacilityModel, saveFacilityModel } from "@/features/facilities/model";
import type { ModelDoc } from "@/features/facilities/engine-model";
import { makeUser, makeWorkspace, SITE } from "../factories";

const root = path.resolve(import.meta.dirname, "../..");
const run = promisify(execFile);
const demo = JSON.parse(readFileSync(path.resolve(root, "seeds/data/harrowfield-model.json"), "utf8")) as ModelDoc;
type Room = { id: string; name: string };

/** The error a promise rejects with, run through the same mapping as route(). */
async function mapped(p: PromiseLike<unknown>) {
  try {
    await p;
  } catch (e) {
    const a = dbErrorToAppError(e);
    return a ? { code: a.code, status: a.status } : { unmapped: String(e) };
  }
  throw new Error("expected the database to refuse this");
}

describe("PostgreSQL's errors become answers that say whose move it is", () => {
  it("refusals by a real server: out-of-range number, malformed id, NUL in text and in JSON → 400; duplicate → 409", async () => {
    const ws = await makeWorkspace();
    const f = await createFacility(ws.id, (await makeUser()).id, { name: "Errors", site: SITE });
    // a revision number past the integer column's range (22003)
    expect(await mapped(db.select().from(facilityRevisions).where(and(eq(facilityRevisions.facilityId, f.id), eq(facilityRevisions.number, 2 ** 31))))).toEqual({
      code: "validation",
      status: 400,
    });
    // a facility id that is not a UUID (22P02)
    expect(await mapped(db.select().from(facilities).where(eq(facilities.id, "not-a-uuid")))).toEqual({ code: "validation", status: 400 });
    // a NUL character in a text column (22021) and inside a JSON document (22P05)
    expect(await mapped(db.update(facilities).set({ name: "cold\u0000store" }).where(eq(facilities.id, f.id)))).toEqual({ code: "validation", status: 400 });
    expect(await mapped(db.update(facilities).set({ model: { note: "a\u0000b" } }).where(eq(facilities.id, f.id)))).toEqual({ code: "validation", status: 400 });
    // the same workspace slug twice (23505)
    expect(await mapped(db.insert(workspaces).values({ slug: ws.slug, name: "Twin" }))).toEqual({ code: "conflict", status: 409 });
    // nothing of the refused writes was stored
    const [row] = await db.select().from(facilities).where(eq(facilities.id, f.id));
    expect(row.name).toBe("Errors");
    expect(row.model).toBeNull();
  });

  it("a deadlock between two transactions → one of them gets 409, the other commits", async () => {
    const a = await makeWorkspace("A");
    const b = await makeWorkspace("B");
    let release!: () => void;
    const bothLocked = new Promise<void>((r) => (release = r));
    let locked = 0;
    const lockInOrder = (first: string, second: string) =>
      db.transaction(async (tx) => {
        await tx.update(workspaces).set({ name: "locked" }).where(eq(workspaces.id, first));
        if (++locked === 2) release();
        await bothLocked;
        await tx.update(workspaces).set({ name: "locked" }).where(eq(workspaces.id, second));
      });
    const results = await Promise.allSettled([lockInOrder(a.id, b.id), lockInOrder(b.id, a.id)]);
    const refused = results.filter((r) => r.status === "rejected").map((r) => dbErrorToAppError((r as PromiseRejectedResult).reason));
    expect(results.filter((r) => r.status === "fulfilled")).toHaveLength(1);
    expect(refused.map((e) => e && { code: e.code, status: e.status })).toEqual([{ code: "conflict", status: 409 }]);
  });

  it("no server on the port → 503 with the clear message, within the connect timeout", async () => {
    const url = new URL(process.env.DATABASE_URL!);
    url.port = "9"; // discard port: nothing listens there
    const p = new Pool({ connectionString: url.toString(), connectionTimeoutMillis: 5_000 });
    p.on("error", () => {});
    const t0 = Date.now();
    try {
      const e = await p.query("select 1").then(
        () => null,
        (err: unknown) => dbErrorToAppError(err),
      );
      expect(e?.code).toBe("unavailable");
      expect(e?.status).toBe(503);
      expect(e?.message).toBe(DATABASE_UNAVAILABLE_MESSAGE);
      expect(Date.now() - t0).toBeLessThan(6_000);
    } finally {
      await p.end();
    }
  });
});

describe("a PostgreSQL restart in the middle of saves", () => {
  it("keeps every acknowledged save, half-writes none, and the pool recovers by itself", async () => {
    if (!process.env.RIMEPLAN_PG_DIR || !process.env.PGPORT) throw new Error("run through `npm test` (it exports PGPORT and RIMEPLAN_PG_DIR)");
    const ws = await makeWorkspace("Restart");
    const u = await makeUser();
    const f = await createFacility(ws.id, u.id, { name: "Saved through a restart", site: SITE });
    await saveFacilityModel({ workspaceId: ws.id, facilityId: f.id, userId: u.id, baseVersion: 1, doc: demo, summary: "demo model" });
    const roomIds = (demo.rooms as Room[]).map((r) => r.id);

    // Only the app's own handler listens for idle-connection errors (db/client.ts); without it
    // the restart would end this process with an unhandled 'error' event.
    expect(pool.listenerCount("error")).toBe(1);

    type Ack = { i: number; stream: number; version: number; afterRestart: boolean };
    const acked: Ack[] = [];
    const failed: { i: number; stream: number; error: unknown }[] = [];
    let next = 0;
    let restart: Promise<unknown> | null = null;
    let restartDone = false;
    let idleAtRestart = -1;

    // Three designers save at once, each renaming its own room (so concurrent saves merge).
    async function designer(stream: number) {
      const deadline = Date.now() + 45_000;
      let afterRestart = 0;
      while (Date.now() < deadline && afterRestart < 5) {
        const i = next++;
        try {
          const m = await loadFacilityModel(ws.id, f.id);
          const doc = { ...m.doc, rooms: (m.doc.rooms as Room[]).map((r) => (r.id === roomIds[stream] ? { ...r, name: `Save ${i}` } : r)) };
          const done = restartDone;
          const r = await saveFacilityModel({ workspaceId: ws.id, facilityId: f.id, userId: u.id, baseVersion: m.version, doc, summary: `stream-${i}` });
          acked.push({ i, stream, version: r.version, afterRestart: done });
          if (done) afterRestart++;
        } catch (error) {
          failed.push({ i, stream, error });
          await new Promise((r) => setTimeout(r, 50));
        }
        if (!restart && acked.length >= 9) {
          restart = (async () => {
            // a few more connections than the designers hold, so idle ones exist when it goes
            await Promise.all(Array.from({ length: 6 }, () => pool.query("select pg_sleep(0.02)")));
            idleAtRestart = pool.idleCount;
            await run("bash", ["-c", "source scripts/lib.sh && pg_restart"], { cwd: root, env: process.env });
            restartDone = true;
          })();
        }
      }
      return afterRestart;
    }

    const afterRestart = await Promise.all([0, 1, 2].map(designer));
    await restart;

    // The restart really hit the stream, and every failure was the database being away (503).
    expect(restartDone).toBe(true);
    expect(idleAtRestart).toBeGreaterThan(0);
    expect(failed.length).toBeGreaterThan(0);
    expect(failed.map((x) => dbErrorToAppError(x.error)?.code)).toEqual(failed.map(() => "unavailable"));
    // The pool recovered without help: every designer saved again after the restart.
    expect(afterRestart).toEqual([5, 5, 5]);
    expect((await pool.query("select 1 as ok")).rows).toEqual([{ ok: 1 }]);

    const revs = (
      await db.execute(sql`select number, summary, model from facility_revisions where facility_id = ${f.id} order by number`)
    ).rows as { number: number; summary: string | null; model: ModelDoc }[];
    const [fac] = await db.select().from(facilities).where(eq(facilities.id, f.id));
    // Versions and revisions move together: 1..N without a gap, the facility at N with N's document.
    expect(revs.map((r) => r.number)).toEqual(revs.map((_, k) => k + 1));
    expect(fac.version).toBe(revs.length);
    expect(fac.model).toEqual(revs[revs.length - 1].model);
    // Every acknowledged save is there, at the version it was acknowledged with, with its change.
    const bySummary = new Map(revs.map((r) => [r.summary, r]));
    for (const a of acked) {
      const r = bySummary.get(`stream-${a.i}`);
      expect(r?.number, `save ${a.i}`).toBe(a.version);
      expect((r!.model.rooms as Room[]).find((x) => x.id === roomIds[a.stream])?.name).toBe(`Save ${a.i}`);
    }
    // A failed save is either absent or entirely there (committed before the answer was lost):
    // its revision carries its change and the version count accounts for it.
    const failedCommitted = failed.filter((x) => bySummary.has(`stream-${x.i}`));
    for (const x of failedCommitted) {
      const r = bySummary.get(`stream-${x.i}`)!;
      expect((r.model.rooms as Room[]).find((y) => y.id === roomIds[x.stream])?.name).toBe(`Save ${x.i}`);
    }
    expect(revs.filter((r) => r.summary?.startsWith("stream-"))).toHaveLength(acked.length + failedCommitted.length);
  }, 90_000);
});
