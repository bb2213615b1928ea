import { pgTable, text, timestamp, uuid, index, jsonb, real, integer, customType } from "drizzle-orm/pg-core";
import { users } from "./auth";
import { workspaces } from "./workspaces";
import { facilities } from "./facilities";

const bytea = customType<{ data: Buffer; driverData: Buffer }>({ dataType: () => "bytea" });

/**
 * Events counted by the throttles that must hold across app instances and restarts: password
 * reset and sign-in link requests, e-mails sent per user and per workspace. One row per event;
 * `bucket` names the limit, `key` what it is counted for (an address, a client, a user id).
 */
export const throttleEvents = pgTable(
  "throttle_events",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    bucket: text("bucket").notNull(),
    key: text("key").notNull(),
    at: timestamp("at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("throttle_events_bucket_key_at_idx").on(t.bucket, t.key, t.at)],
);

/**
 * What a person sees of slow work done by the worker (exports, imports, e-mail, long runs):
 * its state, progress and stage, the reason it failed, and its result. The queue itself (retry,
 * backoff, one run at a time) is the job-queue package's own tables; this row is the user's view.
 */
export const jobs = pgTable(
  "jobs",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    workspaceId: uuid("workspace_id").references(() => workspaces.id, { onDelete: "cascade" }),
    facilityId: uuid("facility_id").references(() => facilities.id, { onDelete: "cascade" }),
    kind: text("kind").notNull(),
    /** queued | running | done | failed */
    status: text("status").notNull().default("queued"),
    /** 0…1 */
    progress: real("progress").notNull().default(0),
    stage: text("stage"),
    error: text("error"),
    attempts: integer("attempts").notNull().default(0),
    input: jsonb("input").$type<Record<string, unknown>>().notNull().default({}),
    /** An uploaded file the job works on (an import), kept in the database so any worker reads it. */
    inputBytes: bytea("input_bytes"),
    resultJson: jsonb("result_json").$type<Record<string, unknown>>(),
    resultName: text("result_name"),
    resultMime: text("result_mime"),
    resultBytes: bytea("result_bytes"),
    createdBy: uuid("created_by").references(() => users.id, { onDelete: "set null" }),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
    startedAt: timestamp("started_at", { withTimezone: true }),
    finishedAt: timestamp("finished_at", { withTimezone: true }),
    updatedAt: timestamp("updated_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("jobs_workspace_idx").on(t.workspaceId, t.createdAt), index("jobs_facility_idx").on(t.facilityId, t.createdAt)],
);
