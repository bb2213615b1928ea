/**
 * The stored model document and the engine's facility model. The document holds rooms,
 * doors, plant and options (and, optionally, engine site settings beyond the five design
 * conditions, e.g. the heated-slab temperature); the facility's site conditions are stored
 * once, on the facility, and always win. Pure: used by the server and the browser worker.
 */
import { facilityModelSchema, FACILITY_SCHEMA_VERSION, type FacilityModel } from "@/lib/engine/model";
import type { SiteConditions } from "./schema";

export interface ModelDoc {
  schemaVersion: number;
  site?: Record<string, unknown>;
  rooms: unknown[];
  doors: unknown[];
  plant?: Record<string, unknown>;
  options?: Record<string, unknown>;
  [k: string]: unknown;
}

export const EMPTY_MODEL_DOC: ModelDoc = { schemaVersion: FACILITY_SCHEMA_VERSION, rooms: [], doors: [], plant: {} };

/**
 * Upgrade functions, one per schema version step, applied in order when a stored document
 * is older than the engine's. Version 1 is the first; a new step goes here with its test.
 */
const UPGRADES: Record<number, (doc: ModelDoc) => ModelDoc> = {};

export function upgradeDoc(doc: ModelDoc): ModelDoc {
  let d = doc;
  while (d.schemaVersion < FACILITY_SCHEMA_VERSION) {
    const step = UPGRADES[d.schemaVersion];
    if (!step) throw new Error(`No upgrade from model schema version ${d.schemaVersion}`);
    d = step(d);
  }
  return d;
}

/** The engine input: the document with the facility's site conditions applied. */
export function toEngineInput(doc: ModelDoc, site: SiteConditions): Record<string, unknown> {
  const { site: extras, ...rest } = upgradeDoc(doc);
  return {
    ...rest,
    site: {
      ...(extras ?? {}),
      designDryBulbC: site.designDryBulbC,
      ...(site.coincidentWetBulbC != null ? { coincidentWetBulbC: site.coincidentWetBulbC } : {}),
      ...(site.designRhPct != null ? { designRH: site.designRhPct } : {}),
      groundTempC: site.groundTempC,
      elevationM: site.elevationM,
    },
  };
}

/** Parses the engine input; errors carry paths into the model (e.g. `model.rooms.0.setPointC`). */
export function parseEngineModel(doc: ModelDoc, site: SiteConditions) {
  return facilityModelSchema.safeParse(toEngineInput(doc, site));
}

export type { FacilityModel };
