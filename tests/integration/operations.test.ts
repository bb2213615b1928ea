import { describe, expect, it } from "vitest";
import { execFileSync } from "node:child_process";
import { mkdtempSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { Client } from "pg";
import { sql } from "drizzle-orm";
import { db } from "@/db/client";
import { auditLog } from "@/db/schema";
import { audit } from "@/lib/audit";
import { createFacility } from "@/features/facilities/queries";
import { makeUser, makeWorkspace, SITE } from "../factories";

const root = path.resolve(import.meta.dirname, "../..");
const dbUrl = () => process.env.DATABASE_URL!;

function adminQuery(q: string) {
  const c = new Client({ connectionString: process.env.ADMIN_DATABASE_URL });
  return c.connect().then(async () => {
    try {
      return await c.query(q);
    } finally {
      await c.end();
    }
  });
}

describe("audit log", () => {
  it("is append-only at the database: updates and deletes are refused", async () => {
    const ws = await makeWorkspace();
    await audit({ workspaceId: ws.id, action: "facility.created", detail: { name: "x" } });
    // drizzle wraps the driver's error; the database's own message is on the cause
    const reason = (p: PromiseLike<unknown>) =>
      Promise.resolve(p).then(
        () => "no error",
        (e: Error & { cause?: Error }) => `${e.message} ${e.cause?.message ?? ""}`,
      );
    expect(await reason(db.update(auditLog).set({ action: "tampered" }))).toMatch(/audit_log is append-only/);
    expect(await reason(db.delete(auditLog))).toMatch(/audit_log is append-only/);
    expect(await reason(db.execute(sql`truncate audit_log`))).toMatch(/audit_log is append-only/);
  });
});

describe("backup and restore", () => {
  // scripts/db.sh against the test cluster (scripts/test.sh exports PGPORT and RIMEPLAN_PG_DIR):
  // it builds the app role's connection from the generated password beside the cluster, as
  // `npm run db:backup` does. DATABASE_URL is left out so the script uses that local cluster.
  const dbSh = (...args: string[]) => {
    const { DATABASE_URL: _omit, ...rest } = process.env;
    return execFileSync("bash", ["scripts/db.sh", ...args], {
      cwd: root,
      env: { ...rest, DATABASE_NAME: process.env.INTEGRATION_DB },
      stdio: "pipe",
    }).toString();
  };
  const onDb = async <T>(name: string, work: (c: Client) => Promise<T>) => {
    const url = new URL(dbUrl());
    url.pathname = `/${name}`;
    const c = new Client({ connectionString: url.toString() });
    await c.connect();
    try {
      return await work(c);
    } finally {
      await c.end();
    }
  };

  it("npm run db:backup / db:restore: a restored fresh database holds the data", async () => {
    const ws = await makeWorkspace("Backup check");
    const u = await makeUser();
    const f = await createFacility(ws.id, u.id, { name: "Restored facility", site: SITE });
    const dir = mkdtempSync(path.join(tmpdir(), "rimeplan-backup-"));
    const file = path.join(dir, "b.dump");
    expect(dbSh("backup", file)).toContain(`backup written to ${file}`);
    const target = `${process.env.INTEGRATION_DB}_restore`;
    await adminQuery(`drop database if exists ${target} with (force)`);
    dbSh("restore", file, target);
    const r = await onDb(target, async (c) => {
      const rows = (await c.query("select name, design_dry_bulb_c from facilities where id = $1", [f.id])).rows;
      // the append-only trigger came back with the schema
      await expect(c.query("delete from audit_log")).rejects.toThrow(/append-only/);
      return rows;
    });
    await adminQuery(`drop database if exists ${target} with (force)`);
    expect(r).toEqual([{ name: "Restored facility", design_dry_bulb_c: 32 }]);
  });

  it("a restore over changed data brings back what the backup held, as the app's role (not a superuser)", async () => {
    const ws = await makeWorkspace("Restore over changes");
    const u = await makeUser();
    const f = await createFacility(ws.id, u.id, { name: "Before the change", site: SITE });
    const file = path.join(mkdtempSync(path.join(tmpdir(), "rimeplan-backup-")), "b.dump");
    const target = `${process.env.INTEGRATION_DB}_rs`;
    await adminQuery(`drop database if exists ${target} with (force)`);
    dbSh("backup", file);
    dbSh("restore", file, target);
    const role = await onDb(target, async (c) => {
      await c.query("update facilities set name = 'After the change' where id = $1", [f.id]);
      // facilities with an issued (locked) revision cannot be deleted; the others can
      await c.query("delete from facilities where id <> $1 and id not in (select facility_id from facility_revisions where issued_at is not null)", [f.id]);
      await c.query("insert into workspaces (slug, name) values ('after-backup', 'Made after the backup')");
      return (await c.query("select current_user as u, rolsuper from pg_roles where rolname = current_user")).rows[0];
    });
    expect(role).toEqual({ u: "rimeplan", rolsuper: false });
    dbSh("restore", file, target);
    const after = await onDb(target, async (c) => ({
      name: (await c.query("select name from facilities where id = $1", [f.id])).rows[0]?.name,
      later: (await c.query("select count(*)::int as n from workspaces where slug = 'after-backup'")).rows[0].n,
      facilities: (await c.query("select count(*)::int as n from facilities")).rows[0].n,
      owner: (await c.query("select tableowner from pg_tables where tablename = 'facilities'")).rows[0].tableowner,
    }));
    const source = (await db.execute(sql`select count(*)::int as n from facilities`)).rows[0].n;
    await adminQuery(`drop database if exists ${target} with (force)`);
    expect(after).toEqual({ name: "Before the change", later: 0, facilities: source, owner: "rimeplan" });
  });
});

describe("migrations", () => {
  it("apply to a database that already has data without losing it, and again as a no-op", async () => {
    const ws = await makeWorkspace("Migration check");
    const u = await makeUser();
    await createFacility(ws.id, u.id, { name: "Kept through migrations", site: SITE });
    execFileSync("node_modules/.bin/tsx", ["scripts/migrate.ts"], { cwd: root, env: { ...process.env, DATABASE_URL: dbUrl() }, stdio: "pipe" });
    execFileSync("node_modules/.bin/tsx", ["scripts/migrate.ts"], { cwd: root, env: { ...process.env, DATABASE_URL: dbUrl() }, stdio: "pipe" });
    const r = await db.execute(sql`select count(*)::int as n from facilities where name = 'Kept through migrations'`);
    expect(r.rows[0]).toEqual({ n: 1 });
  });
});
