/**
 * The two imports, validated row by row against the model: a room list (name, size, set point,
 * RH, kind, construction) and a stocking plan (room, commodity, t/day, temperatures, pull-down,
 * stored mass). Pure: the preview and the commit run the same code, and the commit happens
 * only when no row has an error.
 */
import { roomKinds } from "@/lib/engine/loads/schema";
import { roomChangeSchema, type RoomChange } from "@/lib/engine/stocking/schema";
import { readNumber, resolveColumns, type FieldSpec, type ResolvedColumn } from "./columns";
import type { Table } from "./read-table";

export interface RowError {
  row: number;
  column: string;
  message: string;
}

export interface PreviewRow {
  row: number;
  action: "new" | "update" | "change";
  label: string;
  values: Record<string, string | number | null>;
}

export interface ImportPreview<T> {
  rows: PreviewRow[];
  errors: RowError[];
  notes: string[];
  /** What the commit writes; only meaningful when errors is empty. */
  items: T[];
}

type Values = Record<string, string | number | null>;

function readRows(table: Table, specs: FieldSpec[]): { columns: ResolvedColumn[]; parsed: { row: number; values: Values; errors: RowError[] }[]; headerErrors: RowError[]; notes: string[] } {
  const { columns, problems } = resolveColumns(table.headers, specs);
  const headerErrors = problems.map((p) => ({ row: 1, column: p.column, message: p.message }));
  const notes = columns.flatMap((c) => (c.note ? [c.note] : []));
  const parsed = table.rows.map((r) => {
    const values: Values = {};
    const errors: RowError[] = [];
    for (const c of columns) {
      const raw = r.cells[c.index];
      if (raw === null || String(raw).trim() === "") {
        values[c.spec.key] = null;
        if (c.spec.required) errors.push({ row: r.rowNumber, column: c.header, message: "is empty; this column is required" });
        continue;
      }
      if (c.spec.quantity === "text") {
        values[c.spec.key] = String(raw).trim();
        continue;
      }
      const n = readNumber(raw);
      if (!n.ok) errors.push({ row: r.rowNumber, column: c.header, message: n.message });
      else values[c.spec.key] = c.unit!.toSI(n.value);
    }
    return { row: r.rowNumber, values, errors };
  });
  return { columns, parsed, headerErrors, notes };
}

const headerOf = (columns: ResolvedColumn[], key: string, fallback: string) => columns.find((c) => c.spec.key === key)?.header ?? fallback;

function check(errors: RowError[], row: number, column: string, ok: boolean, message: string) {
  if (!ok) errors.push({ row, column, message });
}

// ——— Room list ———

export const ROOM_SPECS: FieldSpec[] = [
  { key: "name", names: ["name", "room", "room name"], quantity: "text", required: true },
  { key: "lengthM", names: ["length", "l"], quantity: "length", required: true },
  { key: "widthM", names: ["width", "w"], quantity: "length", required: true },
  { key: "heightM", names: ["height", "h"], quantity: "length", required: true },
  { key: "setPointC", names: ["set point", "setpoint", "temperature", "room temperature"], quantity: "temp", required: true },
  { key: "rhPct", names: ["rh", "relative humidity", "humidity"], quantity: "percent", required: false },
  { key: "kind", names: ["kind", "type", "use"], quantity: "text", required: false },
  { key: "construction", names: ["construction", "insulation", "panel"], quantity: "text", required: false },
];

/** Aged conductivities, W/(m·K): the middle of DOMAIN.md's common-practice ranges. */
export const INSULATION_W_MK: Record<string, number> = { pir: 0.023, pur: 0.0245, xps: 0.032, eps: 0.036, "mineral wool": 0.0375 };
export const DEFAULT_CONSTRUCTION = "PIR 100";

export interface Construction {
  material: string;
  thicknessM?: number;
  conductivityWmK?: number;
  uValueWm2K?: number;
}

/** "PIR 150", "PUR 120 mm", "mineral wool 200mm" or "U 0.25". */
export function parseConstruction(text: string): Construction | string {
  const t = text.trim().toLowerCase();
  const u = /^u\s*=?\s*([\d.,]+)\s*(w\/\(?m²?2?·?k\)?|w\/m2k)?$/.exec(t);
  if (u) {
    const n = readNumber(u[1]);
    if (!n.ok || n.value <= 0 || n.value > 20) return `U-value "${u[1]}" must be a number between 0 and 20 W/(m²·K)`;
    return { material: "given U-value", uValueWm2K: n.value };
  }
  const m = /^(pir|pur|xps|eps|mineral wool)\s+([\d.,]+)\s*(mm)?$/.exec(t);
  if (!m) return `"${text}" is not understood: write an insulation and its thickness in mm (e.g. "PIR 150"; PIR, PUR, XPS, EPS or mineral wool) or a U-value (e.g. "U 0.2")`;
  const n = readNumber(m[2]);
  if (!n.ok || n.value < 20 || n.value > 400) return `insulation thickness "${m[2]}" must be between 20 and 400 mm`;
  return { material: m[1].toUpperCase() === "MINERAL WOOL" ? "mineral wool" : m[1].toUpperCase(), thicknessM: n.value / 1000, conductivityWmK: INSULATION_W_MK[m[1]] };
}

