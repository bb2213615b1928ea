/**
 * Seeds the invented demo workspace "Harrowfield Cold Store" (a fictional site; every number is
 * made up for the demo) with one user per role. Idempotent: running it again changes nothing
 * that is already there.
 */
import { and, eq } from "drizzle-orm";
import bcrypt from "bcryptjs";
import { readFileSync, existsSync } from "node:fs";
import path from "node:path";
import { openDb } from "./db";
import { facilities, facilityRevisions, memberships, users, weatherYears, workspaces } from "../db/schema";
import { HARROWFIELD_CLIMATE, inventYear } from "./invented-weather";

export const DEMO_PASSWORD = "harrowfield-demo";
export const DEMO_WORKSPACE = { slug: "harrowfield", name: "Harrowfield Cold Store (demo)" };
export const DEMO_USERS = [
  { email: "owner@harrowfield.example", name: "Olive Owner", role: "owner" },
  { email: "designer@harrowfield.example", name: "Dev Designer", role: "designer" },
  { email: "operations@harrowfield.example", name: "Oscar Operations", role: "operations" },
  { email: "purchaser@harrowfield.example", name: "Pia Purchaser", role: "purchaser" },
  { email: "viewer@harrowfield.example", name: "Vic Viewer", role: "viewer" },
] as const;
export const DEMO_FACILITY_NAME = "Harrowfield Cold Store — main building (invented)";
/** The demo site's weather year: invented (see seeds/invented-weather.ts), shipped with the demo only. */
export const DEMO_WEATHER_LABEL = "Harrowfield invented year 2025 — fictional, generated from an invented monthly climate; not measured anywhere";

function demoModel(): Record<string, unknown> | null {
  const file = path.resolve(import.meta.dirname, "data/harrowfield-model.json");
  return existsSync(file) ? (JSON.parse(readFileSync(file, "utf8")) as Record<string, unknown>) : null;
}

export async function seedDemo(url?: string) {
  const { db, pool } = openDb(url);
  try {
    const hash = await bcrypt.hash(DEMO_PASSWORD, 10);
    await db.insert(workspaces).values(DEMO_WORKSPACE).onConflictDoNothing({ target: workspaces.slug });
    const [ws] = await db.select().from(workspaces).where(eq(workspaces.slug, DEMO_WORKSPACE.slug));
    for (const u of DEMO_USERS) {
      await db.insert(users).values({ email: u.email, name: u.name, passwordHash: hash }).onConflictDoNothing({ target: users.email });
      const [row] = await db.select().from(users).where(eq(users.email, u.email));
      await db.insert(memberships).values({ workspaceId: ws.id, userId: row.id, role: u.role }).onConflictDoNothing();
    }
    const [owner] = await db.select().from(users).where(eq(users.email, DEMO_USERS[0].email));
    const existing = await db
      .select({ id: facilities.id, model: facilities.model })
      .from(facilities)
      .where(and(eq(facilities.workspaceId, ws.id), eq(facilities.name, DEMO_FACILITY_NAME)));
    const model = demoModel();
    if (existing.length === 0) {
      // Site conditions of the invented site: temperate inland, 32 °C dry bulb / 23 °C wet bulb, 150 m, ground 12 °C.
      const [f] = await db.insert(facilities).values({
        workspaceId: ws.id,
        name: DEMO_FACILITY_NAME,
        designDryBulbC: 32,
        coincidentWetBulbC: 23,
        groundTempC: 12,
        elevationM: 150,
        model,
        createdBy: owner.id,
      }).returning();
      await db.insert(facilityRevisions).values({
        facilityId: f.id,
        number: 1,
        model: model ?? { schemaVersion: 1, rooms: [], doors: [], plant: {} },
        site: { designDryBulbC: 32, coincidentWetBulbC: 23, designRhPct: null, groundTempC: 12, elevationM: 150 },
        summary: "Demo model (invented)",
        createdBy: owner.id,
      });
    }
    const [fac] = await db
      .select({ id: facilities.id })
      .from(facilities)
      .where(and(eq(facilities.workspaceId, ws.id), eq(facilities.name, DEMO_FACILITY_NAME)));
    const [hasWeather] = await db.select({ id: weatherYears.id }).from(weatherYears).where(eq(weatherYears.facilityId, fac.id)).limit(1);
    if (!hasWeather) {
      const y = inventYear(HARROWFIELD_CLIMATE, { year: 2025, seed: 1 });
      await db.insert(weatherYears).values({
        workspaceId: ws.id,
        facilityId: fac.id,
        kind: "demo",
        label: DEMO_WEATHER_LABEL,
        year: y.year,
        startWeekday: 2, // 1 January 2025 is a Wednesday
        hours: y.dryBulbC.length,
        dryBulbC: y.dryBulbC,
        rhPct: y.rhPct,
        notes: ["Invented for the demo: daily means follow an invented monthly climate with seeded day-to-day swings and a cosine through each day."],
        createdBy: owner.id,
      });
    }
    return { workspace: ws };
  } finally {
    await pool.end();
  }
}

if (import.meta.url === `file://${process.argv[1]}`) {
  await seedDemo();
  console.log(`[rimeplan] demo workspace "${DEMO_WORKSPACE.name}" seeded`);
}
