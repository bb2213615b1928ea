/**
 * The job worker: runs the slow work the app queues (e-mail, schedule exports, imports) from
 * the pg-boss queue in PostgreSQL. Start one or more beside the app (`npm run worker`; `npm run
 * demo` and the browser tests start one); each job goes to exactly one worker. Stops cleanly on
 * SIGINT/SIGTERM: the job in hand is finished (up to 30 s) or handed back to be retried.
 *
 * Runs under the `react-server` export condition (see package.json) so that the feature
 * modules' `server-only` guard lets it in. Environment: DATABASE_URL, SMTP_HOST/SMTP_PORT,
 * MAIL_FROM, APP_URL, JOBS_POLL_SECONDS, JOBS_CONCURRENCY (lib/env.ts).
 */
import { startWorker } from "@/lib/jobs/worker";
import { JOB_HANDLERS } from "@/features/jobs/handlers";
import { env } from "@/lib/env";

let stopping = false;
const stop = async (signal: string) => {
  if (stopping) return;
  stopping = true;
  console.log(`worker stopping (${signal})`);
  await worker?.stop();
  process.exit(0);
};
process.on("SIGINT", () => void stop("SIGINT"));
process.on("SIGTERM", () => void stop("SIGTERM"));

// The database may not be up yet (a machine starting, a managed database failing over): retry.
let worker: Awaited<ReturnType<typeof startWorker>> | null = null;
for (let attempt = 1; !worker; attempt++) {
  try {
    worker = await startWorker({ handlers: JOB_HANDLERS });
  } catch (e) {
    console.error(`worker cannot reach the database yet (${(e as Error).message}); trying again in 5 s`);
    if (attempt === 1 && !process.env.DATABASE_URL) console.error("DATABASE_URL is not set: the default local database is used.");
    await new Promise((r) => setTimeout(r, 5_000));
  }
}
// The browser tests wait for this line (playwright.config.ts).
console.log(`worker ready: ${Object.keys(JOB_HANDLERS).join(", ")} · ${env.JOBS_CONCURRENCY} at a time per kind · polling every ${env.JOBS_POLL_SECONDS} s`);

