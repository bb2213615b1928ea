import "server-only";
import { and, desc, eq } from "drizzle-orm";
import { db } from "@/db/client";
import { annualResults } from "@/db/schema";
import { AppError } from "@/lib/errors";
import type { JobContext, JobOutput } from "@/lib/jobs/worker";
import { LoadInputError } from "@/lib/engine/loads";
import { facilityFluidsNeeded } from "@/lib/engine/model";
import { loadFluid } from "@/lib/engine/thermo";
import { ANNUAL_ENGINE_VERSION, runAnnual, type AnnualResult, type WeatherYear } from "@/lib/engine/annual";
import { inputHashOf, loadFacilityModel } from "@/features/facilities/model";
import { currentWeather, type WeatherRow } from "./weather";

/** The stored weather row in the engine's shape. */
export function toWeatherYear(w: WeatherRow): WeatherYear {
  return {
    source: { kind: w.kind as WeatherYear["source"]["kind"], label: w.label },
    year: w.year,
    startWeekday: w.startWeekday,
    dryBulbC: w.dryBulbC,
    rhPct: w.rhPct,
    ...(w.pressurePa != null ? { pressurePa: w.pressurePa } : {}),
  };
}

/**
 * The annual energy run ("energy.annual"): the facility's current model and weather year,
 * through the annual engine, stored with its stamps (model version and input hash, weather
 * id, engine version). A run whose stamps match the newest stored result stores nothing new.
 * A model the engine refuses fails the job at once with the fields named.
 */
export async function runAnnualJob(ctx: JobContext): Promise<JobOutput> {
  const { job } = ctx;
  if (!job.workspaceId || !job.facilityId) throw new AppError("not_found", "The run has no facility any more.");
  await ctx.progress(0.05, "Reading the model and the weather year");
  const m = await loadFacilityModel(job.workspaceId, job.facilityId);
  const weather = await currentWeather(job.workspaceId, job.facilityId);
  if (!weather) throw new AppError("validation", "The facility has no weather year: upload one or enter monthly means.", "weather");
  const model = m.engineModel();
  const inputHash = inputHashOf(model);
  const [latest] = await db
    .select({ id: annualResults.id, inputHash: annualResults.inputHash, weatherId: annualResults.weatherId, engineVersion: annualResults.engineVersion })
    .from(annualResults)
    .where(and(eq(annualResults.workspaceId, job.workspaceId), eq(annualResults.facilityId, job.facilityId)))
    .orderBy(desc(annualResults.createdAt))
    .limit(1);
  if (latest && latest.inputHash === inputHash && latest.weatherId === weather.id && latest.engineVersion === ANNUAL_ENGINE_VERSION)
    return { json: { resultId: latest.id, reused: true }, stage: `Already up to date for model version ${m.version} and this weather year.` };
  await ctx.progress(0.15, "Loading refrigerant properties");
  await Promise.all(facilityFluidsNeeded(model).map((id) => loadFluid(id)));
  await ctx.progress(0.25, `Running ${weather.hours} hours (${weather.label})`);
  const t0 = performance.now();
  let result: AnnualResult;
  try {
    result = runAnnual(model, toWeatherYear(weather));
  } catch (e) {
    if (e instanceof LoadInputError) throw new AppError("validation", e.message, e.field, e.issues.map((i) => ({ field: i.field, message: i.message })));
    const err = e as Error & { field?: string };
    if (err && typeof err.field === "string") throw new AppError("calculation", err.message, err.field);
    throw e;
  }
  const computeMs = Math.round(performance.now() - t0);
  await ctx.progress(0.9, "Storing the year's figures");
  const [row] = await db
    .insert(annualResults)
    .values({
      workspaceId: job.workspaceId,
      facilityId: job.facilityId,
      modelVersion: m.version,
      inputHash,
      weatherId: weather.id,
      engineVersion: result.engineVersion ?? ANNUAL_ENGINE_VERSION,
      result: result as unknown as Record<string, unknown>,
      computeMs,
      jobId: job.id,
    })
    .returning({ id: annualResults.id });
  const mwh = result.facility.kWh / 1000;
  return {
    json: { resultId: row.id, reused: false, kWh: result.facility.kWh, computeMs },
    stage: `Year computed for model version ${m.version}: ${mwh.toFixed(mwh >= 100 ? 0 : 1)} MWh(e) in ${computeMs} ms.`,
  };
}
