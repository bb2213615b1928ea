import "server-only";
import { randomUUID } from "node:crypto";
import type { z } from "zod";
import { AppError, errorBody } from "./errors";
import { authorize, type Action, type WorkspaceAccess } from "./authz";
import { currentUser, type CurrentUser } from "./session";
import { parseOrThrow } from "./validation";
import { log } from "./log";

interface Ctx<P, B, Q> {
  req: Request;
  requestId: string;
  user: CurrentUser;
  access: WorkspaceAccess | null;
  params: P;
  body: B;
  query: Q;
}

interface RouteOptions<PS extends z.ZodType, BS extends z.ZodType, QS extends z.ZodType> {
  /** Route params (all strings); must include `ws` when `action` is set. */
  params?: PS;
  body?: BS;
  query?: QS;
  /** The authorization check against the workspace named by params.ws. */
  action?: Action;
  /** Public routes (no sign-in). */
  public?: boolean;
  handler: (ctx: Ctx<z.output<PS>, z.output<BS>, z.output<QS>>) => Promise<unknown>;
}

/**
 * Every route handler goes through here: authenticate → parse params → authorize (role and
 * workspace, so a refused role always gets 403 whatever it sent) → parse body and query →
 * work → typed JSON.
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
      const user = await currentUser();
      if (!user && !opts.public) throw new AppError("unauthenticated", "Sign in first.");
      const rawParams = context?.params ? await context.params : {};
      const params = opts.params ? parseOrThrow(opts.params, rawParams) : rawParams;
      let access: WorkspaceAccess | null = null;
      if (opts.action) {
        const ws = (params as { ws?: string }).ws;
        if (!ws) throw new AppError("internal", "Route misconfigured: no workspace parameter.");
        access = await authorize(user!.id, ws, opts.action);
      }
      let body: unknown = undefined;
      if (opts.body) {
        let json: unknown;
        try {
          json = await req.json();
        } catch {
          throw new AppError("validation", "The request body must be JSON.", "(body)");
        }
        body = parseOrThrow(opts.body, json);
      }
      const query = opts.query ? parseOrThrow(opts.query, Object.fromEntries(url.searchParams)) : undefined;
      const result = await opts.handler({
        req,
        requestId,
        user: user as CurrentUser,
        access,
        params: params as never,
        body: body as never,
        query: query as never,
      });
      const res = result instanceof Response ? result : Response.json(result ?? { ok: true });
      res.headers.set("x-request-id", requestId);
      status = res.status;
      return res;
    } catch (e) {
      const err =
        e instanceof AppError
          ? e
          : new AppError("internal", "Something went wrong on the server. Try again; if it persists, report request " + requestId + ".");
      if (!(e instanceof AppError)) log("error", "unhandled error", { requestId, error: String(e), stack: (e as Error)?.stack });
      status = err.status;
      const retryAfter = err.extra?.retryAfterSeconds;
      const headers: Record<string, string> = { "x-request-id": requestId, ...(typeof retryAfter === "number" ? { "retry-after": String(retryAfter) } : {}) };
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
