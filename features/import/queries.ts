import "server-only";
import { AppError } from "@/lib/errors";
import { audit } from "@/lib/audit";
import { listCommodities } from "@/lib/engine/loads";
import { loadFacilityModel, saveFacilityModel } from "@/features/facilities/model";
import type { ModelDoc } from "@/features/facilities/engine-model";
import { createScenario } from "@/features/stocking-check/queries";
import { MAX_UPLOAD_BYTES, readTable, type Table } from "./read-table";
import { ImportFileError } from "./zip-guard";
import { planRooms, planStocking, roomDoc } from "./plans";
import { importModeSchema, importNameSchema, type ImportResultDto } from "./schema";

export interface Upload {
  buf: Buffer;
  fileName: string;
  mode: "preview" | "commit";
  name: string | null;
}

/** Largest multipart request an import accepts: the file's limit plus room for the form's other parts. */
export const MAX_IMPORT_REQUEST_BYTES = MAX_UPLOAD_BYTES + 64 * 1024;

/**
 * Parses a multipart upload whose bytes route() has already read within
 * MAX_IMPORT_REQUEST_BYTES (checked while the stream arrived, with or without Content-Length).
 */
export async function readUpload(req: Request, raw: Buffer): Promise<Upload> {
  let form: FormData;
  try {
    form = await new Response(new Uint8Array(raw), { headers: { "content-type": req.headers.get("content-type") ?? "" } }).formData();
  } catch {
    throw new AppError("validation", "Send the file as multipart/form-data with a field named file.", "file");
  }
  const file = form.get("file");
  if (!(file instanceof File)) throw new AppError("validation", "Choose a file to import (.xlsx or .csv).", "file");
  const mode = importModeSchema.safeParse(form.get("mode") ?? "preview");
  if (!mode.success) throw new AppError("validation", mode.error.issues[0].message, "mode");
  const rawName = form.get("name");
  if ((file.name ?? "").includes("\0")) throw new AppError("validation", "file: the file name must not contain a NUL character", "file");
  if (typeof rawName === "string" && rawName.includes("\0")) throw new AppError("validation", "name: must not contain a NUL character", "name");
  return { buf: Buffer.from(await file.arrayBuffer()), fileName: file.name || "upload", mode: mode.data, name: typeof rawName === "string" ? rawName : null };
}

async function table(u: Upload): Promise<Table> {
  try {
    return await readTable(u.buf, u.fileName);
  } catch (e) {
    if (e instanceof ImportFileError) throw new AppError("validation", e.message, "file");
    throw e;
  }
}

function refuseIfErrors(errors: ImportResultDto["errors"]) {
  if (errors.length === 0) return;
  throw new AppError(
    "validation",
    `${errors.length} problem${errors.length === 1 ? "" : "s"} in the file; nothing was imported. Correct them and upload again.`,
    "file",
    errors.slice(0, 100).map((e) => ({ field: `row ${e.row} · ${e.column}`, message: e.message })),
  );
}

type Actor = { id: string; email: string };
/** Reports progress of an import running as a job (fraction 0…1, what is being done). */
export type Progress = (fraction: number, stage: string) => Promise<void>;
const quiet: Progress = async () => undefined;

/** Room list: preview, or (all rows valid) add and update rooms as one new model version. */
export async function importRooms(workspaceId: string, facilityId: string, user: Actor, u: Upload, progress: Progress = quiet): Promise<ImportResultDto> {
  await progress(0.05, `Reading ${u.fileName}`);
  const t = await table(u);
  await progress(0.35, `Checking ${t.rows.length} rows against the model`);
  const m = await loadFacilityModel(workspaceId, facilityId);
  const existing = (m.doc.rooms as { id: string; name: string }[]).map((r) => ({ id: r.id, name: r.name }));
  const plan = planRooms(t, existing);
  const out: ImportResultDto = { kind: "rooms", fileName: u.fileName, format: t.format, rows: plan.rows, errors: plan.errors, notes: plan.notes, itemCount: plan.items.length, committed: null };
  if (u.mode === "preview") return out;
  refuseIfErrors(plan.errors);
  await progress(0.7, `Saving ${plan.items.length} rooms as a new model version`);
  const rooms = [...(m.doc.rooms as Record<string, unknown>[])];
  for (const r of plan.items) {
    if (r.existing) {
      const i = rooms.findIndex((x) => x.id === r.id);
      rooms[i] = {
        ...rooms[i],
        name: r.name,
        lengthM: r.lengthM,
        widthM: r.widthM,
        heightM: r.heightM,
        setPointC: r.setPointC,
        ...(r.rhPct !== undefined ? { rhPct: r.rhPct } : {}),
        ...(r.kind !== undefined ? { kind: r.kind } : {}),
      };
    } else rooms.push(roomDoc(r));
  }
  const saved = await saveFacilityModel({ workspaceId, facilityId, userId: user.id, baseVersion: m.version, doc: { ...m.doc, rooms } as ModelDoc, summary: `Imported ${plan.items.length} rooms from ${u.fileName}`.slice(0, 200) });
  await audit({ workspaceId, actorId: user.id, actorEmail: user.email, action: "import.committed", targetType: "facility", targetId: facilityId, detail: { kind: "rooms", file: u.fileName, rows: plan.items.length, version: saved.version } });
  return { ...out, committed: { version: saved.version } };
}

/** Stocking plan: preview, or (all rows valid) save it as one stocking check. */
export async function importStocking(workspaceId: string, facilityId: string, user: Actor, u: Upload, progress: Progress = quiet): Promise<ImportResultDto> {
  await progress(0.05, `Reading ${u.fileName}`);
  const t = await table(u);
  await progress(0.35, `Checking ${t.rows.length} rows against the rooms and commodities`);
  const m = await loadFacilityModel(workspaceId, facilityId);
  const rooms = (m.doc.rooms as { id: string; name: string }[]).map((r) => ({ id: r.id, name: r.name }));
  const plan = planStocking(t, rooms, listCommodities().map((c) => ({ id: c.id, name: c.name })));
  const out: ImportResultDto = { kind: "stocking", fileName: u.fileName, format: t.format, rows: plan.rows, errors: plan.errors, notes: plan.notes, itemCount: plan.items.length, committed: null };
  if (u.mode === "preview") return out;
  refuseIfErrors(plan.errors);
  const name = importNameSchema.safeParse(u.name ?? `Stocking plan from ${u.fileName}`.slice(0, 120));
  if (!name.success) throw new AppError("validation", name.error.issues[0].message, "name");
  await progress(0.7, `Saving ${plan.items.length} rooms as one stocking check`);
  const s = await createScenario(workspaceId, facilityId, user.id, { name: name.data, changes: { rooms: plan.items, safetyFactorPlacement: "load" } });
  await audit({ workspaceId, actorId: user.id, actorEmail: user.email, action: "import.committed", targetType: "scenario", targetId: s.id, detail: { kind: "stocking", file: u.fileName, rows: plan.items.length } });
  return { ...out, committed: { scenarioId: s.id } };
}