export interface RoomImport {
  id: string;
  existing: boolean;
  name: string;
  lengthM: number;
  widthM: number;
  heightM: number;
  setPointC: number;
  /** Absent for an existing room when the file has no RH column (the room keeps its own). */
  rhPct?: number;
  /** Absent for an existing room when the file has no kind column. */
  kind?: (typeof roomKinds)[number];
  construction: Construction;
}

const slug = (s: string) =>
  s
    .normalize("NFKD")
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, "-")
    .replace(/^-|-$/g, "")
    .slice(0, 40) || "room";

/** Default RH when none is given: 90 % for freezers and chilled stores (common practice). */
const defaultRh = 90;

export function planRooms(table: Table, existing: { id: string; name: string }[]): ImportPreview<RoomImport> {
  const { columns, parsed, headerErrors, notes } = readRows(table, ROOM_SPECS);
  const errors: RowError[] = [...headerErrors];
  const items: RoomImport[] = [];
  const rows: PreviewRow[] = [];
  const seen = new Map<string, number>();
  const ids = new Set(existing.map((r) => r.id));
  const H = (k: string, f: string) => headerOf(columns, k, f);
  for (const p of parsed) {
    errors.push(...p.errors);
    const v = p.values;
    const e: RowError[] = [];
    const name = typeof v.name === "string" ? v.name : "";
    if (name) {
      const key = name.toLowerCase();
      check(e, p.row, H("name", "name"), !seen.has(key), `"${name}" is already on row ${seen.get(key)}`);
      seen.set(key, p.row);
      check(e, p.row, H("name", "name"), name.length <= 80, "a room name has at most 80 characters");
    }
    const num = (k: string) => (typeof v[k] === "number" ? (v[k] as number) : undefined);
    for (const [k, label, lo, hi, unit] of [
      ["lengthM", "length", 0, 1000, "m"],
      ["widthM", "width", 0, 1000, "m"],
      ["heightM", "height", 0, 100, "m"],
    ] as const) {
      const x = num(k);
      if (x !== undefined) check(e, p.row, H(k, label), x > 0 && x <= hi, `${label} must be greater than ${lo} and at most ${hi} ${unit}`);
    }
    const sp = num("setPointC");
    if (sp !== undefined) check(e, p.row, H("setPointC", "set point"), sp >= -60 && sp <= 40, "set point must be between −60 and 40 °C");
    const rh = num("rhPct");
    if (rh !== undefined) check(e, p.row, H("rhPct", "RH"), rh >= 0 && rh <= 100, "RH must be between 0 and 100 %");
    const kindText = typeof v.kind === "string" ? v.kind.toLowerCase() : "storage";
    const kind = (roomKinds as readonly string[]).includes(kindText) ? (kindText as RoomImport["kind"]) : null;
    if (!kind) e.push({ row: p.row, column: H("kind", "kind"), message: `kind "${v.kind}" is not one of ${roomKinds.join(", ")}` });
    const cons = parseConstruction(typeof v.construction === "string" ? v.construction : DEFAULT_CONSTRUCTION);
    if (typeof cons === "string") e.push({ row: p.row, column: H("construction", "construction"), message: cons });
    errors.push(...e);
    const match = existing.find((r) => r.name.toLowerCase() === name.toLowerCase());
    rows.push({ row: p.row, action: match ? "update" : "new", label: name || "(no name)", values: v });
    if (p.errors.length || e.length || !name || sp === undefined || !kind || typeof cons === "string") continue;
    let id = match?.id ?? slug(name);
    if (!match) {
      let k = 2;
      const base = id;
      while (ids.has(id)) id = `${base}-${k++}`;
      ids.add(id);
    }
    // A new room gets the stated defaults; an existing one changes only what the file gives.
    const hasKind = typeof v.kind === "string";
    items.push({
      id,
      existing: Boolean(match),
      name,
      lengthM: num("lengthM")!,
      widthM: num("widthM")!,
      heightM: num("heightM")!,
      setPointC: sp,
      rhPct: rh ?? (match ? undefined : defaultRh),
      kind: hasKind || !match ? kind : undefined,
      construction: cons,
    });
  }
  if (!columns.some((c) => c.spec.key === "construction")) notes.push(`No construction column: new rooms get ${DEFAULT_CONSTRUCTION} (mm) on walls, roof and floor.`);
  if (!columns.some((c) => c.spec.key === "rhPct")) notes.push(`No RH column: new rooms get ${defaultRh} % RH; existing rooms keep theirs.`);
  notes.push("Rooms whose name matches an existing room update its size and set point (and RH and kind where the file gives them); their surfaces are kept. New rooms get four outside walls, a roof and a floor (a heated slab under rooms below 0 °C) of the construction given.");
  return { rows, errors, notes, items };
}

