/**
 * The inspector's form for each node kind: which inputs it shows, in which unit, and how a
 * form's display values turn back into the SI entity the engine's zod schema checks. Only
 * fields the user changed are converted back, so a round trip through °F never drifts a value.
 */
import type { z } from "zod";
import { roomKinds, roomSchema, doorSchema } from "@/lib/engine/loads/schema";
import { circuitSchema, condenserSchema, evaporatorSchema, fluidIdSchema } from "@/lib/engine/plant/schema";
import { convert, UNIT_LABELS, type UnitSystem } from "@/lib/units";
import type { NodeKind } from "./schema";

export type UnitKind = "temp" | "tempDiff" | "length" | "pressure" | "none";

export interface FieldDef {
  /** Dotted path inside the entity. */
  name: string;
  label: string;
  type: "text" | "number" | "select";
  unit?: UnitKind;
  /** A fixed unit label for quantities that do not change with the unit system. */
  suffix?: string;
  options?: readonly string[];
  /** May be left empty (the engine then uses its default). */
  optional?: boolean;
  hint?: string;
  /** Shown only when this returns true for the entity. */
  when?: (e: Record<string, unknown>) => boolean;
  /** A word a number field also takes as its value (e.g. "optimise"), stored as that word. */
  keyword?: string;
}

const isCascade = (e: Record<string, unknown>) => (e.heatRejection as { to?: string } | undefined)?.to === "circuit";
const isTranscritical = (e: Record<string, unknown>) => e.arrangement === "transcritical";

export const FIELDS: Record<Exclude<NodeKind, "outdoors">, FieldDef[]> = {
  room: [
    { name: "name", label: "Name", type: "text" },
    { name: "kind", label: "Use", type: "select", options: roomKinds },
    { name: "setPointC", label: "Set point", type: "number", unit: "temp" },
    { name: "rhPct", label: "Relative humidity", type: "number", suffix: "%" },
    { name: "lengthM", label: "Length", type: "number", unit: "length" },
    { name: "widthM", label: "Width", type: "number", unit: "length" },
    { name: "heightM", label: "Height", type: "number", unit: "length" },
    { name: "runHoursPerDay", label: "Run time allowed", type: "number", suffix: "h/day", optional: true, hint: "default 20 h/day" },
    { name: "safetyFactor", label: "Safety factor", type: "number", suffix: "fraction", optional: true, hint: "default 0.1 (10 %)" },
  ],
  door: [
    { name: "name", label: "Name", type: "text", optional: true },
    { name: "widthM", label: "Width", type: "number", unit: "length" },
    { name: "heightM", label: "Height", type: "number", unit: "length" },
    { name: "passagesPerDay", label: "Passages", type: "number", suffix: "per day", optional: true },
    { name: "openCloseSecondsPerPassage", label: "Open–close time per passage", type: "number", suffix: "s", optional: true, hint: "default 20 s" },
    { name: "minutesHeldOpenPerDay", label: "Held open", type: "number", suffix: "min/day", optional: true },
    { name: "protection", label: "Protection", type: "select", options: ["none", "stripCurtain", "airCurtain", "vestibule", "fastDoor"], optional: true },
    { name: "uValueWm2K", label: "Door leaf U-value", type: "number", suffix: "W/(m²·K)", optional: true, hint: "default: the U-value of the wall it sits in" },
  ],
  evaporator: [
    { name: "tag", label: "Tag", type: "text" },
    { name: "tdK", label: "Design TD", type: "number", unit: "tempDiff", optional: true, hint: "default by room humidity" },
    { name: "units", label: "Unit coolers", type: "number", optional: true, hint: "default from duty and room length" },
    { name: "feed.type", label: "Feed", type: "select", options: ["dx", "pumped"], optional: true, hint: "default direct expansion" },
  ],
  circuit: [
    { name: "tag", label: "Tag", type: "text" },
    { name: "refrigerant", label: "Refrigerant", type: "select", options: fluidIdSchema.options },
    { name: "arrangement", label: "Arrangement", type: "select", options: ["single-stage", "two-stage", "transcritical"], optional: true },
    { name: "compressor.type", label: "Compressor", type: "select", options: ["screw", "reciprocating", "scroll"], optional: true },
    { name: "compressor.units", label: "Compressor units", type: "number", optional: true },
    { name: "compressor.standbyUnits", label: "of which standby", type: "number", optional: true },
    { name: "suctionLineAllowanceK", label: "Suction-line allowance", type: "number", unit: "tempDiff", optional: true, hint: "default 1 K" },
    { name: "superheatK", label: "Suction superheat", type: "number", unit: "tempDiff", optional: true, hint: "default the evaporators' DX superheat (0 for pumped feed); 0–40 K" },
    { name: "subcoolingK", label: "Subcooling", type: "number", unit: "tempDiff", optional: true, hint: "default 3 K" },
    { name: "tempConvention", label: "Blend temperatures", type: "select", options: ["dew", "bubble", "mean"], optional: true },
    { name: "heatRejection.condensingC", label: "Cascade condensing", type: "number", unit: "temp", optional: true, when: isCascade },
    { name: "heatRejection.approachK", label: "Cascade approach", type: "number", unit: "tempDiff", optional: true, when: isCascade },
    {
      name: "highSidePa",
      label: "High-side pressure (set point)",
      type: "number",
      unit: "pressure",
      optional: true,
      keyword: "optimise",
      hint: "empty or “optimise”: the pressure of best COP; a set point 50–140 bar(a)",
      when: isTranscritical,
    },
    {
      name: "switchOverC",
      label: "Condensing (subcritical) at gas-cooler outlet up to",
      type: "number",
      unit: "temp",
      optional: true,
      hint: "default 26 °C (critical − 5 K); 5–30 °C",
      when: isTranscritical,
    },
  ],
  condenser: [
    { name: "tag", label: "Tag", type: "text" },
    { name: "type", label: "Type", type: "select", options: ["evaporative", "air-cooled", "water-cooled", "user-set"] },
    { name: "approachK", label: "Approach", type: "number", unit: "tempDiff", optional: true, hint: "default by type" },
    { name: "condensingC", label: "Condensing (user-set)", type: "number", unit: "temp", optional: true, when: (e) => e.type === "user-set" },
    { name: "units", label: "Units", type: "number", optional: true },
  ],
};

