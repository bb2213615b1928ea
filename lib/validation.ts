import type { z } from "zod";
import { AppError, type FieldError } from "./errors";

/** Field-named errors from a zod failure: the path joined with dots, the message as written. */
export function fieldErrorsOf(error: z.ZodError): FieldError[] {
  return error.issues.map((i) => ({ field: i.path.length ? fieldName(i.path as (string | number)[]) : "(root)", message: i.message }));
}

/** Parse or throw a validation AppError whose message names the first bad field. */
export function parseOrThrow<S extends z.ZodType>(schema: S, data: unknown): z.output<S> {
  const r = schema.safeParse(data);
  if (r.success) return r.data;
  const fields = fieldErrorsOf(r.error);
  const first = fields[0];
  throw new AppError("validation", `${first.field}: ${first.message}`, first.field, fields);
}

/** Deepest nesting of objects and arrays a JSON body may have (model documents need under 10). */
export const MAX_JSON_DEPTH = 64;

/** Keys that would reach an object's prototype machinery if copied by assignment; never data here. */
const FORBIDDEN_KEYS = new Set(["__proto__", "constructor", "prototype"]);

/** Dotted path of a field; an empty key is shown as "" so the name is never blank. */
function fieldName(path: (string | number)[]): string {
  return path.length ? path.map((k) => (k === "" ? '""' : String(k))).join(".") : "(body)";
}

/**
 * Checks parsed JSON before any schema sees it, in one bounded walk: nesting at most
 * `maxDepth` levels (deeper documents would exhaust the stack of recursive code further on),
 * no NUL character in a string or key (PostgreSQL text and jsonb refuse it), only finite
 * numbers, and no prototype keys. Throws a validation AppError naming the field.
 */
export function inspectJson(value: unknown, maxDepth = MAX_JSON_DEPTH, prefix: (string | number)[] = []): void {
  const bad = (path: (string | number)[], message: string): never => {
    const field = fieldName(path);
    throw new AppError("validation", `${field}: ${message}`, field, [{ field, message }]);
  };
  const walk = (v: unknown, path: (string | number)[], depth: number): void => {
    if (typeof v === "string") {
      if (v.includes("\0")) bad(path, "must not contain a NUL character (\\u0000)");
      return;
    }
    if (typeof v === "number") {
      if (!Number.isFinite(v)) bad(path, "must be a finite number");
      return;
    }
    if (v === null || typeof v !== "object") return;
    if (depth >= maxDepth) bad(path, `is nested too deeply: at most ${maxDepth} levels of objects and arrays are accepted`);
    if (Array.isArray(v)) {
      for (let i = 0; i < v.length; i++) walk(v[i], [...path, i], depth + 1);
      return;
    }
    for (const k of Object.keys(v)) {
      if (k.includes("\0")) bad(path, "has a key with a NUL character (\\u0000)");
      if (FORBIDDEN_KEYS.has(k)) bad([...path, k], `"${k}" is not an accepted key`);
      walk((v as Record<string, unknown>)[k], [...path, k], depth + 1);
    }
  };
  walk(value, prefix, 0);
}

/**
 * Keys present in `input` but absent from a schema's parsed `output` at the same place: the
 * keys a zod object dropped as unknown. Walks both together; where the output differs in kind
 * (a transform), that branch is not compared. Returns dotted paths, first ones first.
 */
export function strippedKeys(input: unknown, output: unknown, path: (string | number)[] = [], found: string[] = [], limit = 20): string[] {
  if (found.length >= limit || input === null || output === null || typeof input !== "object" || typeof output !== "object") return found;
  if (Array.isArray(input)) {
    if (!Array.isArray(output) || output.length !== input.length) return found;
    for (let i = 0; i < input.length; i++) strippedKeys(input[i], output[i], [...path, i], found, limit);
    return found;
  }
  if (Array.isArray(output)) return found;
  const out = output as Record<string, unknown>;
  for (const k of Object.keys(input)) {
    if (!Object.prototype.hasOwnProperty.call(out, k)) found.push(fieldName([...path, k]));
    else strippedKeys((input as Record<string, unknown>)[k], out[k], [...path, k], found, limit);
    if (found.length >= limit) break;
  }
  return found;
}

/** Throws a validation AppError naming the unknown keys (prefixed with `prefix`), if any. */
export function refuseUnknownKeys(input: unknown, output: unknown, prefix: string[] = [], what = "this request"): void {
  const keys = strippedKeys(input, output, prefix);
  if (keys.length === 0) return;
  const fields = keys.map((field) => ({ field, message: `unknown key "${field.split(".").pop()}": not part of ${what} (check its spelling)` }));
  throw new AppError("validation", `${fields[0].field}: ${fields[0].message}`, fields[0].field, fields);
}
