import "server-only";
import { and, eq, getTableColumns, sql } from "drizzle-orm";
import { db } from "@/db/client";
import { jobs } from "@/db/schema";
import { can, type Action, type WorkspaceAccess } from "@/lib/authz";
import { AppError } from "@/lib/errors";
import type { JobRow } from "@/lib/jobs/queue";
import type { JobDto, JobStatus } from "./schema";

/**
 * Who may see a job (its progress and result): the same permission as the work it does.
 * Kinds not listed here (e-mail) are never shown through the API.
 */
export const JOB_ACTION: Record<string, Action> = {
  "schedule.export": "schedule.export",
  "import.rooms": "model.edit",
  "import.stocking": "scenario.create",
  // The year's run is seen by everyone who reads the facility (its figures are on the Energy page).
  "energy.annual": "facility.read",
};

const base = (ws: string, id: string) => `/api/v1/workspaces/${encodeURIComponent(ws)}/jobs/${id}`;

export function jobDto(wsSlug: string, j: JobRow & { resultSize?: number | null }): JobDto {
  const size = j.resultSize ?? j.resultBytes?.length ?? 0;
  return {
    id: j.id,
    kind: j.kind,
    status: j.status as JobStatus,
    progress: j.progress,
    stage: j.stage,
    error: j.error,
    attempts: j.attempts,
    facilityId: j.facilityId,
    createdAt: j.createdAt.toISOString(),
    startedAt: j.startedAt?.toISOString() ?? null,
    finishedAt: j.finishedAt?.toISOString() ?? null,
    file: j.status === "done" && j.resultName ? { name: j.resultName, mime: j.resultMime ?? "application/octet-stream", bytes: size, url: `${base(wsSlug, j.id)}/result` } : null,
    result: j.resultJson ?? null,
    url: base(wsSlug, j.id),
  };
}

/** 202 Accepted with the job to poll. */
export function accepted(wsSlug: string, job: JobRow, reused = false): Response {
  const dto = jobDto(wsSlug, job);
  return Response.json({ job: dto, reused }, { status: 202, headers: { location: dto.url } });
}

/**
 * A job of the caller's workspace that the caller's role may see. Another workspace's job, or
 * one of a kind never shown (e-mail), is "not found"; a job the role may not see is forbidden.
 */
export async function jobFor(access: WorkspaceAccess, id: string, withBytes: boolean) {
  // The result and the uploaded file stay in the database unless the result is downloaded.
  const { resultBytes, inputBytes: _input, ...cols } = getTableColumns(jobs);
  const [row] = await db
    .select({
      ...cols,
      resultBytes: withBytes ? resultBytes : sql<Buffer | null>`null`,
      inputBytes: sql<Buffer | null>`null`,
      resultSize: sql<number | null>`octet_length(${jobs.resultBytes})`,
    })
    .from(jobs)
    .where(and(eq(jobs.id, id), eq(jobs.workspaceId, access.workspace.id)))
    .limit(1);
  const action = row ? JOB_ACTION[row.kind] : undefined;
  if (!row || !action) throw new AppError("not_found", "Job not found in this workspace.");
  if (!can(access.role, action)) throw new AppError("forbidden", `Your role (${access.role}) may not see this job: it is ${row.kind.replace(".", " ")} work.`);
  return row as JobRow & { resultSize: number | null };
}