export const ENTITY_SCHEMAS: Record<Exclude<NodeKind, "outdoors">, z.ZodType> = {
  room: roomSchema,
  door: doorSchema,
  evaporator: evaporatorSchema,
  circuit: circuitSchema,
  condenser: condenserSchema,
};

export function getPath(o: unknown, path: string): unknown {
  return path.split(".").reduce<unknown>((a, k) => (a && typeof a === "object" ? (a as Record<string, unknown>)[k] : undefined), o);
}

export function setPath<T extends object>(o: T, path: string, value: unknown): T {
  const [head, ...rest] = path.split(".");
  const cur = o as Record<string, unknown>;
  if (rest.length === 0) {
    const next = { ...cur };
    if (value === undefined) delete next[head];
    else next[head] = value;
    return next as T;
  }
  const child = (cur[head] && typeof cur[head] === "object" ? cur[head] : {}) as object;
  return { ...cur, [head]: setPath(child, rest.join("."), value) } as T;
}

export function unitLabel(f: FieldDef, s: UnitSystem): string | undefined {
  if (f.suffix) return f.suffix;
  if (!f.unit || f.unit === "none") return undefined;
  // Pressures entered are absolute (a control set point), never gauge.
  return UNIT_LABELS[s][f.unit === "pressure" ? "pressure_abs" : f.unit];
}

function toDisplay(v: number, unit: UnitKind | undefined, s: UnitSystem): number {
  if (unit === "temp") return convert.tempToDisplay(v, s);
  if (unit === "tempDiff") return convert.tempDiffToDisplay(v, s);
  if (unit === "length") return convert.lengthToDisplay(v, s);
  if (unit === "pressure") return convert.pressureToDisplay(v, s, "abs");
  return v;
}

