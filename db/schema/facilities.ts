import { pgTable, text, timestamp, uuid, jsonb, integer, index, doublePrecision } from "drizzle-orm/pg-core";
import { workspaces } from "./workspaces";
import { users } from "./auth";

export const facilities = pgTable(
  "facilities",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    workspaceId: uuid("workspace_id")
      .notNull()
      .references(() => workspaces.id, { onDelete: "cascade" }),
    name: text("name").notNull(),
    /** Site design conditions, SI. */
    designDryBulbC: doublePrecision("design_dry_bulb_c").notNull(),
    coincidentWetBulbC: doublePrecision("coincident_wet_bulb_c"),
    designRhPct: doublePrecision("design_rh_pct"),
    groundTempC: doublePrecision("ground_temp_c").notNull(),
    elevationM: doublePrecision("elevation_m").notNull(),
    /** The engineering model document (rooms, doors, plant), with its own schemaVersion. */
    model: jsonb("model").$type<Record<string, unknown>>(),
    /** Bumped on every change; a save carries the version it was based on. */
    version: integer("version").notNull().default(1),
    archivedAt: timestamp("archived_at", { withTimezone: true }),
    createdBy: uuid("created_by").references(() => users.id, { onDelete: "set null" }),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp("updated_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("facilities_ws_idx").on(t.workspaceId)],
);
