import { z } from "zod";

/**
 * The allowed ranges of the site conditions, SI; the form states them in the user's units
 * before sending, the schema enforces them on the server.
 */
/** Largest value of a PostgreSQL integer column (versions and revision numbers are stored in one). */
export const MAX_INT4 = 2_147_483_647;

/** A model version number in a body: a whole number from 1 to the column's largest. */
export const versionNumber = (field: string) =>
  z
    .number({ error: `${field} (the version you edited) is required: a whole number from 1 to ${MAX_INT4}` })
    .int(`${field} must be a whole number`)
    .min(1, `${field} must be 1 or more`)
    .max(MAX_INT4, `${field} must be at most ${MAX_INT4}`);

export const SITE_RANGES = {
  designDryBulbC: { label: "Design dry bulb", min: -50, max: 55, kind: "temp" },
  coincidentWetBulbC: { label: "Coincident wet bulb", min: -50, max: 45, kind: "temp" },
  designRhPct: { label: "Design relative humidity", min: 1, max: 100, kind: "percent" },
  groundTempC: { label: "Ground temperature", min: -30, max: 40, kind: "temp" },
  elevationM: { label: "Elevation", min: -450, max: 5000, kind: "length" },
} as const;

const num = (field: string, min: number, max: number, unit: string) =>
  z
    .number({ error: `${field} must be a number (${min} to ${max} ${unit})` })
    .refine(Number.isFinite, `${field} must be a finite number`)
    .refine((v) => v >= min && v <= max, `${field} must be between ${min} and ${max} ${unit}`);

/**
 * Site design conditions (SI). Ranges cover inhabited sites: design dry bulb −50…+55 °C,
 * ground −30…+40 °C, elevation −450 m (Dead Sea shore) … 5000 m.
 */
export const siteConditionsSchema = z
  .object({
    designDryBulbC: num(SITE_RANGES.designDryBulbC.label, SITE_RANGES.designDryBulbC.min, SITE_RANGES.designDryBulbC.max, "°C"),
    coincidentWetBulbC: num(SITE_RANGES.coincidentWetBulbC.label, SITE_RANGES.coincidentWetBulbC.min, SITE_RANGES.coincidentWetBulbC.max, "°C").nullish(),
    designRhPct: num(SITE_RANGES.designRhPct.label, SITE_RANGES.designRhPct.min, SITE_RANGES.designRhPct.max, "%").nullish(),
    groundTempC: num(SITE_RANGES.groundTempC.label, SITE_RANGES.groundTempC.min, SITE_RANGES.groundTempC.max, "°C"),
    elevationM: num(SITE_RANGES.elevationM.label, SITE_RANGES.elevationM.min, SITE_RANGES.elevationM.max, "m"),
  })
  .superRefine((s, ctx) => {
    const hasWb = s.coincidentWetBulbC !== null && s.coincidentWetBulbC !== undefined;
    const hasRh = s.designRhPct !== null && s.designRhPct !== undefined;
    if (!hasWb && !hasRh) {
      ctx.addIssue({
        code: "custom",
        path: ["coincidentWetBulbC"],
        message: "Give the coincident wet bulb (°C) or the design relative humidity (%)",
      });
    }
    if (hasWb && hasRh) {
      ctx.addIssue({
        code: "custom",
        path: ["designRhPct"],
        message: "Give either the coincident wet bulb or the relative humidity, not both",
      });
    }
    if (hasWb && (s.coincidentWetBulbC as number) > s.designDryBulbC) {
      ctx.addIssue({
        code: "custom",
        path: ["coincidentWetBulbC"],
        message: `Coincident wet bulb must not exceed the design dry bulb (${s.designDryBulbC} °C)`,
      });
    }
  });
export type SiteConditions = z.infer<typeof siteConditionsSchema>;

export const facilityNameSchema = z
  .string({ error: "Name is required" })
  .trim()
  .min(1, "Name is required (1 to 120 characters)")
  .max(120, "Name must be at most 120 characters");

export const createFacilitySchema = z.object({ name: facilityNameSchema, site: siteConditionsSchema });
export const updateFacilitySchema = z
  .object({
    name: facilityNameSchema.optional(),
    site: siteConditionsSchema.optional(),
    /** The version the edit was based on; a stale one is refused with 409. */
    baseVersion: versionNumber("baseVersion").optional(),
  })
  .refine((v) => v.name !== undefined || v.site !== undefined, { message: "Nothing to change: give name or site" });
export const duplicateFacilitySchema = z.object({ name: facilityNameSchema.optional() });
export const archiveFacilitySchema = z.object({ archived: z.boolean({ error: "archived must be true or false" }) });

export const facilityParams = z.object({ ws: z.string().min(1), id: z.string().uuid("Facility id must be a UUID") });
export const wsParams = z.object({ ws: z.string().min(1) });
export const listFacilitiesQuery = z.object({ archived: z.enum(["0", "1"]).default("0") });

export interface FacilityDto {
  id: string;
  name: string;
  site: SiteConditions;
  version: number;
  archived: boolean;
  hasModel: boolean;
  createdAt: string;
  updatedAt: string;
}
