import "server-only";
import { can, type WorkspaceAccess } from "@/lib/authz";
import type { AnnualResult } from "@/lib/engine/annual";
import { jobDto } from "@/features/jobs/queries";
import type { JobDto } from "@/features/jobs";
import { getWorkspaceSettings } from "@/features/team/settings";
import { currentWeather, weatherById, weatherDto } from "./weather";
import { currentStamps, failedAnnualJobSince, latestAnnualResult, pendingAnnualJob, staleReasons } from "./runs";
import type { WeatherDto } from "./schema";

export interface EnergyViewDto {
  weather: WeatherDto | null;
  /** The newest stored result with its stamps; `weather` is the year it was computed with. */
  result: null | {
    id: string;
    modelVersion: number;
    inputHash: string;
    engineVersion: string;
    computeMs: number | null;
    createdAt: string;
    weather: { id: string; label: string; kind: string; year: number } | null;
    annual: AnnualResult;
  };
  /** Why the stored result no longer describes the facility (empty when it does). */
  stale: string[];
  current: { version: number; inputHash: string | null; modelError: string | null };
  job: JobDto | null;
  failed: JobDto | null;
  currency: string;
  canRun: boolean;
}

export async function energyView(access: WorkspaceAccess, facilityId: string): Promise<EnergyViewDto> {
  const wsId = access.workspace.id;
  const weather = await currentWeather(wsId, facilityId);
  const now = await currentStamps(wsId, facilityId, weather); // not_found for another workspace's facility
  const r = await latestAnnualResult(wsId, facilityId);
  const used = r ? (r.weatherId === weather?.id ? weather : await weatherById(wsId, r.weatherId)) : null;
  const job = await pendingAnnualJob(wsId, facilityId);
  const failed = job ? null : await failedAnnualJobSince(wsId, facilityId, r?.createdAt ?? null);
  return {
    weather: weather ? weatherDto(weather) : null,
    result: r
      ? {
          id: r.id,
          modelVersion: r.modelVersion,
          inputHash: r.inputHash,
          engineVersion: r.engineVersion,
          computeMs: r.computeMs,
          createdAt: r.createdAt.toISOString(),
          weather: used ? { id: used.id, label: used.label, kind: used.kind, year: used.year } : null,
          annual: r.result as unknown as AnnualResult,
        }
      : null,
    stale: r ? staleReasons(r, now) : [],
    current: { version: now.version, inputHash: now.inputHash, modelError: now.modelError },
    job: job ? jobDto(access.workspace.slug, job) : null,
    failed: failed ? jobDto(access.workspace.slug, failed) : null,
    currency: (await getWorkspaceSettings(wsId)).currency,
    canRun: can(access.role, "model.edit"),
  };
}
