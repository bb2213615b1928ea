import { z } from "zod";

/** `?rev=N` prints a stored revision; without it, the current version. */
export const reportQuery = z.object({
  rev: z.coerce.number().int("Revision must be a whole number").min(1, "Revision must be 1 or more").optional(),
});
