import "server-only";
import { AppError } from "@/lib/errors";
import { audit } from "@/lib/audit";
import { getFluid, loadFluid } from "@/lib/engine/thermo";
import type { FacilityModel } from "@/lib/engine/model";
import { compareOptions, optionFluidsNeeded, type AnnualSummary, type OptionsComparison } from "@/lib/engine/compare-options";
import { OptionEditError } from "@/lib/engine/options";
import { PRACTICAL_LIMITS } from "@/lib/engine/plant/tewi";
import { CODES_NOTICE } from "@/lib/engine/plant/safety";
import { loadFacilityModel, saveFacilityModel } from "@/features/facilities/model";
import type { ModelDoc } from "@/features/facilities/engine-model";
import { annualForPlants } from "./annual";
import { rerunAfterModelChange } from "@/features/energy/runs";
import type { OptionsDto } from "./schema";

/**
 * The comparison of the design plant and every option of a facility's current version,
 * computed on the server (the design hour and the charge in milliseconds; the year, when the
 * facility has a weather year, by the annual engine on each plant — see ./annual.ts).
 */
export async function computeComparison(workspaceId: string, model: FacilityModel, facilityId: string): Promise<{ comparison: OptionsComparison; weather: OptionsDto["weather"]; annualNote: string | null; currency: string }> {
  await Promise.all(optionFluidsNeeded(model).map((id) => loadFluid(id)));
  const annual = await annualForPlants(workspaceId, facilityId, model);
  return {
    comparison: compareOptions(model, { getFluid, annual: annual.byPlant as ReadonlyMap<string, AnnualSummary>, annualErrors: annual.errors }),
    weather: annual.weather,
    annualNote: annual.note,
    currency: annual.currency,
  };
}

export async function optionsDto(workspaceId: string, facilityId: string): Promise<OptionsDto> {
  const t0 = performance.now();
  const m = await loadFacilityModel(workspaceId, facilityId);
  const model = m.engineModel();
  const c = await computeComparison(workspaceId, model, facilityId);
  return {
    facilityName: m.row.name,
    version: m.version,
    ...c,
    practicalLimits: PRACTICAL_LIMITS,
    codesNotice: CODES_NOTICE,
    computeMs: Math.round(performance.now() - t0),
  };
}

/**
 * Applies an option edit (lib/engine/options.ts) to the current document and saves it as a
 * new version and revision through the model's save path (validation, merge, revision), with
 * an audit record. Edits that cannot apply answer 404 / 400 naming the field.
 */
export async function editOptions(args: {
  workspaceId: string;
  facilityId: string;
  user: { id: string; email: string };
  summary: string;
  edit: (doc: ModelDoc) => ModelDoc;
}): Promise<{ version: number }> {
  const m = await loadFacilityModel(args.workspaceId, args.facilityId);
  let doc: ModelDoc;
  try {
    doc = args.edit(m.doc);
  } catch (e) {
    if (e instanceof OptionEditError) throw new AppError(e.code, e.message, e.field);
    throw e;
  }
  const r = await saveFacilityModel({ workspaceId: args.workspaceId, facilityId: args.facilityId, userId: args.user.id, baseVersion: m.version, doc, summary: args.summary });
  await audit({
    workspaceId: args.workspaceId,
    actorId: args.user.id,
    actorEmail: args.user.email,
    action: "model.edited",
    targetType: "facility",
    targetId: args.facilityId,
    detail: { version: r.version, baseVersion: m.version, rebased: r.rebased, summary: args.summary },
  });
  // As after any model edit: the facility's stored year is queued again (the design may have changed).
  if (r.version !== m.version) await rerunAfterModelChange(args.workspaceId, args.facilityId, args.user.id);
  return { version: r.version };
}

/** A fresh option id (letters and digits, unique in the document). */
export function newOptionId(doc: ModelDoc): string {
  const used = new Set(((doc.plantOptions as { id: string }[] | undefined) ?? []).map((o) => o.id));
  for (;;) {
    const id = `opt-${crypto.randomUUID().slice(0, 8)}`;
    if (!used.has(id)) return id;
  }
}
