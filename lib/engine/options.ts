/**
 * Plant options of one facility: the rooms are shared, the plant is per option. The design
 * plant stays in `plant`; the alternatives sit beside it in `plantOptions`, each with its own
 * plant and its own assessment inputs (leak rate, end-of-life recovery, practical limit,
 * charge overrides). `plantStudy` holds what all options share (years, grid emission factor)
 * and the design's own name and assessment, so that making an option the design swaps plant,
 * name and assessment together. Pure: the schemas and edits here run on the server and in a
 * browser alike.
 */
import { z } from "zod";
import { chargeOverrideSchema } from "./plant/charge";
import { plantInputSchema, type PlantInput } from "./plant/schema";

const range = (lo: number, hi: number, unit = "") => {
  const msg = `must be between ${lo} and ${hi}${unit ? " " + unit : ""}`;
  return z.number(msg).min(lo, msg).max(hi, msg);
};

export const MAX_PLANT_OPTIONS = 8;

export const optionNameSchema = z
  .string("must be text")
  .trim()
  .min(1, "must not be empty")
  .max(80, "must be at most 80 characters");

/** Per plant: what TEWI and the charge estimate need beyond the plant itself. */
export const assessmentSchema = z.object({
  /** Annual leakage, % of the charge per year (common practice: 2–5 % industrial, 10–15 % commercial DX). */
  leakPctPerYear: range(0, 100, "%/year").default(5),
  /** Charge recovered at end of life, % (common practice 70–95 %). */
  recoveryPct: range(0, 100, "%").default(80),
  /** Practical limit the user picked or entered, kg/m³; default the table's value for the refrigerant. */
  practicalLimitKgM3: z
    .number("must be greater than 0 and at most 10 kg/m³")
    .gt(0, "must be greater than 0 and at most 10 kg/m³")
    .max(10, "must be greater than 0 and at most 10 kg/m³")
    .optional(),
  /** Where the user's practical limit comes from (shown beside it). */
  practicalLimitSource: z.string().max(200, "must be at most 200 characters").optional(),
  /** The user's internal volumes and fill fractions by part key. */
  chargeOverrides: z.array(chargeOverrideSchema).max(500, "at most 500 overrides").default([]),
});
export type Assessment = z.output<typeof assessmentSchema>;

export const plantOptionSchema = z.object({
  id: z.string().min(1, "must not be empty").max(100).regex(/^[A-Za-z0-9_-]+$/, "letters, digits, _ and - only"),
  name: optionNameSchema,
  plant: plantInputSchema.prefault({}),
  assessment: assessmentSchema.prefault({}),
});
export type PlantOption = z.output<typeof plantOptionSchema>;

export const plantStudySchema = z.object({
  /** Name of the design plant in comparisons. */
  designName: optionNameSchema.default("Design"),
  designAssessment: assessmentSchema.prefault({}),
  /** Operating years for TEWI and running cost (EN 378-1 Annex B's n). */
  years: range(1, 60, "years").default(15),
  /** Grid emission factor β, kg CO2 per kWh: enter the supply's own figure. */
  gridKgCo2PerKWh: range(0, 2, "kg CO2/kWh").default(0.25),
});
export type PlantStudy = z.output<typeof plantStudySchema>;

/** Every plant of the facility for comparison: the design first, then the options in order. */
export interface PlantAlternative {
  /** "design" for the design plant, else the option's id. */
  id: string;
  name: string;
  isDesign: boolean;
  plant: PlantInput;
  assessment: Assessment;
}

export const DESIGN_ID = "design";

export function alternativesOf(m: { plant: PlantInput; plantOptions: PlantOption[]; plantStudy: PlantStudy }): PlantAlternative[] {
  return [
    { id: DESIGN_ID, name: m.plantStudy.designName, isDesign: true, plant: m.plant, assessment: m.plantStudy.designAssessment },
    ...m.plantOptions.map((o) => ({ id: o.id, name: o.name, isDesign: false, plant: o.plant, assessment: o.assessment })),
  ];
}

/**
 * Edits of the stored (raw) document. They work on plain JSON, keep everything they do not
 * touch by reference, and throw `OptionEditError` naming the field when the edit cannot apply.
 */
export class OptionEditError extends Error {
  constructor(
    message: string,
    public readonly field: string,
    public readonly code: "not_found" | "validation" = "validation",
  ) {
    super(message);
    this.name = "OptionEditError";
  }
}

type Doc = Record<string, unknown> & { plant?: unknown; plantOptions?: unknown; plantStudy?: unknown };
type RawOption = { id: string; name: string; plant?: unknown; assessment?: unknown };

