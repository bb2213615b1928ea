import { isDirectLoopback, isLoopbackAddress } from "./client-address";

/** What decides whether the caught-mail page (/dev/mail) is shown; see `devMailShown`. */
export interface DevMailSettings {
  /** RIMEPLAN_DEV_MAIL */
  flag: "0" | "1";
  /** MAIL_CATCHER_DIR */
  catcherDir: string | undefined;
  /** APP_URL: the address people use; anything but this machine is a deployment. */
  appUrl: string;
  /** TRUST_PROXY: a proxy in front also means a deployment. */
  trustProxy: number;
}

/** "localhost", "127.0.0.1", "[::1]", "::1", "x.localhost" name this machine. */
export function isLoopbackHost(hostname: string): boolean {
  const h = hostname.toLowerCase().replace(/^\[|\]$/g, "").replace(/\.$/, "");
  return h === "localhost" || h.endsWith(".localhost") || isLoopbackAddress(h);
}

function hostOf(hostHeader: string | null): string | null {
  if (!hostHeader) return null;
  try {
    return new URL(`http://${hostHeader}`).hostname;
  } catch {
    return null;
  }
}

/**
 * The caught-mail page lists every reset, sign-in and invitation link, so it is shown only when
 * all of these hold, else the page is a plain 404:
 * - the flag RIMEPLAN_DEV_MAIL=1 is set and there is a catcher folder;
 * - the app is not deployed: APP_URL names this machine and no proxy is configured (TRUST_PROXY=0);
 * - the request came straight from this machine: a loopback socket, as recorded by scripts/serve.ts,
 *   with no forwarded header;
 * - the Host header names this machine too, so a page on another site whose name a rebinding DNS
 *   points at 127.0.0.1 cannot read it from the developer's own browser.
 */
export function devMailShown(s: DevMailSettings, headers: Headers): boolean {
  if (s.flag !== "1" || !s.catcherDir) return false;
  if (s.trustProxy !== 0) return false;
  let app: URL;
  try {
    app = new URL(s.appUrl);
  } catch {
    return false;
  }
  if (!isLoopbackHost(app.hostname)) return false;
  if (!isDirectLoopback(headers)) return false;
  const host = hostOf(headers.get("host"));
  return host !== null && isLoopbackHost(host);
}
