import "server-only";
import { AppError } from "@/lib/errors";
import { buildSchedule } from "@/lib/engine/model";
import { computeFacilityResults, getRevision, loadFacilityModel } from "@/features/facilities/model";
import { parseEngineModel, type ModelDoc } from "@/features/facilities/engine-model";
import type { SiteConditions } from "@/features/facilities/schema";
import { revisionInfo } from "@/features/schedule/queries";
import { computeComparison } from "@/features/options/queries";

/** Everything the printable calculation report shows, for the current version or a stored revision. */
export async function loadReport(workspaceId: string, facilityId: string, rev?: number) {
  const m = await loadFacilityModel(workspaceId, facilityId);
  let model;
  let site: SiteConditions = m.site;
  let number = m.version;
  let createdAt: Date | null = null;
  let issuedAt: Date | null = null;
  if (rev !== undefined && rev !== m.version) {
    const r = await getRevision(facilityId, rev);
    site = r.site as unknown as SiteConditions;
    const parsed = parseEngineModel(r.model as ModelDoc, site);
    if (!parsed.success) throw new AppError("calculation", `Revision ${rev} cannot be computed: ${parsed.error.issues[0]?.message ?? "invalid model"}`);
    model = parsed.data;
    number = rev;
    createdAt = r.createdAt;
    issuedAt = r.issuedAt;
  } else {
    model = m.engineModel();
    if (rev !== undefined) {
      const r = await getRevision(facilityId, rev).catch(() => null);
      createdAt = r?.createdAt ?? null;
      issuedAt = r?.issuedAt ?? null;
    }
  }
  const { result, inputHash, engineVersion } = await computeFacilityResults(model);
  const revision = await revisionInfo(facilityId, number);
  // Plant options of this version, compared (annual figures on the facility's current weather year).
  const options = model.plantOptions.length ? await computeComparison(workspaceId, model, facilityId) : null;
  return { facilityName: m.row.name, currentVersion: m.version, model, site, result, inputHash, engineVersion, schedule: buildSchedule(result.plant), revision, createdAt, issuedAt, options };
}

export type ReportData = Awaited<ReturnType<typeof loadReport>>;
