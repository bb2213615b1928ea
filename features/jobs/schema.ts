import { z } from "zod";

export const jobParams = z.object({ ws: z.string().min(1), id: z.string().uuid("Job id must be a UUID") });

export const JOB_STATUSES = ["queued", "running", "done", "failed"] as const;
export type JobStatus = (typeof JOB_STATUSES)[number];

/** What the API answers about a job: the user's view of slow work. */
export interface JobDto {
  id: string;
  kind: string;
  status: JobStatus;
  /** 0…1 */
  progress: number;
  /** What is being done, in words. */
  stage: string | null;
  /** Why it failed, in words (or why the last attempt failed while it is retried). */
  error: string | null;
  attempts: number;
  facilityId: string | null;
  createdAt: string;
  startedAt: string | null;
  finishedAt: string | null;
  /** A file to download when done: name, type, size and the URL. */
  file: { name: string; mime: string; bytes: number; url: string } | null;
  /** A structured outcome (an import's result; for a refused import, `fields` names the rows). */
  result: Record<string, unknown> | null;
  /** Where to poll. */
  url: string;
}

export const isFinished = (s: JobStatus) => s === "done" || s === "failed";
