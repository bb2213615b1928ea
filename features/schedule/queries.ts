import "server-only";
import { and, desc, eq, like } from "drizzle-orm";
import { db } from "@/db/client";
import { exportsLog, facilityRevisions, users } from "@/db/schema";
import { audit } from "@/lib/audit";
import { buildSchedule, type FacilityModel } from "@/lib/engine/model";
import type { ScheduleItem } from "@/lib/engine/plant/schedule";
import type { UnitSystem } from "@/lib/units";
import { computeFacilityResults, loadFacilityModel } from "@/features/facilities/model";
import { scheduleChanges } from "./changes";
import { computeComparison } from "@/features/options/queries";
import { CODES_NOTICE } from "@/lib/engine/plant/safety";
import type { RevisionInfo, WorkbookInput } from "./workbook";
import type { ScheduleDto } from "./schema";

export async function revisionInfo(facilityId: string, version: number): Promise<RevisionInfo> {
  const [r] = await db
    .select({ letter: facilityRevisions.issuedLetter, status: facilityRevisions.issuedStatus, checkedBy: facilityRevisions.checkedBy, issuedAt: facilityRevisions.issuedAt })
    .from(facilityRevisions)
    .where(and(eq(facilityRevisions.facilityId, facilityId), eq(facilityRevisions.number, version)))
    .limit(1);
  return { number: version, letter: r?.letter ?? null, status: r?.status ?? null, issued: Boolean(r?.issuedAt), checkedBy: r?.checkedBy ?? null };
}

async function lastScheduleExport(facilityId: string) {
  const [r] = await db
    .select({ at: exportsLog.createdAt, revisionNumber: exportsLog.revisionNumber, issued: exportsLog.issued, kind: exportsLog.kind, snapshot: exportsLog.scheduleSnapshot, by: users.name })
    .from(exportsLog)
    .leftJoin(users, eq(users.id, exportsLog.actorId))
    .where(and(eq(exportsLog.facilityId, facilityId), like(exportsLog.kind, "schedule.%")))
    .orderBy(desc(exportsLog.createdAt))
    .limit(1);
  return r ?? null;
}

function names(model: FacilityModel, result: { plant: { circuits: { id: string; tag: string }[] } }) {
  return {
    roomNames: Object.fromEntries(model.rooms.map((r) => [r.id, r.name])),
    circuitTags: Object.fromEntries(result.plant.circuits.map((c) => [c.id, c.tag])),
  };
}

/** Everything the schedule view and the exports need, computed on the server from the current version. */
export async function loadSchedule(workspaceId: string, facilityId: string) {
  const m = await loadFacilityModel(workspaceId, facilityId);
  const model = m.engineModel();
  const { result } = await computeFacilityResults(model);
  const schedule = buildSchedule(result.plant);
  const [revision, last] = await Promise.all([revisionInfo(facilityId, m.version), lastScheduleExport(facilityId)]);
  const changes = scheduleChanges(schedule, (last?.snapshot as ScheduleItem[] | null) ?? null);
  return { m, model, result, schedule, revision, last, changes };
}

export async function scheduleDto(workspaceId: string, facilityId: string): Promise<ScheduleDto> {
  const s = await loadSchedule(workspaceId, facilityId);
  const { roomNames, circuitTags } = names(s.model, s.result);
  return {
    facilityName: s.m.row.name,
    version: s.m.version,
    revision: s.revision,
    rows: s.schedule.map((r) => ({
      ...r,
      roomName: r.roomId ? (roomNames[r.roomId] ?? r.roomId) : null,
      circuitTag: r.circuitId ? (circuitTags[r.circuitId] ?? r.circuitId) : null,
      mark: s.changes.byTag[r.tag] ?? { status: "same" },
    })),
    removed: s.changes.removed,
    firstExport: s.changes.firstExport,
    lastExport: s.last ? { at: s.last.at.toISOString(), by: s.last.by ?? "(removed user)", revisionNumber: s.last.revisionNumber, issued: s.last.issued, kind: s.last.kind } : null,
    warnings: s.result.plant.warnings.map((w) => w.message),
  };
}

/** Builds the workbook input for an export and records the export (who, when, which revision, issued or not). */
export async function prepareExport(args: { workspaceId: string; facilityId: string; user: { id: string; email: string; name: string; unitSystem: UnitSystem }; kind: "schedule.xlsx" | "schedule.csv" }) {
  const s = await loadSchedule(args.workspaceId, args.facilityId);
  const site = s.m.site;
  // A facility with plant options gets the comparison on its own sheets beside the schedule's.
  const oc = s.model.plantOptions.length ? await computeComparison(args.workspaceId, s.model, args.facilityId) : null;
  const input: WorkbookInput = {
    facilityName: s.m.row.name,
    result: s.result,
    schedule: s.schedule,
    site: { designDryBulbC: site.designDryBulbC, coincidentWetBulbC: site.coincidentWetBulbC, designRH: site.designRhPct, groundTempC: site.groundTempC, elevationM: site.elevationM },
    rooms: s.model.rooms.map((r) => ({ id: r.id, name: r.name, setPointC: r.setPointC })),
    revision: s.revision,
    unitSystem: args.user.unitSystem,
    exportedAt: new Date(),
    exportedBy: `${args.user.name} <${args.user.email}>`,
    changes: s.changes,
    options: oc ? { comparison: oc.comparison, currency: oc.currency, weatherLabel: oc.weather?.label ?? null, codesNotice: CODES_NOTICE } : undefined,
  };
  const record = async () => {
    await db.insert(exportsLog).values({
      workspaceId: args.workspaceId,
      facilityId: args.facilityId,
      revisionNumber: s.revision.number,
      issued: s.revision.issued,
      kind: args.kind,
      actorId: args.user.id,
      scheduleSnapshot: s.schedule as unknown[],
    });
    await audit({
      workspaceId: args.workspaceId,
      actorId: args.user.id,
      actorEmail: args.user.email,
      action: "export.created",
      targetType: "facility",
      targetId: args.facilityId,
      detail: { kind: args.kind, revision: s.revision.number, letter: s.revision.letter, issued: s.revision.issued, rows: s.schedule.length },
    });
  };
  return { input, record, fileBase: fileBase(s.m.row.name, s.revision) };
}

function fileBase(name: string, r: RevisionInfo): string {
  const slug = name
    .normalize("NFKD")
    .replace(/[^\w\s-]/g, "")
    .trim()
    .replace(/\s+/g, "-")
    .toLowerCase()
    .slice(0, 60);
  return `${slug || "facility"}-schedule-${r.issued && r.letter ? `rev-${r.letter}` : `v${r.number}`}`;
}
