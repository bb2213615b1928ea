import { pool } from "@/db/client";
import { DATABASE_UNAVAILABLE_MESSAGE } from "@/lib/db-errors";
import { log } from "@/lib/log";

export const dynamic = "force-dynamic";

/**
 * Liveness and database check for monitors and load balancers: 200 when PostgreSQL answers,
 * 503 (with the reason) while it does not; it answers again by itself once the database is back.
 */
export async function GET() {
  const started = performance.now();
  try {
    await pool.query("select 1");
    return Response.json({ status: "ok", database: "ok", ms: Math.round(performance.now() - started) });
  } catch (e) {
    log("error", "health check failed", { error: String(e) });
    return Response.json(
      {
        status: "degraded",
        database: "unreachable",
        error: { code: "unavailable", message: DATABASE_UNAVAILABLE_MESSAGE },
      },
      { status: 503, headers: { "retry-after": "5", "cache-control": "no-store" } },
    );
  }
}
