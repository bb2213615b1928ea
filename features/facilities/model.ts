import "server-only";
import { and, desc, eq, isNull } from "drizzle-orm";
import { db } from "@/db/client";
import { facilities, facilityRevisions } from "@/db/schema";
import { AppError, type FieldError } from "@/lib/errors";
import { canonicalJson, deepEqual, mergeThreeWay } from "@/lib/merge";
import { computeFacility, facilityFluidsNeeded, PLANT_ENGINE_VERSION, type FacilityModel, type FacilityResult } from "@/lib/engine/model";
import { loadFluid } from "@/lib/engine/thermo";
import { createHash } from "node:crypto";
import { getFacilityRow, toDto } from "./queries";
import { inspectJson, refuseUnknownKeys } from "@/lib/validation";
import { EMPTY_MODEL_DOC, parseEngineModel, toEngineInput, upgradeDoc, type ModelDoc } from "./engine-model";
import type { SiteConditions } from "./schema";

type Row = typeof facilities.$inferSelect;

function docOf(row: Row): ModelDoc {
  return upgradeDoc((row.model as ModelDoc | null) ?? EMPTY_MODEL_DOC);
}

function engineModelOrThrow(doc: ModelDoc, site: SiteConditions): FacilityModel {
  const parsed = parseEngineModel(doc, site);
  if (parsed.success) return parsed.data;
  const fields: FieldError[] = parsed.error.issues.map((i) => {
    const p = i.path.map(String);
    // Site problems belong to the facility's site conditions, everything else to the model.
    return { field: p[0] === "site" ? p.join(".") : ["model", ...p].join("."), message: i.message };
  });
  throw new AppError("validation", `${fields[0].field}: ${fields[0].message}`, fields[0].field, fields);
}

/** Deepest nesting a model document may have (the demo's is 6). */
export const MAX_MODEL_DEPTH = 32;
const MAX_COMMENT_CHARS = 2000;

/**
 * What is stored must be a valid model and nothing else: the engine's parse, and no key it
 * does not know (a misspelt field, or a megabyte under a made-up name, is refused by name).
 */
function validateForSave(doc: ModelDoc, site: SiteConditions): void {
  const model = engineModelOrThrow(doc, site);
  // A top-level "$comment" (a note for people, as in the seed files) is kept as written.
  const { $comment: comment, ...input } = toEngineInput(doc, site);
  if (comment !== undefined && (typeof comment !== "string" || comment.length > MAX_COMMENT_CHARS))
    throw new AppError("validation", `model.$comment: must be text of at most ${MAX_COMMENT_CHARS} characters`, "model.$comment");
  refuseUnknownKeys(input, model, ["model"], "the model");
}

type Tx = Parameters<Parameters<typeof db.transaction>[0]>[0];

export async function loadFacilityModel(workspaceId: string, facilityId: string) {
  const row = await getFacilityRow(workspaceId, facilityId);
  const site = toDto(row).site;
  const doc = docOf(row);
  return { row, version: row.version, doc, site, engineModel: () => engineModelOrThrow(doc, site) };
}

/**
 * Saves a new model document as the next version and an immutable revision. A save based on
 * an older version is merged onto the current document when the two edits touch different
 * things; overlapping edits are refused with a conflict carrying the current document.
 */
export async function saveFacilityModel(args: {
  workspaceId: string;
  facilityId: string;
  userId: string;
  baseVersion: number;
  doc: ModelDoc;
  summary?: string;
  /** Run inside this transaction (a savepoint) so a caller's own writes commit with the save. */
  tx?: Tx;
}): Promise<{ version: number; doc: ModelDoc; rebased: boolean }> {
  // Before any recursive code (merge, zod, canonical JSON) walks it: bounded depth, no NUL, finite numbers.
  inspectJson(args.doc, MAX_MODEL_DEPTH, ["model"]);
  return (args.tx ?? db).transaction(async (tx) => {
    const [row] = await tx
      .select()
      .from(facilities)
      .where(and(eq(facilities.workspaceId, args.workspaceId), eq(facilities.id, args.facilityId)))
      .for("update");
    if (!row) throw new AppError("not_found", "Facility not found in this workspace.");
    const site = toDto(row).site;
    const current = docOf(row);
    let doc = upgradeDoc(args.doc);
    let rebased = false;
    if (args.baseVersion > row.version) {
      throw new AppError("validation", `baseVersion ${args.baseVersion} is newer than the stored version ${row.version}`, "baseVersion");
    }
    if (args.baseVersion !== row.version) {
      const [baseRev] = await tx
        .select({ model: facilityRevisions.model })
        .from(facilityRevisions)
        .where(and(eq(facilityRevisions.facilityId, row.id), eq(facilityRevisions.number, args.baseVersion)));
      const base = baseRev ? upgradeDoc(baseRev.model as ModelDoc) : null;
      const merged = base ? mergeThreeWay(base, current, doc) : { ok: false as const, conflicts: ["(document)"] };
      if (!merged.ok) {
        throw new AppError(
          "conflict",
          `Someone saved version ${row.version} while you were editing version ${args.baseVersion}, and both changed: ${merged.conflicts.join(", ")}. Your change was not saved; reload to see theirs.`,
          undefined,
          undefined,
          { conflicts: merged.conflicts, current: { version: row.version, doc: current } },
        );
      }
      doc = merged.merged as unknown as ModelDoc;
      rebased = true;
    }
    validateForSave(doc, site); // validate before anything is written
    if (deepEqual(doc, current) && row.model !== null) return { version: row.version, doc, rebased };
    const version = row.version + 1;
    await tx
      .update(facilities)
      .set({ model: doc as Record<string, unknown>, version, updatedAt: new Date() })
      .where(eq(facilities.id, row.id));
    await tx.insert(facilityRevisions).values({
      facilityId: row.id,
      number: version,
      model: doc as Record<string, unknown>,
      site: site as Record<string, unknown>,
      summary: args.summary?.slice(0, 200) ?? null,
      createdBy: args.userId,
    });
    return { version, doc, rebased };
  });
}

