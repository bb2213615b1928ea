import "server-only";
import { and, desc, eq, isNotNull, isNull, sql } from "drizzle-orm";
import { db } from "@/db/client";
import { facilities, facilityRevisions, weatherYears } from "@/db/schema";
import { AppError } from "@/lib/errors";
import type { FacilityDto, SiteConditions } from "./schema";
import { EMPTY_MODEL_DOC } from "./engine-model";

type Row = typeof facilities.$inferSelect;
type Tx = Parameters<Parameters<typeof db.transaction>[0]>[0];

/**
 * Every version of a facility has its revision snapshot (model and site), so a save based on
 * any version can be merged against what it started from.
 */
async function snapshot(tx: Tx | typeof db, row: Row, userId: string | null, summary: string) {
  await tx.insert(facilityRevisions).values({
    facilityId: row.id,
    number: row.version,
    model: (row.model ?? EMPTY_MODEL_DOC) as Record<string, unknown>,
    site: toDto(row).site as Record<string, unknown>,
    summary,
    createdBy: userId,
  });
}

export function toDto(r: Row): FacilityDto {
  return {
    id: r.id,
    name: r.name,
    site: {
      designDryBulbC: r.designDryBulbC,
      coincidentWetBulbC: r.coincidentWetBulbC,
      designRhPct: r.designRhPct,
      groundTempC: r.groundTempC,
      elevationM: r.elevationM,
    },
    version: r.version,
    archived: r.archivedAt !== null,
    hasModel: r.model !== null,
    createdAt: r.createdAt.toISOString(),
    updatedAt: r.updatedAt.toISOString(),
  };
}

function siteColumns(s: SiteConditions) {
  return {
    designDryBulbC: s.designDryBulbC,
    coincidentWetBulbC: s.coincidentWetBulbC ?? null,
    designRhPct: s.designRhPct ?? null,
    groundTempC: s.groundTempC,
    elevationM: s.elevationM,
  };
}

export async function listFacilities(workspaceId: string, archived: boolean): Promise<FacilityDto[]> {
  const rows = await db
    .select()
    .from(facilities)
    .where(and(eq(facilities.workspaceId, workspaceId), archived ? isNotNull(facilities.archivedAt) : isNull(facilities.archivedAt)))
    .orderBy(desc(facilities.updatedAt));
  return rows.map(toDto);
}

/** Read on every model read and save: a prepared statement, parsed and planned once per connection. */
const facilityRow = db
  .select()
  .from(facilities)
  .where(and(eq(facilities.workspaceId, sql.placeholder("workspaceId")), eq(facilities.id, sql.placeholder("id"))))
  .limit(1)
  .prepare("rimeplan_facility_row");

export async function getFacilityRow(workspaceId: string, id: string): Promise<Row> {
  const [row] = await facilityRow.execute({ workspaceId, id });
  if (!row) throw new AppError("not_found", "Facility not found in this workspace.");
  return row;
}

export async function createFacility(
  workspaceId: string,
  userId: string,
  input: { name: string; site: SiteConditions; model?: Record<string, unknown> | null },
): Promise<FacilityDto> {
  return db.transaction(async (tx) => {
    const [row] = await tx
      .insert(facilities)
      .values({ workspaceId, name: input.name, createdBy: userId, model: input.model ?? null, ...siteColumns(input.site) })
      .returning();
    await snapshot(tx, row, userId, "Created");
    return toDto(row);
  });
}

/** Updates name and/or site; with baseVersion, a stale edit is refused (409) and changes nothing. */
export async function updateFacility(
  workspaceId: string,
  id: string,
  patch: { name?: string; site?: SiteConditions; baseVersion?: number },
  userId: string | null = null,
): Promise<FacilityDto> {
  const current = await getFacilityRow(workspaceId, id);
  if (patch.baseVersion !== undefined && patch.baseVersion !== current.version) {
    throw new AppError("conflict", `The facility changed since you opened it (version ${current.version}, yours ${patch.baseVersion}). Reload and apply your change again.`, undefined, undefined, { current: toDto(current) });
  }
  return db.transaction(async (tx) => {
    const [row] = await tx
      .update(facilities)
      .set({
        ...(patch.name !== undefined ? { name: patch.name } : {}),
        ...(patch.site ? siteColumns(patch.site) : {}),
        version: sql`${facilities.version} + 1`,
        updatedAt: new Date(),
      })
      .where(and(eq(facilities.workspaceId, workspaceId), eq(facilities.id, id), eq(facilities.version, current.version)))
      .returning();
    if (!row) throw new AppError("conflict", "The facility changed while saving. Reload and apply your change again.");
    await snapshot(tx, row, userId, patch.site ? "Site conditions changed" : "Renamed");
    return toDto(row);
  });
}

export async function duplicateFacility(workspaceId: string, userId: string, id: string, name?: string): Promise<FacilityDto> {
  const src = await getFacilityRow(workspaceId, id);
  return db.transaction(async (tx) => {
  const [row] = await tx
    .insert(facilities)
    .values({
      workspaceId,
      name: name ?? `${src.name} (copy)`.slice(0, 120),
      designDryBulbC: src.designDryBulbC,
      coincidentWetBulbC: src.coincidentWetBulbC,
      designRhPct: src.designRhPct,
      groundTempC: src.groundTempC,
      elevationM: src.elevationM,
      model: src.model,
      createdBy: userId,
    })
    .returning();
  await snapshot(tx, row, userId, `Duplicated from ${src.name}`);
  // The copy stands on the same site: it keeps the facility's weather year (the newest).
  const [w] = await tx.select().from(weatherYears).where(and(eq(weatherYears.workspaceId, workspaceId), eq(weatherYears.facilityId, src.id))).orderBy(desc(weatherYears.createdAt)).limit(1);
  if (w) {
    const { id: _id, createdAt: _at, ...rest } = w;
    void _id;
    void _at;
    await tx.insert(weatherYears).values({ ...rest, facilityId: row.id, createdBy: userId });
  }
  return toDto(row);
  });
}

export async function setArchived(workspaceId: string, id: string, archived: boolean): Promise<FacilityDto> {
  await getFacilityRow(workspaceId, id);
  const [row] = await db
    .update(facilities)
    // Archiving is not an engineering change: the version (and revision history) stays.
    .set({ archivedAt: archived ? new Date() : null, updatedAt: new Date() })
    .where(and(eq(facilities.workspaceId, workspaceId), eq(facilities.id, id)))
    .returning();
  return toDto(row);
}
