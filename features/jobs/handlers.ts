import "server-only";
import { deliverMail, type Mail } from "@/lib/mail";
import type { JobHandler } from "@/lib/jobs/worker";
import type { JobKind } from "@/lib/jobs/queue";
import { runScheduleExport } from "@/features/schedule/export-job";
import { importJob } from "@/features/import/job";
import { runAnnualJob } from "@/features/energy/job";

/**
 * What the worker (scripts/worker.ts) runs for each kind of job. A new kind (the annual energy
 * run) adds its options to JOB_KINDS in lib/jobs/queue.ts and its handler here.
 */
export const JOB_HANDLERS: Record<JobKind, JobHandler> = {
  "mail.send": async ({ job }) => {
    await deliverMail(job.input as unknown as Mail);
    return { stage: "Sent" };
  },
  "schedule.export": runScheduleExport,
  "import.rooms": importJob("rooms"),
  "import.stocking": importJob("stocking"),
  "energy.annual": runAnnualJob,
};
