import "server-only";
import { and, desc, eq } from "drizzle-orm";
import { db } from "@/db/client";
import { scenarios, users } from "@/db/schema";
import { AppError } from "@/lib/errors";
import { audit } from "@/lib/audit";
import { appLink, sendMail } from "@/lib/mail";
import { facilityFluidsNeeded, type FacilityModel } from "@/lib/engine/model";
import { loadFluid } from "@/lib/engine/thermo";
import { PlantError } from "@/lib/engine/plant/errors";
import { LoadInputError } from "@/lib/engine/loads/errors";
import { applyStockingChanges, runStockingCheck, StockingError, type ScenarioChanges, type StockingCheckResult, type Verdict } from "@/lib/engine/stocking";
import type { UnitSystem } from "@/lib/units";
import { computeFacilityResults, loadFacilityModel, saveFacilityModel } from "@/features/facilities/model";
import type { ModelDoc } from "@/features/facilities/engine-model";
import type { InstalledDto, ScenarioDto } from "./schema";
import { DEFAULT_SELECTION_MARGIN, installedFromDesign, type InstalledPlantRaw } from "./installed";
import { emailText } from "./summary";

type Row = typeof scenarios.$inferSelect;

function toDto(r: Row, author: { name: string; email: string } | null): ScenarioDto {
  return {
    id: r.id,
    name: r.name,
    baseVersion: r.baseVersion,
    changes: r.changes as unknown as ScenarioChanges,
    result: (r.result as unknown as StockingCheckResult | null) ?? null,
    verdict: (r.verdict as Verdict | null) ?? null,
    author,
    createdAt: r.createdAt.toISOString(),
    acceptedAt: r.acceptedAt?.toISOString() ?? null,
    appliedAt: r.appliedAt?.toISOString() ?? null,
    appliedRevision: r.appliedRevision,
  };
}

/** Engine errors of a changed model, in the words of the scenario (the room, not an index). */
function asAppError(e: unknown, model: FacilityModel, changes: ScenarioChanges): never {
  if (e instanceof StockingError) {
    throw new AppError(e.code === "NO_INSTALLED_PLANT" ? "calculation" : "validation", e.message, e.code === "NO_INSTALLED_PLANT" ? undefined : `changes.${e.field}`);
  }
  // Only the engine's typed input errors are the user's to fix; anything else is a bug: logged, 500.
  if (!(e instanceof PlantError || e instanceof LoadInputError)) throw e;
  const err = e as Error & { field?: string };
  const m = /^rooms\.(\d+)/.exec(err.field ?? "");
  const room = m ? model.rooms[Number(m[1])] : undefined;
  const idx = room ? changes.rooms.findIndex((c) => c.roomId === room.id) : -1;
  const detail = err.message.replace(/^rooms\.\d+\.[\w.]+: /, "");
  throw new AppError(
    "calculation",
    room ? `${room.name} cannot be computed with these changes: ${detail}.` : `The changed model cannot be computed: ${detail}.`,
    idx >= 0 ? `changes.rooms.${idx}` : undefined,
  );
}

/** Runs a check against the facility's current model (the server is the authority). */
export async function checkScenario(workspaceId: string, facilityId: string, changes: ScenarioChanges) {
  const m = await loadFacilityModel(workspaceId, facilityId);
  const model = m.engineModel();
  await Promise.all(facilityFluidsNeeded(model).map((id) => loadFluid(id)));
  let result: StockingCheckResult;
  try {
    result = runStockingCheck(model, changes);
  } catch (e) {
    asAppError(e, model, changes);
  }
  return { version: m.version, model, row: m.row, result, doc: m.doc };
}

export async function createScenario(workspaceId: string, facilityId: string, userId: string, input: { name: string; changes: ScenarioChanges }) {
  const c = await checkScenario(workspaceId, facilityId, input.changes);
  const [row] = await db
    .insert(scenarios)
    .values({
      workspaceId,
      facilityId,
      name: input.name,
      baseVersion: c.version,
      changes: input.changes as unknown as Record<string, unknown>,
      result: c.result as unknown as Record<string, unknown>,
      verdict: c.result.verdict,
      authorId: userId,
    })
    .returning();
  return getScenario(workspaceId, facilityId, row.id);
}

