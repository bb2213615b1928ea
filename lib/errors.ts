/** Typed application errors and the one mapping from error code to HTTP status. */
export type ErrorCode =
  | "unauthenticated"
  | "forbidden"
  | "not_found"
  | "validation"
  | "conflict"
  | "rate_limited"
  | "invalid_token"
  | "last_owner"
  | "calculation"
  | "payload_too_large"
  | "unsupported_media_type"
  | "unavailable"
  | "internal";

const STATUS: Record<ErrorCode, number> = {
  unauthenticated: 401,
  forbidden: 403,
  not_found: 404,
  validation: 400,
  conflict: 409,
  rate_limited: 429,
  invalid_token: 400,
  last_owner: 409,
  calculation: 422,
  payload_too_large: 413,
  unsupported_media_type: 415,
  /** The database (or another service the request needs) is away; try again shortly. */
  unavailable: 503,
  internal: 500,
};

export interface FieldError {
  field: string;
  message: string;
}

export class AppError extends Error {
  constructor(
    public readonly code: ErrorCode,
    message: string,
    public readonly field?: string,
    public readonly fieldErrors?: FieldError[],
    public readonly extra?: Record<string, unknown>,
  ) {
    super(message);
    this.name = "AppError";
  }
  get status(): number {
    return STATUS[this.code];
  }
}

export function httpStatus(code: ErrorCode): number {
  return STATUS[code];
}

/** The JSON error body every API route returns: `{ error: { code, message, field?, fields? } }`. */
export function errorBody(e: AppError) {
  return {
    error: {
      code: e.code,
      message: e.message,
      ...(e.field ? { field: e.field } : {}),
      ...(e.fieldErrors?.length ? { fields: e.fieldErrors } : {}),
      ...(e.extra ?? {}),
    },
  };
}
