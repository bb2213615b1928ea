import type { z } from "zod";
import { AppError, type FieldError } from "./errors";

/** Field-named errors from a zod failure: the path joined with dots, the message as written. */
export function fieldErrorsOf(error: z.ZodError): FieldError[] {
  return error.issues.map((i) => ({ field: i.path.map(String).join(".") || "(root)", message: i.message }));
}

/** Parse or throw a validation AppError whose message names the first bad field. */
export function parseOrThrow<S extends z.ZodType>(schema: S, data: unknown): z.output<S> {
  const r = schema.safeParse(data);
  if (r.success) return r.data;
  const fields = fieldErrorsOf(r.error);
  const first = fields[0];
  throw new AppError("validation", `${first.field}: ${first.message}`, first.field, fields);
}