const selectWithAuthor = () =>
  db.select({ s: scenarios, authorName: users.name, authorEmail: users.email }).from(scenarios).leftJoin(users, eq(users.id, scenarios.authorId));

function withAuthor(r: { s: Row; authorName: string | null; authorEmail: string | null }): ScenarioDto {
  return toDto(r.s, r.authorName !== null && r.authorEmail !== null ? { name: r.authorName, email: r.authorEmail } : null);
}

export async function listScenarios(workspaceId: string, facilityId: string): Promise<ScenarioDto[]> {
  const rows = await selectWithAuthor()
    .where(and(eq(scenarios.workspaceId, workspaceId), eq(scenarios.facilityId, facilityId)))
    .orderBy(desc(scenarios.createdAt))
    .limit(200);
  return rows.map(withAuthor);
}

export async function getScenario(workspaceId: string, facilityId: string, id: string): Promise<ScenarioDto> {
  const [r] = await selectWithAuthor()
    .where(and(eq(scenarios.workspaceId, workspaceId), eq(scenarios.facilityId, facilityId), eq(scenarios.id, id)))
    .limit(1);
  if (!r) throw new AppError("not_found", "Stocking check not found for this facility.");
  return withAuthor(r);
}

/** Marks a scenario as the plan to go ahead with; one whose plant falls short cannot be accepted. */
export async function acceptScenario(workspaceId: string, facilityId: string, id: string): Promise<ScenarioDto> {
  const s = await getScenario(workspaceId, facilityId, id);
  if (s.appliedAt) throw new AppError("conflict", `This stocking check was already applied as version ${s.appliedRevision}.`);
  if (s.acceptedAt) return s;
  if (s.verdict === "shortfall")
    throw new AppError("conflict", "A stocking check with a shortfall cannot be accepted: the installed plant cannot take it. Change the scenario or the plant first.");
  await db.update(scenarios).set({ acceptedAt: new Date() }).where(and(eq(scenarios.workspaceId, workspaceId), eq(scenarios.id, id)));
  return getScenario(workspaceId, facilityId, id);
}

/**
 * Applies an accepted scenario to the facility's current model as a new version. The check is
 * run again on the current model first: if the model changed since and the scenario no longer
 * fits, nothing is saved.
 */
export async function applyScenario(args: { workspaceId: string; facilityId: string; id: string; userId: string; userEmail: string }) {
  const s = await getScenario(args.workspaceId, args.facilityId, args.id);
  if (!s.acceptedAt) throw new AppError("conflict", "Accept the stocking check before applying it to the model.");
  if (s.appliedAt) throw new AppError("conflict", `This stocking check was already applied as version ${s.appliedRevision}.`);
  const c = await checkScenario(args.workspaceId, args.facilityId, s.changes);
  if (c.result.verdict === "shortfall")
    throw new AppError("conflict", `The model changed since this check (now version ${c.version}) and the scenario no longer fits: run the check again.`);
  let doc: ModelDoc;
  try {
    doc = applyStockingChanges(c.doc as ModelDoc & { rooms: never[] }, s.changes) as ModelDoc;
  } catch (e) {
    asAppError(e, c.model, s.changes);
  }
  // One transaction holding the scenario's row lock: of parallel applies, the first writes the
  // version, the scenario's mark and one audit row together; the others find it applied (409).
  const saved = await db.transaction(async (tx) => {
    const [row] = await tx
      .select({ appliedAt: scenarios.appliedAt, appliedRevision: scenarios.appliedRevision })
      .from(scenarios)
      .where(and(eq(scenarios.workspaceId, args.workspaceId), eq(scenarios.facilityId, args.facilityId), eq(scenarios.id, args.id)))
      .for("update");
    if (!row) throw new AppError("not_found", "Stocking check not found for this facility.");
    if (row.appliedAt) throw new AppError("conflict", `This stocking check was already applied as version ${row.appliedRevision}.`);
    const v = await saveFacilityModel({
      workspaceId: args.workspaceId,
      facilityId: args.facilityId,
      userId: args.userId,
      baseVersion: c.version,
      doc,
      summary: `Stocking check "${s.name}" applied`,
      tx,
    });
    await tx
      .update(scenarios)
      .set({ appliedAt: new Date(), appliedRevision: v.version, result: c.result as unknown as Record<string, unknown>, verdict: c.result.verdict })
      .where(and(eq(scenarios.workspaceId, args.workspaceId), eq(scenarios.id, args.id)));
    await audit(
      {
        workspaceId: args.workspaceId,
        actorId: args.userId,
        actorEmail: args.userEmail,
        action: "scenario.applied",
        targetType: "scenario",
        targetId: args.id,
        detail: { facilityId: args.facilityId, name: s.name, version: v.version, fromVersion: c.version, verdict: c.result.verdict },
      },
      tx,
    );
    return v;
  });
  return { scenario: await getScenario(args.workspaceId, args.facilityId, args.id), version: saved.version };
}

