import { pgTable, text, timestamp, uuid, jsonb, integer, uniqueIndex, customType, boolean, index } from "drizzle-orm/pg-core";
import { facilities } from "./facilities";
import { users } from "./auth";
import { workspaces } from "./workspaces";

const bytea = customType<{ data: Buffer; driverData: Buffer }>({ dataType: () => "bytea" });

/**
 * Immutable snapshots of a facility's engineering model: one per saved version. An issued
 * revision carries a letter, status and checker and is locked (a trigger refuses changes to
 * its model once issued).
 */
export const facilityRevisions = pgTable(
  "facility_revisions",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    facilityId: uuid("facility_id")
      .notNull()
      .references(() => facilities.id, { onDelete: "cascade" }),
    /** Equals the facility's version when this snapshot was saved. */
    number: integer("number").notNull(),
    model: jsonb("model").$type<Record<string, unknown>>().notNull(),
    /** The site conditions in force for this snapshot (SI). */
    site: jsonb("site").$type<Record<string, unknown>>().notNull(),
    summary: text("summary"),
    createdBy: uuid("created_by").references(() => users.id, { onDelete: "set null" }),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
    issuedLetter: text("issued_letter"),
    issuedStatus: text("issued_status"),
    checkedBy: text("checked_by"),
    issuedBy: uuid("issued_by").references(() => users.id, { onDelete: "set null" }),
    issuedAt: timestamp("issued_at", { withTimezone: true }),
  },
  (t) => [uniqueIndex("facility_revisions_number_key").on(t.facilityId, t.number)],
);

/** Canvas node positions and the optional site-plan background, apart from engineering revisions. */
export const facilityLayouts = pgTable("facility_layouts", {
  facilityId: uuid("facility_id")
    .primaryKey()
    .references(() => facilities.id, { onDelete: "cascade" }),
  positions: jsonb("positions").$type<Record<string, { x: number; y: number }>>().notNull().default({}),
  viewport: jsonb("viewport").$type<{ x: number; y: number; zoom: number } | null>(),
  backgroundImage: bytea("background_image"),
  backgroundMime: text("background_mime"),
  backgroundWidthM: integer("background_width_m"),
  updatedAt: timestamp("updated_at", { withTimezone: true }).notNull().defaultNow(),
});

/** Stocking checks: a saved change of stock or use, with its computed verdict. */
export const scenarios = pgTable(
  "scenarios",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    workspaceId: uuid("workspace_id")
      .notNull()
      .references(() => workspaces.id, { onDelete: "cascade" }),
    facilityId: uuid("facility_id")
      .notNull()
      .references(() => facilities.id, { onDelete: "cascade" }),
    name: text("name").notNull(),
    /** The facility version the scenario was computed against. */
    baseVersion: integer("base_version").notNull(),
    changes: jsonb("changes").$type<Record<string, unknown>>().notNull(),
    result: jsonb("result").$type<Record<string, unknown>>(),
    verdict: text("verdict"),
    authorId: uuid("author_id").references(() => users.id, { onDelete: "set null" }),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
    acceptedAt: timestamp("accepted_at", { withTimezone: true }),
    appliedAt: timestamp("applied_at", { withTimezone: true }),
    appliedRevision: integer("applied_revision"),
  },
  (t) => [index("scenarios_facility_idx").on(t.facilityId)],
);

/** Every export of the schedule or report: who, when, which revision, issued or not. */
export const exportsLog = pgTable(
  "exports",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    workspaceId: uuid("workspace_id")
      .notNull()
      .references(() => workspaces.id, { onDelete: "cascade" }),
    facilityId: uuid("facility_id")
      .notNull()
      .references(() => facilities.id, { onDelete: "cascade" }),
    revisionNumber: integer("revision_number").notNull(),
    issued: boolean("issued").notNull().default(false),
    kind: text("kind").notNull(),
    actorId: uuid("actor_id").references(() => users.id, { onDelete: "set null" }),
    /** The schedule rows as exported, to mark what changed by the next export. */
    scheduleSnapshot: jsonb("schedule_snapshot").$type<unknown[]>(),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("exports_facility_idx").on(t.facilityId, t.createdAt)],
);
