/** A database handle for scripts (seeds, fixtures): the app's schema without the server-only guard. */
import { drizzle } from "drizzle-orm/node-postgres";
import { Pool } from "pg";
import * as schema from "../db/schema";

export function openDb(url = process.env.DATABASE_URL ?? "postgres://rimeplan@127.0.0.1:54329/rimeplan") {
  const pool = new Pool({ connectionString: url, max: 2 });
  return { db: drizzle(pool, { schema }), pool };
}
