/**
 * Column headers with units ("Length [ft]", "Set point (°F)", "Intake t/day") and numbers
 * with a decimal point or a decimal comma. Units are converted to SI through lib/units; a
 * unit or a number that cannot be read unambiguously is refused with the column named.
 */
import { convert } from "@/lib/units";
import type { CellValue } from "./read-table";

export type Quantity = "length" | "temp" | "mass" | "massRate" | "hours" | "percent" | "pressure" | "text";

interface UnitDef {
  label: string;
  toSI: (v: number) => number;
}

const UNITS: Record<Exclude<Quantity, "text">, Record<string, UnitDef>> = {
  length: { m: { label: "m", toSI: (v) => v }, ft: { label: "ft", toSI: (v) => convert.lengthFromDisplay(v, "IP") } },
  temp: {
    "°c": { label: "°C", toSI: (v) => v },
    c: { label: "°C", toSI: (v) => v },
    degc: { label: "°C", toSI: (v) => v },
    "°f": { label: "°F", toSI: (v) => convert.tempFromDisplay(v, "IP") },
    f: { label: "°F", toSI: (v) => convert.tempFromDisplay(v, "IP") },
    degf: { label: "°F", toSI: (v) => convert.tempFromDisplay(v, "IP") },
  },
  mass: { kg: { label: "kg", toSI: (v) => v }, t: { label: "t", toSI: (v) => v * 1000 }, lb: { label: "lb", toSI: (v) => convert.massFromDisplay(v, "IP") } },
  // Intake: tonnes per day is the stocking check's own unit; kg/day and lb/day convert to it.
  massRate: {
    "t/day": { label: "t/day", toSI: (v) => v },
    "t/d": { label: "t/day", toSI: (v) => v },
    "kg/day": { label: "kg/day", toSI: (v) => v / 1000 },
    "kg/d": { label: "kg/day", toSI: (v) => v / 1000 },
    "lb/day": { label: "lb/day", toSI: (v) => convert.massFromDisplay(v, "IP") / 1000 },
  },
  hours: { h: { label: "h", toSI: (v) => v }, hours: { label: "h", toSI: (v) => v }, min: { label: "min", toSI: (v) => v / 60 } },
  percent: { "%": { label: "%", toSI: (v) => v } },
  // Absolute pressures (a weather file's station pressure), read to Pa.
  pressure: {
    pa: { label: "Pa", toSI: (v) => v },
    hpa: { label: "hPa", toSI: (v) => v * 100 },
    mbar: { label: "mbar", toSI: (v) => v * 100 },
    kpa: { label: "kPa", toSI: (v) => v * 1000 },
    bar: { label: "bar", toSI: (v) => v * 1e5 },
    psi: { label: "psi", toSI: (v) => convert.pressureFromDisplay(v, "IP", "abs") },
  },
};

const DEFAULT_UNIT: Record<Exclude<Quantity, "text">, string> = { length: "m", temp: "°c", mass: "kg", massRate: "t/day", hours: "h", percent: "%", pressure: "pa" };

export interface FieldSpec {
  key: string;
  /** Header words that name this column (lower case, without the unit). */
  names: string[];
  quantity: Quantity;
  required: boolean;
}

export interface ResolvedColumn {
  spec: FieldSpec;
  index: number;
  header: string;
  unit: UnitDef | null;
  /** Said in the preview: e.g. "Length read in m (no unit in the header)". */
  note?: string;
}

export interface HeaderProblem {
  column: string;
  message: string;
}

/** Splits "Set point [°F]" / "Set point (°F)" / "Set point °F" into a name and a unit. */
export function splitHeader(h: string): { name: string; unit: string | null } {
  const t = h.trim();
  const bracket = /^(.*?)\s*[[(]\s*([^\])]+?)\s*[\])]\s*$/.exec(t);
  if (bracket) return { name: bracket[1].trim().toLowerCase(), unit: bracket[2].trim().toLowerCase() };
  const trailing = /^(.*?)\s+(°[cf]|t\/day|t\/d|kg\/day|kg\/d|lb\/day|kg|lb|ft|m|h|%|hpa|kpa|pa|mbar)$/i.exec(t);
  if (trailing) return { name: trailing[1].trim().toLowerCase(), unit: trailing[2].toLowerCase() };
  return { name: t.toLowerCase(), unit: null };
}

/** Maps headers to fields; unknown units and missing required columns are problems naming the column. */
export function resolveColumns(headers: string[], specs: FieldSpec[]): { columns: ResolvedColumn[]; problems: HeaderProblem[] } {
  const columns: ResolvedColumn[] = [];
  const problems: HeaderProblem[] = [];
  headers.forEach((h, index) => {
    const { name, unit } = splitHeader(h);
    const spec = specs.find((s) => s.names.includes(name));
    if (!spec) return;
    if (columns.some((c) => c.spec.key === spec.key)) {
      problems.push({ column: h, message: `column "${h}" repeats "${columns.find((c) => c.spec.key === spec.key)!.header}"` });
      return;
    }
    if (spec.quantity === "text") {
      columns.push({ spec, index, header: h, unit: null });
      return;
    }
    const table = UNITS[spec.quantity];
    if (unit === null) {
      const u = table[DEFAULT_UNIT[spec.quantity]];
      columns.push({ spec, index, header: h, unit: u, note: `"${h}" read in ${u.label} (no unit in the header)` });
      return;
    }
    const u = table[unit.replace(/\s+/g, "")];
    if (!u) {
      problems.push({ column: h, message: `column "${h}": the unit "${unit}" is not understood; use ${[...new Set(Object.values(table).map((x) => x.label))].join(" or ")}` });
      return;
    }
    columns.push({ spec, index, header: h, unit: u });
  });
  for (const s of specs)
    if (s.required && !columns.some((c) => c.spec.key === s.key) && !problems.some((p) => s.names.includes(splitHeader(p.column).name)))
      problems.push({ column: s.names[0], message: `a "${s.names[0]}" column is required` });
  return { columns, problems };
}

/**
 * A number from a cell: spreadsheet numbers as they are; text with a decimal point or a single
 * decimal comma ("12,5"). "1,234" (a thousands separator or a decimal comma?) and "1.234,5"
 * are refused as ambiguous rather than guessed.
 */
export function readNumber(v: CellValue): { ok: true; value: number } | { ok: false; message: string } {
  if (typeof v === "number") return Number.isFinite(v) ? { ok: true, value: v } : { ok: false, message: "is not a finite number" };
  const t = String(v ?? "").trim().replace(/\u2212/g, "-").replace(/\s/g, "");
  if (t === "") return { ok: false, message: "is empty" };
  if (/^[+-]?\d{1,3},\d{3}$/.test(t)) return { ok: false, message: `"${v}" is ambiguous (thousands separator or decimal comma?): write ${t.replace(",", "")} or ${t.replace(",", ".")}` };
  if (/[.,].*[.,]/.test(t)) return { ok: false, message: `"${v}" mixes separators: write the number without thousands separators, e.g. 1234.5` };
  const s = t.replace(",", ".");
  if (!/^[+-]?(\d+\.?\d*|\.\d+)(e[+-]?\d+)?$/i.test(s)) return { ok: false, message: `"${v}" is not a number` };
  return { ok: true, value: Number(s) };
}
