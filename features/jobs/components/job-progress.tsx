"use client";
import { useEffect, useRef, type ReactNode } from "react";
import { useQuery } from "@tanstack/react-query";
import { api } from "@/lib/api-client";
import { isFinished, type JobDto } from "../schema";

const POLL_MS = 700;

function size(bytes: number): string {
  if (bytes < 1024) return `${bytes} B`;
  if (bytes < 1024 * 1024) return `${(bytes / 1024).toFixed(1)} kB`;
  return `${(bytes / 1048576).toFixed(1)} MB`;
}

/** Polls a job until it is done or failed; `onFinished` is called once with the final state. */
export function useJob(initial: JobDto, onFinished?: (job: JobDto) => void): JobDto {
  const q = useQuery({
    queryKey: ["job", initial.id],
    queryFn: async () => (await api<{ job: JobDto }>(initial.url)).job,
    initialData: initial,
    refetchInterval: (query) => (query.state.data && isFinished(query.state.data.status) ? false : POLL_MS),
    refetchIntervalInBackground: true,
    // The initial data is only the answer to the POST: ask at once.
    initialDataUpdatedAt: 0,
  });
  const job = q.data;
  const told = useRef(false);
  const cb = useRef(onFinished);
  cb.current = onFinished;
  useEffect(() => {
    if (!told.current && isFinished(job.status)) {
      told.current = true;
      cb.current?.(job);
    }
  }, [job]);
  return job;
}

/**
 * A job as the user sees it: a progress bar with what is being done, then the download (for a
 * file) or the outcome, or why it failed. The page stays usable meanwhile.
 */
export function JobProgress({ job: initial, label, onFinished, children }: { job: JobDto; label: string; onFinished?: (job: JobDto) => void; children?: (job: JobDto) => ReactNode }) {
  const job = useJob(initial, onFinished);
  const pct = Math.round(job.progress * 100);
  const waiting = job.status === "queued" && job.attempts === 0;
  return (
    <div className="flex flex-col gap-1 rounded border border-line bg-surface p-2 text-sm" data-job-status={job.status}>
      <div className="flex items-center gap-2">
        <span className="font-medium">{label}</span>
        <div
          role="progressbar"
          aria-label={`${label}: progress`}
          aria-valuemin={0}
          aria-valuemax={100}
          aria-valuenow={pct}
          aria-valuetext={`${pct}% · ${job.stage ?? job.status}`}
          className="h-2 w-48 overflow-hidden rounded bg-surface-3"
        >
          <div className={`h-full transition-[width] ${job.status === "failed" ? "bg-danger" : "bg-accent"}`} style={{ width: `${job.status === "failed" ? 100 : Math.max(pct, waiting ? 2 : 5)}%` }} />
        </div>
        <span className="tabular-nums text-xs text-muted">{job.status === "failed" ? `stopped at ${pct}%` : `${pct}%`}</span>
      </div>
      {job.status === "failed" ? (
        <div role="alert" className="text-danger">
          <p>⚠ {label} failed: {job.error ?? "no reason was recorded."}</p>
          {Array.isArray(job.result?.fields) ? (
            <ul className="mt-1 list-disc pl-5 text-xs">
              {(job.result.fields as { field: string; message: string }[]).slice(0, 100).map((f) => (
                <li key={f.field + f.message}>
                  {f.field}: {f.message}
                </li>
              ))}
            </ul>
          ) : null}
        </div>
      ) : (
        <p className={`text-xs ${job.status === "done" ? "text-ok" : "text-muted"}`} aria-live="polite">
          {job.status === "done" ? "✓ " : ""}
          {job.stage ?? (waiting ? "Waiting for a worker" : "Working")}
          {job.status === "queued" && job.attempts > 0 ? ` (attempt ${job.attempts + 1} next)` : ""}
        </p>
      )}
      {job.file ? (
        <a href={job.file.url} download={job.file.name} className="self-start text-accent underline">
          Download {job.file.name} ({size(job.file.bytes)})
        </a>
      ) : null}
      {children?.(job)}
    </div>
  );
}
