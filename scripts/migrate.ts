/** Applies the committed migrations in drizzle/ to DATABASE_URL (idempotent). */
import { drizzle } from "drizzle-orm/node-postgres";
import { migrate } from "drizzle-orm/node-postgres/migrator";
import { Pool } from "pg";
import path from "node:path";

const url = process.env.DATABASE_URL ?? "postgres://rimeplan@127.0.0.1:54329/rimeplan";
const pool = new Pool({ connectionString: url, max: 1 });
try {
  await migrate(drizzle(pool), { migrationsFolder: path.resolve(import.meta.dirname, "../drizzle") });
  console.log(`[rimeplan] migrations applied to ${url.replace(/\/\/[^@]*@/, "//")}`);
} finally {
  await pool.end();
}