function optionsOf(doc: Doc): RawOption[] {
  return Array.isArray(doc.plantOptions) ? (doc.plantOptions as RawOption[]) : [];
}
function studyOf(doc: Doc): Record<string, unknown> {
  return doc.plantStudy && typeof doc.plantStudy === "object" ? (doc.plantStudy as Record<string, unknown>) : {};
}
function nameOf(doc: Doc, id: string): string {
  if (id === DESIGN_ID) return typeof studyOf(doc).designName === "string" ? (studyOf(doc).designName as string) : "Design";
  return optionsOf(doc).find((o) => o.id === id)?.name ?? id;
}

function checkName(doc: Doc, name: string, exceptId?: string): string {
  const r = optionNameSchema.safeParse(name);
  if (!r.success) throw new OptionEditError(`name: ${r.error.issues[0].message}`, "name");
  const taken = [DESIGN_ID, ...optionsOf(doc).map((o) => o.id)].filter((id) => id !== exceptId).some((id) => nameOf(doc, id).toLowerCase() === r.data.toLowerCase());
  if (taken) throw new OptionEditError(`name: "${r.data}" is already the name of a plant of this facility`, "name");
  return r.data;
}

function findOption(doc: Doc, id: string): number {
  const i = optionsOf(doc).findIndex((o) => o.id === id);
  if (i < 0) throw new OptionEditError(`No option "${id}" in this facility.`, "optionId", "not_found");
  return i;
}

/** A new option copying the design plant (or another option's plant and assessment). */
export function addOption<D extends Doc>(doc: D, args: { id: string; name: string; from?: string }): D {
  const opts = optionsOf(doc);
  if (opts.length >= MAX_PLANT_OPTIONS) throw new OptionEditError(`A facility has at most ${MAX_PLANT_OPTIONS} options besides the design.`, "name");
  if (opts.some((o) => o.id === args.id) || args.id === DESIGN_ID) throw new OptionEditError(`id "${args.id}" is taken`, "id");
  const name = checkName(doc, args.name);
  const from = args.from ?? DESIGN_ID;
  let plant: unknown;
  let assessment: unknown;
  if (from === DESIGN_ID) {
    plant = doc.plant ?? {};
    assessment = studyOf(doc).designAssessment ?? {};
  } else {
    const src = opts[findOption(doc, from)];
    plant = src.plant ?? {};
    assessment = src.assessment ?? {};
  }
  const copy: RawOption = { id: args.id, name, plant: JSON.parse(JSON.stringify(plant)), assessment: JSON.parse(JSON.stringify(assessment)) };
  return { ...doc, plantOptions: [...opts, copy] };
}

/** Renames the design or an option (names are unique, case-insensitively). */
export function renameOption<D extends Doc>(doc: D, id: string, newName: string): D {
  if (id === DESIGN_ID) return { ...doc, plantStudy: { ...studyOf(doc), designName: checkName(doc, newName, DESIGN_ID) } };
  const i = findOption(doc, id);
  const name = checkName(doc, newName, id);
  const opts = optionsOf(doc).slice();
  opts[i] = { ...opts[i], name };
  return { ...doc, plantOptions: opts };
}

export function deleteOption<D extends Doc>(doc: D, id: string): D {
  if (id === DESIGN_ID) throw new OptionEditError("The design plant cannot be deleted; make another option the design first.", "optionId");
  const i = findOption(doc, id);
  return { ...doc, plantOptions: optionsOf(doc).filter((_, j) => j !== i) };
}

/**
 * Makes an option the design: its plant, name and assessment move into `plant` and
 * `plantStudy`, and the former design takes the option's place (same id, same position), so
 * nothing is lost and the swap can be undone by swapping back.
 */
export function makeDesign<D extends Doc>(doc: D, id: string): D {
  const i = findOption(doc, id);
  const opts = optionsOf(doc).slice();
  const opt = opts[i];
  const study = studyOf(doc);
  opts[i] = { id: opt.id, name: nameOf(doc, DESIGN_ID), plant: doc.plant ?? {}, assessment: study.designAssessment ?? {} };
  return {
    ...doc,
    plant: opt.plant ?? {},
    plantOptions: opts,
    plantStudy: { ...study, designName: opt.name, designAssessment: opt.assessment ?? {} },
  };
}

/** Sets the study's shared inputs or one plant's assessment inputs (merged over what is stored). */
export function setAssessment<D extends Doc>(doc: D, id: string, patch: Record<string, unknown>): D {
  if (id === DESIGN_ID) {
    const s = studyOf(doc);
    return { ...doc, plantStudy: { ...s, designAssessment: { ...((s.designAssessment as object) ?? {}), ...patch } } };
  }
  const i = findOption(doc, id);
  const opts = optionsOf(doc).slice();
  opts[i] = { ...opts[i], assessment: { ...((opts[i].assessment as object) ?? {}), ...patch } };
  return { ...doc, plantOptions: opts };
}

export function setStudy<D extends Doc>(doc: D, patch: { years?: number; gridKgCo2PerKWh?: number }): D {
  return { ...doc, plantStudy: { ...studyOf(doc), ...patch } };
}
