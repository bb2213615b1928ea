import { describe, expect, it } from "vitest";
import { DrizzleQueryError } from "drizzle-orm/errors";
import pg from "pg";
import { AppError } from "./errors";
import { DATABASE_UNAVAILABLE_MESSAGE, dbErrorToAppError, isDatabaseUnavailable } from "./db-errors";

// Errors shaped as node-postgres and Node raise them; the same codes come from a real server
// in tests/integration/db-faults.test.ts.
function pgError(code: string, message = "server said no") {
  const e = new pg.DatabaseError(message, 0, "error");
  e.code = code;
  return e;
}
const wrapped = (cause: Error) => new DrizzleQueryError("select 1", [], cause);
const sysError = (code: string) => Object.assign(new Error(`connect ${code} 127.0.0.1:5432`), { code });

describe("database errors → what the requester is told", () => {
  it.each([
    ["refused connection", sysError("ECONNREFUSED")],
    ["reset connection", sysError("ECONNRESET")],
    ["admin shutdown 57P01", pgError("57P01", "terminating connection due to administrator command")],
    ["crash shutdown 57P02", pgError("57P02")],
    ["starting up 57P03", pgError("57P03", "the database system is starting up")],
    ["class 08 connection failure", pgError("08006")],
    ["connection ended", new Error("Connection terminated unexpectedly")],
    ["pool connect timeout", new Error("timeout exceeded when trying to connect")],
    ["both addresses refused (AggregateError)", Object.assign(new AggregateError([sysError("ECONNREFUSED"), sysError("ECONNREFUSED")]), {})],
  ])("%s → 503 unavailable with the clear message, also when drizzle wraps it", (_name, err) => {
    for (const e of [err, wrapped(err)]) {
      expect(isDatabaseUnavailable(e)).toBe(true);
      const a = dbErrorToAppError(e)!;
      expect(a.code).toBe("unavailable");
      expect(a.status).toBe(503);
      expect(a.message).toBe(DATABASE_UNAVAILABLE_MESSAGE);
    }
  });

  it.each([
    ["22003", "validation", 400, /outside the range/],
    ["22P02", "validation", 400, /not in the expected form/],
    ["22021", "validation", 400, /NUL/],
    ["22P05", "validation", 400, /NUL/],
    ["23505", "conflict", 409, /another request/],
    ["40001", "conflict", 409, /same moment/],
    ["40P01", "conflict", 409, /same moment/],
  ])("SQLSTATE %s → %s %i", (code, appCode, status, msg) => {
    const a = dbErrorToAppError(wrapped(pgError(code)))!;
    expect(a).toBeInstanceOf(AppError);
    expect(a.code).toBe(appCode);
    expect(a.status).toBe(status);
    expect(a.message).toMatch(msg);
    expect(isDatabaseUnavailable(pgError(code))).toBe(false);
  });

  it("leaves other errors unclassified (they stay 500 and are logged), and AppErrors as they are", () => {
    expect(dbErrorToAppError(wrapped(pgError("42P01", "relation does not exist")))).toBeNull();
    expect(dbErrorToAppError(new TypeError("x is undefined"))).toBeNull();
    expect(dbErrorToAppError("a string")).toBeNull();
    expect(dbErrorToAppError(null)).toBeNull();
    const own = new AppError("not_found", "Facility not found in this workspace.");
    expect(dbErrorToAppError(own)).toBe(own);
  });
});
