import { pool } from "@/db/client";
import { log } from "@/lib/log";

export const dynamic = "force-dynamic";

/** Liveness and database check for monitors: 200 when PostgreSQL answers, 503 otherwise. */
export async function GET() {
  const started = performance.now();
  try {
    await pool.query("select 1");
    return Response.json({ status: "ok", database: "ok", ms: Math.round(performance.now() - started) });
  } catch (e) {
    log("error", "health check failed", { error: String(e) });
    return Response.json({ status: "degraded", database: "unreachable" }, { status: 503 });
  }
}