function fromDisplay(v: number, unit: UnitKind | undefined, s: UnitSystem): number {
  if (unit === "temp") return convert.tempFromDisplay(v, s);
  if (unit === "tempDiff") return convert.tempDiffFromDisplay(v, s);
  if (unit === "length") return convert.lengthFromDisplay(v, s);
  if (unit === "pressure") return convert.pressureFromDisplay(v, s, "abs");
  return v;
}

/** Form keys cannot hold dots in react-hook-form without nesting: a flat key per field. */
export const formKey = (name: string) => name.replaceAll(".", "__");

export type FormValues = Record<string, string>;

/** The entity's values as the form shows them (strings, in display units, 4 significant figures off SI). */
export function toForm(entity: object, kind: Exclude<NodeKind, "outdoors">, s: UnitSystem): FormValues {
  const out: FormValues = {};
  for (const f of FIELDS[kind]) {
    const v = getPath(entity, f.name);
    if (v === undefined || v === null) out[formKey(f.name)] = "";
    else if (typeof v === "number") {
      const d = toDisplay(v, f.unit, s);
      out[formKey(f.name)] = String(s === "SI" || !f.unit || f.unit === "none" ? d : Number(d.toPrecision(6)));
    } else out[formKey(f.name)] = String(v);
  }
  return out;
}

export class FormFieldError extends Error {
  constructor(
    public readonly key: string,
    message: string,
  ) {
    super(message);
  }
}

/**
 * The entity with the form's changed fields applied (display → SI). Unchanged fields keep the
 * stored value exactly. Throws FormFieldError for text that is not a number.
 */
export function fromForm(entity: object, kind: Exclude<NodeKind, "outdoors">, values: FormValues, initial: FormValues, s: UnitSystem): object {
  let e = entity;
  for (const f of FIELDS[kind]) {
    const key = formKey(f.name);
    const raw = (values[key] ?? "").trim();
    if (raw === (initial[key] ?? "").trim()) continue;
    if (f.name === "feed.type") {
      // A new feed type starts from that type's defaults (its other fields differ).
      e = setPath(e, "feed", raw === "" ? undefined : { type: raw });
      continue;
    }
    if (raw === "") {
      e = setPath(e, f.name, undefined);
      continue;
    }
    if (f.keyword && raw.toLowerCase().replace("optimize", "optimise") === f.keyword) {
      e = setPath(e, f.name, f.keyword);
      continue;
    }
    if (f.type === "number") {
      const n = Number(raw.replace(",", ".").replace("\u2212", "-"));
      if (!Number.isFinite(n)) throw new FormFieldError(key, `${f.label} must be a number${f.keyword ? ` or “${f.keyword}”` : ""}`);
      e = setPath(e, f.name, fromDisplay(n, f.unit, s));
    } else e = setPath(e, f.name, raw);
  }
  return e;
}

/**
 * The references the canvas draws as links (and the Connections selects set). While an item is
 * still unconnected these fail the entity schema; that is reported on the canvas, and must not
 * stop the item's other inputs from being edited.
 */
export const LINK_FIELDS: Record<Exclude<NodeKind, "outdoors">, string[]> = {
  room: [],
  door: ["sides"],
  evaporator: ["roomId", "circuitId"],
  circuit: ["heatRejection.condenserId", "heatRejection.circuitId"],
  condenser: [],
};

export function isLinkIssue(kind: Exclude<NodeKind, "outdoors">, path: ReadonlyArray<PropertyKey>): boolean {
  const p = path.map(String).join(".");
  return LINK_FIELDS[kind].some((f) => p === f || p.startsWith(f + "."));
}

/** Maps an entity-schema issue path to the form field it belongs to (or null: shown above the form). */
export function issueKey(kind: Exclude<NodeKind, "outdoors">, path: ReadonlyArray<PropertyKey>): string | null {
  const p = path.map(String).join(".");
  const f = FIELDS[kind].find((x) => x.name === p || p.startsWith(x.name + "."));
  return f ? formKey(f.name) : null;
}