/** Hash of the engine input that results are computed from (sorted-key JSON, SHA-256). */
export function inputHashOf(model: unknown): string {
  return createHash("sha256").update(canonicalJson(model)).digest("hex").slice(0, 16);
}

/**
 * Server-side results (the authority for anything stored, e-mailed or exported): the
 * ledger and plant with the engine version and the hash of the inputs.
 */
export async function computeFacilityResults(model: FacilityModel): Promise<{ result: FacilityResult; inputHash: string; engineVersion: string }> {
  await Promise.all(facilityFluidsNeeded(model).map((id) => loadFluid(id)));
  let result: FacilityResult;
  try {
    result = computeFacility(model);
  } catch (e) {
    const err = e as Error & { field?: string };
    throw new AppError("calculation", err.message, err.field);
  }
  return { result, inputHash: inputHashOf(model), engineVersion: result.engineVersion ?? PLANT_ENGINE_VERSION };
}

export async function listRevisions(facilityId: string) {
  return db
    .select({
      number: facilityRevisions.number,
      summary: facilityRevisions.summary,
      createdAt: facilityRevisions.createdAt,
      createdBy: facilityRevisions.createdBy,
      issuedLetter: facilityRevisions.issuedLetter,
      issuedStatus: facilityRevisions.issuedStatus,
      checkedBy: facilityRevisions.checkedBy,
      issuedAt: facilityRevisions.issuedAt,
    })
    .from(facilityRevisions)
    .where(eq(facilityRevisions.facilityId, facilityId))
    .orderBy(desc(facilityRevisions.number));
}

export async function getRevision(facilityId: string, number: number) {
  const [r] = await db
    .select()
    .from(facilityRevisions)
    .where(and(eq(facilityRevisions.facilityId, facilityId), eq(facilityRevisions.number, number)));
  if (!r) throw new AppError("not_found", `Revision ${number} does not exist for this facility.`, "number");
  return r;
}

/**
 * Issues a revision: letter, status and checker recorded; the database then locks it. One
 * transaction holding the facility's row lock, so parallel requests are taken one at a time:
 * the first issues it, the others find it issued (or the letter taken) and get a 409.
 */
export async function issueRevision(facilityId: string, number: number, userId: string, v: { letter: string; status: string; checkedBy: string }) {
  await db.transaction(async (tx) => {
    await tx.select({ id: facilities.id }).from(facilities).where(eq(facilities.id, facilityId)).for("update");
    const [rev] = await tx
      .select({ issuedAt: facilityRevisions.issuedAt, issuedLetter: facilityRevisions.issuedLetter, issuedStatus: facilityRevisions.issuedStatus })
      .from(facilityRevisions)
      .where(and(eq(facilityRevisions.facilityId, facilityId), eq(facilityRevisions.number, number)));
    if (!rev) throw new AppError("not_found", `Revision ${number} does not exist for this facility.`, "number");
    if (rev.issuedAt) throw new AppError("conflict", `Revision ${number} is already issued as ${rev.issuedLetter} (${rev.issuedStatus}).`);
    const [dup] = await tx
      .select({ n: facilityRevisions.number })
      .from(facilityRevisions)
      .where(and(eq(facilityRevisions.facilityId, facilityId), eq(facilityRevisions.issuedLetter, v.letter)));
    if (dup) throw new AppError("conflict", `Letter ${v.letter} is already used by revision ${dup.n}.`, "letter");
    await tx
      .update(facilityRevisions)
      .set({ issuedLetter: v.letter, issuedStatus: v.status, checkedBy: v.checkedBy, issuedBy: userId, issuedAt: new Date() })
      .where(and(eq(facilityRevisions.facilityId, facilityId), eq(facilityRevisions.number, number), isNull(facilityRevisions.issuedAt)));
  });
  return getRevision(facilityId, number);
}

/** Restores an old revision's model as a new version (history is never rewritten). */
export async function restoreRevision(workspaceId: string, facilityId: string, number: number, userId: string) {
  const rev = await getRevision(facilityId, number);
  const [row] = await db.select({ version: facilities.version }).from(facilities).where(eq(facilities.id, facilityId));
  return saveFacilityModel({
    workspaceId,
    facilityId,
    userId,
    baseVersion: row.version,
    doc: rev.model as ModelDoc,
    summary: `Restored revision ${number}`,
  });
}

