import { z } from "zod";
import { MAX_INT4, versionNumber } from "./schema";

export const modelDocSchema = z
  .object({
    schemaVersion: z.number().int().min(1, "schemaVersion must be 1 or later"),
    rooms: z.array(z.unknown()),
    doors: z.array(z.unknown()),
  })
  .loose();

export const saveModelSchema = z.object({
  baseVersion: versionNumber("baseVersion"),
  doc: modelDocSchema,
  summary: z.string().max(200, "summary must be at most 200 characters").optional(),
});

export const revisionParams = z.object({
  ws: z.string().min(1),
  id: z.string().uuid("Facility id must be a UUID"),
  n: z.coerce
    .number({ error: `Revision number must be a whole number from 1 to ${MAX_INT4}` })
    .int(`Revision number must be a whole number from 1 to ${MAX_INT4}`)
    .min(1, "Revision number must be 1 or more")
    .max(MAX_INT4, `Revision number must be at most ${MAX_INT4}`),
});

export const issueSchema = z.object({
  letter: z
    .string()
    .trim()
    .regex(/^[A-Z]{1,2}[0-9]{0,2}$/, "Revision letter must be 1–2 capital letters, optionally with up to 2 digits (e.g. A, B, P1)"),
  status: z.enum(["for comment", "for approval", "for tender", "for construction", "as built"], {
    error: "Status must be one of: for comment, for approval, for tender, for construction, as built",
  }),
  checkedBy: z.string().trim().min(2, "Checked by must name the checker (2 to 80 characters)").max(80, "Checked by must be at most 80 characters"),
});
