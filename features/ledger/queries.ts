import "server-only";
import { AppError } from "@/lib/errors";
import type { FacilityResult } from "@/lib/engine/model";
import { computeFacilityResults, loadFacilityModel } from "@/features/facilities/model";

export type ServerResults =
  | { ok: true; version: number; result: FacilityResult; inputHash: string; engineVersion: string; empty: boolean }
  | { ok: false; version: number; message: string; field?: string };

/**
 * The server's results for the facility's current version (the same computation as
 * GET …/results), or the validation / calculation problem that stops them.
 */
export async function serverResults(workspaceId: string, facilityId: string): Promise<ServerResults> {
  const m = await loadFacilityModel(workspaceId, facilityId);
  try {
    const r = await computeFacilityResults(m.engineModel());
    return { ok: true, version: m.version, ...r, empty: m.doc.rooms.length === 0 };
  } catch (e) {
    if (e instanceof AppError && (e.code === "validation" || e.code === "calculation")) return { ok: false, version: m.version, message: e.message, field: e.field };
    throw e;
  }
}
