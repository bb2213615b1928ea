import "server-only";
import { and, desc, eq, inArray } from "drizzle-orm";
import { db } from "@/db/client";
import { annualResults, jobs } from "@/db/schema";
import { AppError } from "@/lib/errors";
import { enqueue, type JobRow } from "@/lib/jobs/queue";
import { ANNUAL_ENGINE_VERSION } from "@/lib/engine/annual";
import { log } from "@/lib/log";
import { getFacilityRow } from "@/features/facilities/queries";
import { inputHashOf, loadFacilityModel } from "@/features/facilities/model";
import { currentWeather, type WeatherRow } from "./weather";

export const ANNUAL_JOB_KIND = "energy.annual";
export type AnnualResultRow = typeof annualResults.$inferSelect;

/**
 * Queues a run of the facility's year on the worker (the page never waits for it). One job per
 * model version and weather year: asking again while it is queued or running returns that job.
 * Without a weather year there is nothing to run: null, or (when `required`) a 400 saying how
 * to give one.
 */
export async function requestAnnualRun(args: { workspaceId: string; facilityId: string; userId: string; reason: string; required?: boolean }): Promise<JobRow | null> {
  const f = await getFacilityRow(args.workspaceId, args.facilityId);
  const weather = await currentWeather(args.workspaceId, args.facilityId);
  if (!weather) {
    if (args.required) throw new AppError("validation", "The facility has no weather year yet: upload an hourly file (.csv or .epw) or enter monthly means first.", "weather");
    return null;
  }
  const { job } = await enqueue({
    kind: ANNUAL_JOB_KIND,
    workspaceId: args.workspaceId,
    facilityId: args.facilityId,
    createdBy: args.userId,
    input: { version: f.version, weatherId: weather.id, reason: args.reason },
    dedupeKey: `${args.facilityId}:${f.version}:${weather.id}`,
    stage: `Waiting to run the year (${args.reason})`,
  });
  return job;
}

/** The newest stored annual result of a facility, or null. */
export async function latestAnnualResult(workspaceId: string, facilityId: string): Promise<AnnualResultRow | null> {
  const [r] = await db
    .select()
    .from(annualResults)
    .where(and(eq(annualResults.workspaceId, workspaceId), eq(annualResults.facilityId, facilityId)))
    .orderBy(desc(annualResults.createdAt))
    .limit(1);
  return r ?? null;
}

/** The newest energy run of the facility that is still queued or running, or null. */
export async function pendingAnnualJob(workspaceId: string, facilityId: string): Promise<JobRow | null> {
  const [j] = await db
    .select()
    .from(jobs)
    .where(and(eq(jobs.workspaceId, workspaceId), eq(jobs.facilityId, facilityId), eq(jobs.kind, ANNUAL_JOB_KIND), inArray(jobs.status, ["queued", "running"])))
    .orderBy(desc(jobs.createdAt))
    .limit(1);
  return j ?? null;
}

/** The newest failed run that came after the newest result (to say why the figures are not new). */
export async function failedAnnualJobSince(workspaceId: string, facilityId: string, since: Date | null): Promise<JobRow | null> {
  const [j] = await db
    .select()
    .from(jobs)
    .where(and(eq(jobs.workspaceId, workspaceId), eq(jobs.facilityId, facilityId), eq(jobs.kind, ANNUAL_JOB_KIND)))
    .orderBy(desc(jobs.createdAt))
    .limit(1);
  if (!j || j.status !== "failed") return null;
  return since && j.createdAt < since ? null : j;
}

/** The stamps of the facility as it is now, to compare with a stored result's. */
export async function currentStamps(workspaceId: string, facilityId: string, weather: WeatherRow | null) {
  const m = await loadFacilityModel(workspaceId, facilityId);
  let inputHash: string | null = null;
  let modelError: string | null = null;
  try {
    inputHash = inputHashOf(m.engineModel());
  } catch (e) {
    modelError = e instanceof AppError ? e.message : String(e);
  }
  return { version: m.version, inputHash, modelError, weatherId: weather?.id ?? null, engineVersion: ANNUAL_ENGINE_VERSION };
}

/** Why a stored result no longer describes the facility (empty when it does). */
export function staleReasons(r: Pick<AnnualResultRow, "inputHash" | "weatherId" | "engineVersion" | "modelVersion">, now: Awaited<ReturnType<typeof currentStamps>>): string[] {
  const out: string[] = [];
  if (now.inputHash !== null && r.inputHash !== now.inputHash) out.push(`the model changed since version ${r.modelVersion}`);
  if (now.weatherId !== null && r.weatherId !== now.weatherId) out.push("the weather year changed");
  if (r.engineVersion !== now.engineVersion) out.push(`the engine changed (${r.engineVersion} → ${now.engineVersion})`);
  return out;
}

/**
 * After a model edit: queue the year again (one job per version and weather). Never fails the
 * edit: a queue that cannot be reached is logged, and the Energy page asks again when opened.
 */
export async function rerunAfterModelChange(workspaceId: string, facilityId: string, userId: string): Promise<void> {
  try {
    await requestAnnualRun({ workspaceId, facilityId, userId, reason: "model edited" });
  } catch (e) {
    log("warn", "annual run not queued after a model edit", { facilityId, error: String((e as Error)?.message ?? e) });
  }
}