export async function emailScenario(args: {
  workspaceId: string;
  workspaceSlug: string;
  facilityId: string;
  id: string;
  sender: { name: string; email: string; unitSystem: UnitSystem };
  to: string[];
  note?: string;
}) {
  const s = await getScenario(args.workspaceId, args.facilityId, args.id);
  if (!s.result) throw new AppError("conflict", "This stocking check has no result to send.");
  const m = await loadFacilityModel(args.workspaceId, args.facilityId);
  const roomNames = Object.fromEntries((m.doc.rooms as { id: string; name: string }[]).map((r) => [r.id, r.name]));
  const link = appLink(`/w/${args.workspaceSlug}/f/${args.facilityId}/stocking?s=${s.id}`);
  const mail = emailText({
    name: s.name,
    facilityName: m.row.name,
    author: args.sender.name,
    result: s.result,
    unitSystem: args.sender.unitSystem,
    roomNames,
    link,
    note: args.note,
  });
  for (const to of args.to) await sendMail({ to, subject: mail.subject, text: mail.text }, { workspaceId: args.workspaceId });
  return { sent: args.to.length };
}

/** The installed plant as recorded, and one proposed from the design at a selection margin. */
export async function installedDto(workspaceId: string, facilityId: string, margin = DEFAULT_SELECTION_MARGIN): Promise<InstalledDto> {
  const m = await loadFacilityModel(workspaceId, facilityId);
  const model = m.engineModel();
  const { result } = await computeFacilityResults(model);
  const recorded = model.plant.installed;
  return {
    version: m.version,
    installed: recorded && recorded.evaporators.length + recorded.compressors.length + recorded.condensers.length > 0 ? recorded : null,
    proposed: installedFromDesign(result, margin, model.rooms),
    margin,
    rooms: Object.fromEntries(model.rooms.map((r) => [r.id, r.name])),
    circuits: Object.fromEntries(result.plant.circuits.map((c) => [c.id, c.tag])),
    twoStageCircuits: model.plant.circuits.filter((c) => c.arrangement === "two-stage").map((c) => c.id),
  };
}

/** Records the installed plant in the model as a new version (designers and owners). */
export async function saveInstalled(args: { workspaceId: string; facilityId: string; userId: string; userEmail: string; baseVersion: number; installed: InstalledPlantRaw }) {
  const m = await loadFacilityModel(args.workspaceId, args.facilityId);
  const doc = { ...m.doc, plant: { ...(m.doc.plant ?? {}), installed: args.installed } } as ModelDoc;
  const saved = await saveFacilityModel({ workspaceId: args.workspaceId, facilityId: args.facilityId, userId: args.userId, baseVersion: args.baseVersion, doc, summary: "Installed plant recorded" });
  await audit({
    workspaceId: args.workspaceId,
    actorId: args.userId,
    actorEmail: args.userEmail,
    action: "model.edited",
    targetType: "facility",
    targetId: args.facilityId,
    detail: { version: saved.version, baseVersion: args.baseVersion, summary: "Installed plant recorded" },
  });
  return { version: saved.version };
}
