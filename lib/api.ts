import "server-only";
import { randomUUID } from "node:crypto";
import type { z } from "zod";
import { AppError, errorBody } from "./errors";
import { dbErrorToAppError } from "./db-errors";
import { authorize, type Action, type WorkspaceAccess } from "./authz";
import { currentUser, type CurrentUser } from "./session";
import { inspectJson, parseOrThrow, refuseUnknownKeys } from "./validation";
import { env } from "./env";
import { log } from "./log";

/** Largest JSON body a route accepts unless it says otherwise. */
export const DEFAULT_MAX_BODY_BYTES = 1024 * 1024;
/** Largest JSON body of the routes that take a whole facility model document. */
export const MODEL_MAX_BODY_BYTES = 4 * 1024 * 1024;

const MUTATING = new Set(["POST", "PUT", "PATCH", "DELETE"]);

function mb(bytes: number): string {
  return bytes >= 1024 * 1024 ? `${+(bytes / 1048576).toFixed(1)} MB` : `${Math.round(bytes / 1024)} KB`;
}

/**
 * A mutating request (POST, PUT, PATCH, DELETE) sent by a page of another site — another port
 * on the same host, a sibling subdomain — with the user's cookie is refused: its Origin must be
 * the app's own (APP_URL), or, without an Origin, its Sec-Fetch-Site must not say cross-site or
 * same-site. Requests with neither header (scripts, curl: no browser, no ambient cookie) pass.
 * Returns the refusal, or null when the request may go on.
 */
export function foreignOriginError(req: Request): AppError | null {
  if (!MUTATING.has(req.method.toUpperCase())) return null;
  const own = new URL(env.APP_URL).origin;
  const origin = req.headers.get("origin");
  if (origin !== null) {
    let from = "null";
    try {
      from = new URL(origin).origin;
    } catch {
      /* an unparseable Origin is foreign */
    }
    if (from === own) return null;
    return new AppError("forbidden", `Refused: this change was sent from another site (Origin ${origin}). Rimeplan accepts changes only from its own pages at ${own}.`, "origin");
  }
  const site = req.headers.get("sec-fetch-site");
  if (site === "cross-site" || site === "same-site")
    return new AppError("forbidden", `Refused: this change was sent from another site (Sec-Fetch-Site: ${site}). Rimeplan accepts changes only from its own pages at ${own}.`, "origin");
  return null;
}

/** For handlers outside route() (next-auth's): the 403 answer, or null when the request may go on. */
export function refuseForeignOrigin(req: Request): Response | null {
  const e = foreignOriginError(req);
  return e ? Response.json(errorBody(e), { status: e.status }) : null;
}

/** JSON bodies must say so: `application/json`, optionally with a UTF-8 charset. */
function requireJsonContentType(req: Request): void {
  const ct = req.headers.get("content-type");
  const [type, ...params] = (ct ?? "").split(";").map((x) => x.trim().toLowerCase());
  const charset = params.find((p) => p.startsWith("charset="))?.slice(8).replace(/"/g, "");
  if (type === "application/json" && (charset === undefined || charset === "utf-8" || charset === "utf8")) return;
  throw new AppError(
    "unsupported_media_type",
    `The request body must be JSON sent with Content-Type: application/json (this one was ${ct ? `"${ct}"` : "sent without a Content-Type"}).`,
    "content-type",
  );
}

/**
 * Reads a request body up to `maxBytes`, checking while the stream arrives: a declared
 * Content-Length over the limit is refused before reading, and a body without one (chunked)
 * is refused as soon as it passes the limit — its reader is cancelled, the rest never read.
 */
export async function readBodyLimited(req: Request, maxBytes: number, what = "The request body"): Promise<Buffer> {
  const tooLarge = (size?: number) =>
    new AppError(
      "payload_too_large",
      `${what} is ${size !== undefined ? mb(size) : "larger than the limit"}; at most ${mb(maxBytes)} is accepted here.`,
      "(body)",
      undefined,
      { limitBytes: maxBytes },
    );
  const declared = req.headers.get("content-length");
  if (declared !== null && Number(declared) > maxBytes) throw tooLarge(Number(declared));
  if (!req.body) return Buffer.alloc(0);
  const reader = req.body.getReader();
  const chunks: Uint8Array[] = [];
  let total = 0;
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    total += value.byteLength;
    if (total > maxBytes) {
      await reader.cancel().catch(() => undefined);
      throw tooLarge();
    }
    chunks.push(value);
  }
  return Buffer.concat(chunks, total);
}

/** NUL characters in path segments or query values would reach PostgreSQL, which refuses them. */
function refuseNul(values: Record<string, unknown>, where: string): void {
  for (const [k, v] of Object.entries(values)) {
    for (const x of Array.isArray(v) ? v : [v]) {
      if ((typeof x === "string" && x.includes("\0")) || k.includes("\0"))
        throw new AppError("validation", `${k}: the ${where} must not contain a NUL character (%00)`, k);
    }
  }
}

