import { pgTable, text, timestamp, uuid, jsonb, integer, index, doublePrecision } from "drizzle-orm/pg-core";
import { users } from "./auth";
import { workspaces } from "./workspaces";
import { facilities } from "./facilities";
import { jobs } from "./ops";

/**
 * A facility's weather years: an uploaded hourly file, a year built from monthly means (an
 * approximation), or the demo site's invented year. The newest row is the facility's weather;
 * older ones stay, so a stored annual result always names the year it was computed with.
 */
export const weatherYears = pgTable(
  "weather_years",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    workspaceId: uuid("workspace_id")
      .notNull()
      .references(() => workspaces.id, { onDelete: "cascade" }),
    facilityId: uuid("facility_id")
      .notNull()
      .references(() => facilities.id, { onDelete: "cascade" }),
    /** file | monthly | demo */
    kind: text("kind").notNull(),
    /** What the source is, in words (always shown beside the results). */
    label: text("label").notNull(),
    year: integer("year").notNull(),
    /** Weekday of 1 January, 0 = Monday. */
    startWeekday: integer("start_weekday").notNull(),
    hours: integer("hours").notNull(),
    dryBulbC: jsonb("dry_bulb_c").$type<number[]>().notNull(),
    rhPct: jsonb("rh_pct").$type<number[]>().notNull(),
    pressurePa: doublePrecision("pressure_pa"),
    /** The monthly climate a "monthly" year was built from, to show and edit again. */
    monthly: jsonb("monthly").$type<Record<string, unknown>>(),
    fileName: text("file_name"),
    /** How the file was read (units assumed, humidity column used, year). */
    notes: jsonb("notes").$type<string[]>().notNull().default([]),
    createdBy: uuid("created_by").references(() => users.id, { onDelete: "set null" }),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("weather_years_facility_idx").on(t.facilityId, t.createdAt)],
);

/**
 * Stored annual energy results, stamped like every stored result: the model version and the
 * hash of the engine input it was computed from, the weather year, and the engine version. The
 * newest row is shown; it is stale when any stamp differs from the facility's current ones.
 */
export const annualResults = pgTable(
  "annual_results",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    workspaceId: uuid("workspace_id")
      .notNull()
      .references(() => workspaces.id, { onDelete: "cascade" }),
    facilityId: uuid("facility_id")
      .notNull()
      .references(() => facilities.id, { onDelete: "cascade" }),
    modelVersion: integer("model_version").notNull(),
    inputHash: text("input_hash").notNull(),
    weatherId: uuid("weather_id")
      .notNull()
      .references(() => weatherYears.id, { onDelete: "cascade" }),
    engineVersion: text("engine_version").notNull(),
    result: jsonb("result").$type<Record<string, unknown>>().notNull(),
    computeMs: integer("compute_ms"),
    jobId: uuid("job_id").references(() => jobs.id, { onDelete: "set null" }),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("annual_results_facility_idx").on(t.facilityId, t.createdAt)],
);
