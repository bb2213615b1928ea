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
  it("npm run db:backup / db:restore: a restored fresh database holds the data", async () => {
    const ws = await makeWorkspace("Backup check");
    const u = await makeUser();
    const f = await createFacility(ws.id, u.id, { name: "Restored facility", site: SITE });
    const dir = mkdtempSync(path.join(tmpdir(), "rimeplan-backup-"));
    const file = path.join(dir, "b.dump");
    const env = { ...process.env, DATABASE_URL: dbUrl() };
    execFileSync("bash", ["scripts/db.sh", "backup", file], { cwd: root, env, stdio: "pipe" });
    const target = `${process.env.INTEGRATION_DB}_restore`;
    await adminQuery(`drop database if exists ${target} with (force)`);
    execFileSync("bash", ["scripts/db.sh", "restore", file, target], { cwd: root, env, stdio: "pipe" });
    const url = new URL(dbUrl());
    url.pathname = `/${target}`;
    const c = new Client({ connectionString: url.toString() });
    await c.connect();
    const r = await c.query("select name, design_dry_bulb_c from facilities where id = $1", [f.id]);
    // the append-only trigger came back with the schema
    await expect(c.query("delete from audit_log")).rejects.toThrow(/append-only/);
    await c.end();
    await adminQuery(`drop database if exists ${target} with (force)`);
    expect(r.rows).toEqual([{ name: "Restored facility", design_dry_bulb_c: 32 }]);
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