/** A new room document in the model's own shape, with the surfaces the import promises. */
export function roomDoc(r: RoomImport): Record<string, unknown> {
  const c = r.construction;
  const build = c.uValueWm2K !== undefined ? { uValueWm2K: c.uValueWm2K } : { layers: [{ material: `${c.material} panel`, thicknessM: c.thicknessM!, conductivityWmK: c.conductivityWmK! }] };
  const wall = (o: "N" | "E" | "S" | "W", along: "length" | "width") => ({ id: `${r.id}-${o.toLowerCase()}`, kind: "wall", orientation: o, along, otherSide: "outdoors", ...build });
  return {
    id: r.id,
    name: r.name,
    kind: r.kind ?? "storage",
    lengthM: r.lengthM,
    widthM: r.widthM,
    heightM: r.heightM,
    setPointC: r.setPointC,
    rhPct: r.rhPct ?? defaultRh,
    surfaces: [
      wall("N", "length"),
      wall("S", "length"),
      wall("E", "width"),
      wall("W", "width"),
      { id: `${r.id}-roof`, kind: "roof", otherSide: "outdoors", ...build },
      { id: `${r.id}-floor`, kind: "floor", otherSide: r.setPointC < 0 ? "heatedSlab" : "ground", ...build },
    ],
  };
}

// ——— Stocking plan ———

export const STOCKING_SPECS: FieldSpec[] = [
  { key: "room", names: ["room", "room name", "name"], quantity: "text", required: true },
  { key: "commodity", names: ["commodity", "product"], quantity: "text", required: false },
  { key: "tonnesPerDay", names: ["intake", "tonnes/day", "tonnes per day", "t/day", "tonnes", "mass per day"], quantity: "massRate", required: false },
  { key: "enteringTempC", names: ["entering", "entering temperature", "arrival temperature", "in"], quantity: "temp", required: false },
  { key: "finalTempC", names: ["final", "final temperature"], quantity: "temp", required: false },
  { key: "pullDownHours", names: ["pull-down", "pull down", "pulldown", "pull-down time"], quantity: "hours", required: false },
  { key: "storedMassKg", names: ["stored", "stored mass", "stock"], quantity: "mass", required: false },
  { key: "setPointC", names: ["set point", "new set point", "setpoint"], quantity: "temp", required: false },
];

export function planStocking(table: Table, rooms: { id: string; name: string }[], commodities: { id: string; name: string }[]): ImportPreview<RoomChange> {
  const { columns, parsed, headerErrors, notes } = readRows(table, STOCKING_SPECS);
  const errors: RowError[] = [...headerErrors];
  const items: RoomChange[] = [];
  const rows: PreviewRow[] = [];
  const seen = new Map<string, number>();
  const H = (k: string, f: string) => headerOf(columns, k, f);
  for (const p of parsed) {
    errors.push(...p.errors);
    const v = p.values;
    const e: RowError[] = [];
    const roomText = typeof v.room === "string" ? v.room : "";
    const room = rooms.find((r) => r.id === roomText || r.name.toLowerCase() === roomText.toLowerCase());
    if (roomText && !room) e.push({ row: p.row, column: H("room", "room"), message: `no room "${roomText}" in this facility` });
    if (room) {
      check(e, p.row, H("room", "room"), !seen.has(room.id), `${room.name} is already on row ${seen.get(room.id)}; one row per room`);
      seen.set(room.id, p.row);
    }
    let commodityId: string | undefined;
    if (typeof v.commodity === "string") {
      const c = commodities.find((x) => x.id === v.commodity || x.name.toLowerCase() === String(v.commodity).toLowerCase());
      if (!c) e.push({ row: p.row, column: H("commodity", "commodity"), message: `"${v.commodity}" is not in the commodity library` });
      commodityId = c?.id;
    }
    const change: Record<string, unknown> = { roomId: room?.id ?? roomText };
    if (commodityId) change.commodityId = commodityId;
    for (const k of ["tonnesPerDay", "enteringTempC", "finalTempC", "pullDownHours", "storedMassKg", "setPointC"]) if (typeof v[k] === "number") change[k] = v[k];
    const parsedChange = roomChangeSchema.safeParse(change);
    if (!parsedChange.success) {
      // Range errors always show; "nothing changed in this room" only when the row has no other problem.
      const quiet = p.errors.length > 0 || e.length > 0;
      for (const i of parsedChange.error.issues) {
        const k = String(i.path[0] ?? "room");
        if (quiet && k === "roomId") continue;
        e.push({ row: p.row, column: H(k === "roomId" ? "room" : k, k), message: i.message });
      }
    }
    errors.push(...e);
    rows.push({ row: p.row, action: "change", label: room?.name ?? roomText ?? "(no room)", values: v });
    if (!p.errors.length && !e.length && parsedChange.success) items.push(parsedChange.data);
  }
  if (items.length > 50) errors.push({ row: 1, column: "room", message: "a stocking plan changes at most 50 rooms" });
  notes.push("The plan becomes one stocking check: it changes nothing in the model; a designer can apply it once accepted.");
  return { rows, errors, notes, items };
}
