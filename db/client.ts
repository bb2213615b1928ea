import "server-only";
import { drizzle } from "drizzle-orm/node-postgres";
import { Pool } from "pg";
import { env } from "@/lib/env";
import { log } from "@/lib/log";
import * as schema from "./schema";

const globalForDb = globalThis as unknown as { rimeplanPool?: Pool };

function makePool(): Pool {
  const p = new Pool({
    connectionString: env.DATABASE_URL,
    max: 10,
    // A request waits at most this long for a connection, then answers 503 instead of hanging.
    connectionTimeoutMillis: 5_000,
    // Notice a peer that vanished (a failover, a cable) on idle connections.
    keepAlive: true,
  });
  // An idle connection that the server ends (a restart, a failover, an admin's terminate) is
  // reported here; without a listener Node would end the process. The pool drops that client
  // and opens a fresh one for the next request, so the app recovers by itself.
  // (The client's own listener below logs it.)
  p.on("error", () => {});
  // The same for a connection that is checked out but between queries (inside a transaction,
  // while the app computes): the transaction's next query fails (answered 503) and the pool
  // discards the broken client when it is released.
  p.on("connect", (client) => {
    client.on("error", (e) => {
      log("warn", "database connection lost (requests using it answer 503; the pool reconnects)", {
        error: String(e),
        code: (e as { code?: string }).code,
      });
    });
  });
  return p;
}

// One pool per process (Next's dev server reloads modules; keep the pool across reloads).
const pool = globalForDb.rimeplanPool ?? makePool();
globalForDb.rimeplanPool = pool;

export const db = drizzle(pool, { schema });
export type Db = typeof db;
export { pool };
