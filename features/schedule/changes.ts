/**
 * "Changed since the last export": compares the schedule rows now with the snapshot stored
 * with the last export, by tag (tags are stable: adding or removing items renumbers nothing).
 */
import type { ScheduleItem } from "@/lib/engine/plant/schedule";

export type ChangeMark = { status: "new" } | { status: "changed"; fields: string[] } | { status: "same" };

export interface ScheduleChanges {
  /** No earlier export to compare with. */
  firstExport: boolean;
  byTag: Record<string, ChangeMark>;
  /** Tags in the last export that are gone now. */
  removed: string[];
}

/** Relative difference below which two duties are the same (recomputation noise, not a change). */
export const SAME_RELATIVE = 1e-6;

const NUMERIC: (keyof ScheduleItem)[] = ["quantity", "standbyQuantity", "dutyW", "dutyPerUnitW", "electricalW", "airflowM3s"];
const TEXT: (keyof ScheduleItem)[] = ["kind", "description", "refrigerant", "roomId", "circuitId", "feed", "ratingConditions"];

const FIELD_WORDS: Partial<Record<keyof ScheduleItem, string>> = {
  quantity: "quantity",
  standbyQuantity: "standby",
  dutyW: "duty",
  dutyPerUnitW: "duty per unit",
  electricalW: "electrical load",
  airflowM3s: "airflow",
  kind: "kind",
  description: "description",
  refrigerant: "refrigerant",
  roomId: "room",
  circuitId: "circuit",
  feed: "feed",
  ratingConditions: "rating conditions",
};

function differs(a: unknown, b: unknown): boolean {
  if (typeof a === "number" && typeof b === "number") {
    const scale = Math.max(Math.abs(a), Math.abs(b));
    return scale > 0 && Math.abs(a - b) / scale > SAME_RELATIVE;
  }
  return (a ?? null) !== (b ?? null);
}

/** Marks each current row new / changed (naming the fields) / same against `previous`. */
export function scheduleChanges(current: ScheduleItem[], previous: ScheduleItem[] | null | undefined): ScheduleChanges {
  const byTag: Record<string, ChangeMark> = {};
  if (!previous) {
    for (const r of current) byTag[r.tag] = { status: "same" };
    return { firstExport: true, byTag, removed: [] };
  }
  const prev = new Map(previous.map((r) => [r.tag, r]));
  for (const r of current) {
    const p = prev.get(r.tag);
    if (!p) {
      byTag[r.tag] = { status: "new" };
      continue;
    }
    const fields: string[] = [];
    for (const k of [...NUMERIC, ...TEXT]) if (differs(r[k], p[k])) fields.push(FIELD_WORDS[k] ?? k);
    const temps = new Set([...Object.keys(r.temperatures ?? {}), ...Object.keys(p.temperatures ?? {})]);
    for (const t of temps)
      if (differs((r.temperatures as Record<string, number>)[t], (p.temperatures as Record<string, number>)?.[t])) fields.push(`${t} temperature`);
    byTag[r.tag] = fields.length ? { status: "changed", fields } : { status: "same" };
  }
  const now = new Set(current.map((r) => r.tag));
  return { firstExport: false, byTag, removed: previous.map((r) => r.tag).filter((t) => !now.has(t)) };
}

/** The mark in words, for the table and the export's last column. */
export function markText(m: ChangeMark | undefined): string {
  if (!m || m.status === "same") return "";
  if (m.status === "new") return "new";
  return `changed: ${m.fields.join(", ")}`;
}
