import { env } from "./env";

/**
 * Who is on the other end of a request, as the app's own server (scripts/serve.ts) recorded it.
 * Those headers are set by that server on every request and anything a client sent under the
 * same names is dropped there; they are believed only beside that server's secret mark, so a
 * client cannot forge them when the app runs without it (a bare `next start` or `next dev`): the
 * address is then "unknown" and nothing is treated as loopback. Forwarded headers are only used
 * by that server when TRUST_PROXY says a proxy is in front.
 */
function fromServer(headers: Headers): boolean {
  return !!env.RIMEPLAN_SERVER_MARK && headers.get("x-rimeplan-mark") === env.RIMEPLAN_SERVER_MARK;
}

export function clientAddress(headers: Headers): string {
  return (fromServer(headers) && headers.get("x-rimeplan-client")) || "unknown";
}

/** The socket's own address (the proxy's, when there is one). */
export function peerAddress(headers: Headers): string {
  return (fromServer(headers) && headers.get("x-rimeplan-peer")) || "unknown";
}

export function isLoopbackAddress(a: string): boolean {
  return a === "::1" || /^127\.\d{1,3}\.\d{1,3}\.\d{1,3}$/.test(a);
}

/**
 * True when the request came straight from this machine: a loopback peer and no proxy in between.
 * Next itself fills X-Forwarded-For with the socket's address when the request has none (and
 * scripts/serve.ts removes a client's own unless TRUST_PROXY), so a lone entry naming that same
 * peer is not a proxy hop; any other entry is.
 */
export function isDirectLoopback(headers: Headers): boolean {
  const peer = peerAddress(headers);
  if (!isLoopbackAddress(peer) || !isLoopbackAddress(clientAddress(headers))) return false;
  const fwd = headers.get("x-forwarded-for");
  if (!fwd) return true;
  const hops = fwd.split(",").map((h) => h.trim().replace(/^::ffff:/, ""));
  return hops.length === 1 && hops[0] === peer;
}
