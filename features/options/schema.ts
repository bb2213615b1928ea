import { z } from "zod";
import { optionNameSchema, assessmentSchema, plantStudySchema } from "@/lib/engine/options";
import { chargeOverrideSchema } from "@/lib/engine/plant/charge";
import type { OptionsComparison } from "@/lib/engine/compare-options";
import type { PracticalLimit } from "@/lib/engine/plant/tewi";

export const optionParams = z.object({
  ws: z.string().min(1),
  id: z.string().uuid("Facility id must be a UUID"),
  oid: z.string().min(1).max(100, "Option id must be at most 100 characters"),
});

/** A new option: a copy of the design plant (or of another option, `from`). */
export const createOptionSchema = z.object({
  name: optionNameSchema,
  from: z.string().min(1).max(100).optional(),
});

const assessmentPatch = z.object({
  leakPctPerYear: assessmentSchema.shape.leakPctPerYear.unwrap().optional(),
  recoveryPct: assessmentSchema.shape.recoveryPct.unwrap().optional(),
  /** null clears the user's limit (back to the table's value). */
  practicalLimitKgM3: assessmentSchema.shape.practicalLimitKgM3.unwrap().nullable().optional(),
  practicalLimitSource: z.string().max(200, "must be at most 200 characters").nullable().optional(),
  /** The user's internal volumes and fill fractions by part key; replaces the stored list. */
  chargeOverrides: z.array(chargeOverrideSchema).max(500, "at most 500 overrides").optional(),
});

/** Rename a plant ("design" or an option) and/or change its assessment inputs. */
export const updateOptionSchema = z
  .object({ name: optionNameSchema.optional() })
  .extend(assessmentPatch.shape)
  .refine((b) => Object.keys(b).length > 0, "Nothing to change: send name or an assessment field");

/** What all options share. */
export const updateStudySchema = z
  .object({
    years: plantStudySchema.shape.years.unwrap().optional(),
    gridKgCo2PerKWh: plantStudySchema.shape.gridKgCo2PerKWh.unwrap().optional(),
  })
  .refine((b) => Object.keys(b).length > 0, "Nothing to change: send years or gridKgCo2PerKWh");

export interface OptionsDto {
  facilityName: string;
  version: number;
  comparison: OptionsComparison;
  /** The weather year the annual figures come from; null when the facility has none yet. */
  weather: { label: string; kind: string; year: number } | null;
  /** Why annual figures are missing, in words (no weather year, or the engine refused). */
  annualNote: string | null;
  currency: string;
  practicalLimits: Record<string, PracticalLimit>;
  codesNotice: string;
  computeMs: number;
}