interface Ctx<P, B, Q> {
  req: Request;
  requestId: string;
  user: CurrentUser;
  access: WorkspaceAccess | null;
  params: P;
  body: B;
  query: Q;
  /** The raw body of an upload route (`upload` set), read within its limit. */
  upload: Buffer | null;
}

interface RouteOptions<PS extends z.ZodType, BS extends z.ZodType, QS extends z.ZodType> {
  /** Route params (all strings); must include `ws` when `action` is set. */
  params?: PS;
  body?: BS;
  /** Largest JSON body accepted, bytes (default 1 MB). */
  maxBodyBytes?: number;
  /** The body is a file (raw or multipart), read by route() within `maxBytes` into ctx.upload. */
  upload?: { maxBytes: number; what: string };
  query?: QS;
  /** The authorization check against the workspace named by params.ws. */
  action?: Action;
  /** Public routes (no sign-in). */
  public?: boolean;
  handler: (ctx: Ctx<z.output<PS>, z.output<BS>, z.output<QS>>) => Promise<unknown>;
}

/**
 * Every route handler goes through here: refuse changes from another site → authenticate →
 * parse params → authorize (role and workspace, so a refused role always gets 403 whatever it
 * sent) → read the body within its limit (JSON: content type, depth, NUL, finite numbers,
 * schema, no unknown keys; or an upload) → parse the query → work → typed JSON.
 */
export function route<PS extends z.ZodType = z.ZodType, BS extends z.ZodType = z.ZodType, QS extends z.ZodType = z.ZodType>(
  opts: RouteOptions<PS, BS, QS>,
) {
  return async (req: Request, context: { params: Promise<Record<string, string | string[]>> }): Promise<Response> => {
    const requestId = req.headers.get("x-request-id") ?? randomUUID();
    const started = performance.now();
    const url = new URL(req.url);
    let status = 500;
    try {
      const foreign = foreignOriginError(req);
      if (foreign) throw foreign;
      const user = await currentUser();
      if (!user && !opts.public) throw new AppError("unauthenticated", "Sign in first.");
      const rawParams = context?.params ? await context.params : {};
      refuseNul(rawParams, "path");
      const params = opts.params ? parseOrThrow(opts.params, rawParams) : rawParams;
      let access: WorkspaceAccess | null = null;
      if (opts.action) {
        const ws = (params as { ws?: string }).ws;
        if (!ws) throw new AppError("internal", "Route misconfigured: no workspace parameter.");
        access = await authorize(user!.id, ws, opts.action);
      }
      let body: unknown = undefined;
      if (opts.body) {
        requireJsonContentType(req);
        const raw = await readBodyLimited(req, opts.maxBodyBytes ?? DEFAULT_MAX_BODY_BYTES);
        let json: unknown;
        try {
          json = JSON.parse(new TextDecoder("utf-8", { fatal: true }).decode(raw));
        } catch {
          throw new AppError("validation", "The request body must be JSON (UTF-8).", "(body)");
        }
        inspectJson(json);
        body = parseOrThrow(opts.body, json);
        refuseUnknownKeys(json, body);
      }
      const upload = opts.upload ? await readBodyLimited(req, opts.upload.maxBytes, opts.upload.what) : null;
      refuseNul(Object.fromEntries(url.searchParams), "query");
      const query = opts.query ? parseOrThrow(opts.query, Object.fromEntries(url.searchParams)) : undefined;
      const result = await opts.handler({
        req,
        requestId,
        user: user as CurrentUser,
        access,
        params: params as never,
        body: body as never,
        query: query as never,
        upload,
      });
      const res = result instanceof Response ? result : Response.json(result ?? { ok: true });
      res.headers.set("x-request-id", requestId);
      status = res.status;
      return res;
    } catch (e) {
      // Database errors that have a meaning for the requester (503 while it is away, 400 for a
      // value it cannot hold, 409 for a lost race) are answered as such; the rest is a 500.
      const known = dbErrorToAppError(e);
      const err =
        known ??
        new AppError("internal", "Something went wrong on the server. Try again; if it persists, report request " + requestId + ".");
      if (!known) log("error", "unhandled error", { requestId, error: String(e), stack: (e as Error)?.stack });
      else if (!(e instanceof AppError)) log("warn", "database error answered as " + known.code, { requestId, error: String((e as Error)?.cause ?? e) });
      status = err.status;
      const retryAfter = err.extra?.retryAfterSeconds;
      const headers: Record<string, string> = { "x-request-id": requestId, ...(typeof retryAfter === "number" ? { "retry-after": String(retryAfter) } : {}) };
      if (err.code === "unavailable") headers["retry-after"] = "5";
      return Response.json(errorBody(err), { status: err.status, headers });
    } finally {
      log("info", "request", {
        requestId,
        method: req.method,
        path: url.pathname,
        status,
        ms: Math.round(performance.now() - started),
      });
    }
  };
}

export function created(data: unknown): Response {
  return Response.json(data, { status: 201 });
}
