import "server-only";
import { drizzle } from "drizzle-orm/node-postgres";
import { Pool } from "pg";
import { env } from "@/lib/env";
import * as schema from "./schema";

const globalForDb = globalThis as unknown as { rimeplanPool?: Pool };

// One pool per process (Next's dev server reloads modules; keep the pool across reloads).
const pool = globalForDb.rimeplanPool ?? new Pool({ connectionString: env.DATABASE_URL, max: 10 });
globalForDb.rimeplanPool = pool;

export const db = drizzle(pool, { schema });
export type Db = typeof db;
export { pool };
