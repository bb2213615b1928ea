/** One problem with a ledger input: where it is (a dotted path such as `rooms.2.setPointC`) and why. */
export interface LoadInputIssue {
  field: string;
  message: string;
}

/**
 * Thrown when a facility model cannot be computed: a zod validation failure (every issue
 * listed with its path) or an engine-level impossibility found while computing (a batch that
 * cannot freeze in its air, a door open longer than the hour, an unknown commodity). The
 * engine throws this instead of ever returning NaN.
 */
export class LoadInputError extends Error {
  readonly code = "LOAD_INPUT_INVALID" as const;
  /** The first offending field, as a dotted path. */
  readonly field: string;
  readonly issues: LoadInputIssue[];

  constructor(issues: LoadInputIssue[]) {
    const list = issues.length > 0 ? issues : [{ field: "(input)", message: "invalid input" }];
    super(list.map((i) => `${i.field}: ${i.message}`).join("; "));
    this.name = "LoadInputError";
    this.field = list[0].field;
    this.issues = list;
  }
}

/** Formats a zod-style path (`["rooms", 2, "setPointC"]`) as `rooms.2.setPointC`. */
export function pathToField(path: ReadonlyArray<PropertyKey>): string {
  return path.length === 0 ? "(input)" : path.map((p) => String(p)).join(".");
}

/** Throws a {@link LoadInputError} for one field. */
export function fail(field: string, message: string): never {
  throw new LoadInputError([{ field, message }]);
}

/** Guards a computed number: an engine result must be finite, never NaN or ±Infinity. */
export function finiteOrFail(value: number, field: string, what: string): number {
  if (!Number.isFinite(value)) fail(field, `${what} is not a finite number (got ${value})`);
  return value;
}
