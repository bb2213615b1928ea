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

const worker = await startWorker({ handlers: JOB_HANDLERS });
// The browser tests wait for this line (playwright.config.ts).
console.log(`worker ready: ${Object.keys(JOB_HANDLERS).join(", ")} · ${env.JOBS_CONCURRENCY} at a time per kind · polling every ${env.JOBS_POLL_SECONDS} s`);

let stopping = false;
const stop = async (signal: string) => {
  if (stopping) return;
  stopping = true;
  console.log(`worker stopping (${signal})`);
  await worker.stop();
  process.exit(0);
};
process.on("SIGINT", () => void stop("SIGINT"));
process.on("SIGTERM", () => void stop("SIGTERM"));
