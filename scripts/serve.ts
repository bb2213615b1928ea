/**
 * The app's HTTP server: Next.js behind a thin Node server, so the app knows who is really
 * connected. `npm run demo` and the browser tests start it; see docs/operations.md.
 *
 * - Listens on HOST (default 127.0.0.1: loopback unless told otherwise) and PORT.
 * - Sets `x-rimeplan-peer` to the socket's address and `x-rimeplan-client` to the client's
 *   address (lib/client-address.ts reads them). Whatever a client sent under those names is
 *   dropped. Forwarded headers (X-Forwarded-For, X-Real-IP, X-Forwarded-Host/Proto/Port) are
 *   believed only with TRUST_PROXY=N (N proxies in front of the app, each appending to
 *   X-Forwarded-For); without it they are removed before the app sees the request.
 * - Sets `x-rimeplan-mark` to a secret made at start and known only to this process (passed to
 *   the app as RIMEPLAN_SERVER_MARK): the app believes the two address headers only beside it, so
 *   they cannot be forged when the app is served some other way (a bare `next start`).
 *
 * Usage: tsx scripts/serve.ts [--dev]
 */
import { randomBytes } from "node:crypto";
import { createServer, type IncomingMessage } from "node:http";
import next from "next";

const dev = process.argv.includes("--dev");
const port = Number(process.env.PORT ?? 3000);
const host = process.env.HOST || "127.0.0.1";
const trustProxy = Number(process.env.TRUST_PROXY ?? 0);
if (!Number.isInteger(trustProxy) || trustProxy < 0 || trustProxy > 10) {
  console.error(`TRUST_PROXY must be a whole number of proxies from 0 to 10 (got "${process.env.TRUST_PROXY}")`);
  process.exit(2);
}
if (!Number.isInteger(port) || port < 1 || port > 65535) {
  console.error(`PORT must be a whole number from 1 to 65535 (got "${process.env.PORT}")`);
  process.exit(2);
}

const FORWARDED = ["x-forwarded-for", "x-real-ip", "x-forwarded-host", "x-forwarded-proto", "x-forwarded-port", "forwarded"];

/** "::ffff:127.0.0.1" → "127.0.0.1". */
export function normaliseAddress(a: string | undefined): string {
  if (!a) return "unknown";
  return a.startsWith("::ffff:") ? a.slice(7) : a;
}

/** The client's address: the peer, or with N trusted proxies the N-th entry from the right of X-Forwarded-For. */
export function clientOf(req: IncomingMessage, proxies: number): string {
  const peer = normaliseAddress(req.socket.remoteAddress);
  if (proxies === 0) return peer;
  const raw = req.headers["x-forwarded-for"];
  const list = (Array.isArray(raw) ? raw.join(",") : raw ?? "")
    .split(",")
    .map((s) => s.trim())
    .filter(Boolean);
  const hop = list[list.length - proxies];
  return hop ? normaliseAddress(hop) : peer;
}

const mark = randomBytes(24).toString("base64url");
process.env.RIMEPLAN_SERVER_MARK = mark;

const app = next({ dev, hostname: host, port });
const handle = app.getRequestHandler();
await app.prepare();

const server = createServer((req, res) => {
  const client = clientOf(req, trustProxy);
  delete req.headers["x-rimeplan-peer"];
  delete req.headers["x-rimeplan-client"];
  delete req.headers["x-rimeplan-mark"];
  if (trustProxy === 0) for (const h of FORWARDED) delete req.headers[h];
  req.headers["x-rimeplan-peer"] = normaliseAddress(req.socket.remoteAddress);
  req.headers["x-rimeplan-client"] = client;
  req.headers["x-rimeplan-mark"] = mark;
  void handle(req, res);
});
// Slow or idle clients do not hold sockets for ever.
server.headersTimeout = 20_000;
server.requestTimeout = 120_000;
server.keepAliveTimeout = 5_000;
server.listen(port, host, () => {
  console.log(`[rimeplan] serving on http://${host.includes(":") ? `[${host}]` : host}:${port}${trustProxy ? ` (trusting ${trustProxy} proxy hop(s) for client addresses)` : ""}`);
});

function stop() {
  server.close(() => process.exit(0));
  setTimeout(() => process.exit(0), 5_000).unref();
}
process.on("SIGTERM", stop);
process.on("SIGINT", stop);
