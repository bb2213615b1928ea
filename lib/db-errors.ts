/**
 * What a database error means for the person who sent the request. PostgreSQL's own errors
 * (and the driver's connection failures) are turned into AppErrors with a status that says
 * whose move it is: 503 while the database is away (try again shortly), 400 for a value the
 * database cannot hold, 409 when someone else won a race. Anything else stays unclassified
 * (the caller answers 500 and logs it).
 */
import { AppError } from "./errors";

export const DATABASE_UNAVAILABLE_MESSAGE =
  "The database is not reachable right now, so nothing was read or saved. Try again in a minute; " +
  "if it keeps happening, tell whoever runs Rimeplan.";

/** Node's socket errors seen when the server is down, restarting or unreachable. */
const CONNECTION_ERRNOS = new Set([
  "ECONNREFUSED",
  "ECONNRESET",
  "ECONNABORTED",
  "EPIPE",
  "ETIMEDOUT",
  "EHOSTUNREACH",
  "ENETUNREACH",
  "ENOTFOUND",
  "EAI_AGAIN",
]);

/**
 * SQLSTATEs meaning the server is away or refusing work for now: 57P01 admin shutdown,
 * 57P02 crash shutdown, 57P03 cannot connect now (starting up or shutting down), 53300 too
 * many connections; class 08 is connection exceptions.
 */
const UNAVAILABLE_SQLSTATES = new Set(["57P01", "57P02", "57P03", "53300"]);

/** node-postgres's own messages for a connection that ended or never came. */
const CONNECTION_MESSAGES = [
  /connection terminated/i,
  /timeout exceeded when trying to connect/i,
  /connection timeout/i,
  /client has encountered a connection error/i,
  /not queryable/i,
  /cannot use a pool after calling end/i,
];

interface ErrLike {
  code?: unknown;
  message?: unknown;
  cause?: unknown;
  errors?: unknown;
}

/** The error and what it wraps (drizzle's DrizzleQueryError keeps the driver's error as cause). */
function chain(e: unknown): ErrLike[] {
  const out: ErrLike[] = [];
  const queue: unknown[] = [e];
  while (queue.length && out.length < 10) {
    const x = queue.shift();
    if (!x || typeof x !== "object") continue;
    const err = x as ErrLike;
    out.push(err);
    if (err.cause) queue.push(err.cause);
    if (Array.isArray(err.errors)) queue.push(...err.errors);
  }
  return out;
}

const codeOf = (e: ErrLike) => (typeof e.code === "string" ? e.code : "");
const messageOf = (e: ErrLike) => (typeof e.message === "string" ? e.message : "");

/** True when the error means the database could not be reached or dropped the connection. */
export function isDatabaseUnavailable(e: unknown): boolean {
  return chain(e).some((x) => {
    const code = codeOf(x);
    if (CONNECTION_ERRNOS.has(code) || UNAVAILABLE_SQLSTATES.has(code) || /^08[0-9A-Z]{3}$/.test(code)) return true;
    const msg = messageOf(x);
    return CONNECTION_MESSAGES.some((re) => re.test(msg));
  });
}

/** The AppError a database error stands for, or null when it is not one we can explain. */
export function dbErrorToAppError(e: unknown): AppError | null {
  if (e instanceof AppError) return e;
  if (isDatabaseUnavailable(e)) return new AppError("unavailable", DATABASE_UNAVAILABLE_MESSAGE);
  for (const x of chain(e)) {
    switch (codeOf(x)) {
      case "22003":
        return new AppError(
          "validation",
          "A number in the request is outside the range that can be stored (whole numbers run from -2147483648 to 2147483647).",
        );
      case "22P02":
        return new AppError("validation", "A value in the request is not in the expected form (for example an id that is not a UUID, or a number that is not a number).");
      case "22021":
      case "22P05":
        return new AppError("validation", "Text in the request contains a character that cannot be stored (such as a NUL character, \\u0000). Remove it and send again.");
      case "23505":
        return new AppError("conflict", "This was just created or changed by another request, so yours was not applied. Reload and try again.");
      case "40001":
      case "40P01":
        return new AppError("conflict", "Someone else changed the same thing at the same moment, so your change was not applied. Try again.");
    }
  }
  return null;
}
