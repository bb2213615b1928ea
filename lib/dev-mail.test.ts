import { describe, expect, it, vi } from "vitest";

// the secret scripts/serve.ts makes at start; set before lib/env.ts reads the environment
const MARK = vi.hoisted(() => (process.env.RIMEPLAN_SERVER_MARK = "mark-of-this-test-server"));

import { devMailShown, isLoopbackHost, type DevMailSettings } from "./dev-mail";

const ON: DevMailSettings = { flag: "1", catcherDir: "/tmp/mail", appUrl: "http://localhost:3000", trustProxy: 0 };
/** Headers as scripts/serve.ts sets them for a request from `peer` (and `client`). */
function req(peer: string, extra: Record<string, string> = {}, client = peer) {
  return new Headers({ host: "localhost:3000", "x-rimeplan-mark": MARK, "x-rimeplan-peer": peer, "x-rimeplan-client": client, ...extra });
}

describe("caught-mail page gate", () => {
  it("shows the page to a direct loopback request when the flag is set on a local app", () => {
    expect(devMailShown(ON, req("127.0.0.1"))).toBe(true);
    expect(devMailShown(ON, req("::1", { host: "[::1]:3000" }))).toBe(true);
    expect(devMailShown({ ...ON, appUrl: "http://127.0.0.1:3000" }, req("127.0.0.1", { host: "127.0.0.1:3000" }))).toBe(true);
  });

  it("is off without the flag or without a catcher folder", () => {
    expect(devMailShown({ ...ON, flag: "0" }, req("127.0.0.1"))).toBe(false);
    expect(devMailShown({ ...ON, catcherDir: undefined }, req("127.0.0.1"))).toBe(false);
  });

  it("is off for a client that is not this machine", () => {
    expect(devMailShown(ON, req("192.0.2.2"))).toBe(false);
    expect(devMailShown(ON, req("fd00::2"))).toBe(false);
  });

  it("is off when a request was forwarded, whatever address it claims", () => {
    // Next's own record of the socket is not a hop
    expect(devMailShown(ON, req("127.0.0.1", { "x-forwarded-for": "127.0.0.1" }))).toBe(true);
    expect(devMailShown(ON, req("127.0.0.1", { "x-forwarded-for": "::ffff:127.0.0.1" }))).toBe(true);
    expect(devMailShown(ON, req("127.0.0.1", { "x-forwarded-for": "127.0.0.2" }))).toBe(false);
    expect(devMailShown(ON, req("127.0.0.1", { "x-forwarded-for": "203.0.113.9, 127.0.0.1" }))).toBe(false);
    expect(devMailShown(ON, req("127.0.0.1", { "x-forwarded-for": "127.0.0.1, 127.0.0.1" }))).toBe(false);
    // a proxy on this machine passing on a stranger's request
    expect(devMailShown(ON, req("127.0.0.1", {}, "198.51.100.7"))).toBe(false);
  });

  it("is off without the server's own record of the socket (a bare next start), even if a client forges it", () => {
    expect(devMailShown(ON, new Headers({ host: "localhost:3000" }))).toBe(false);
    expect(devMailShown(ON, req("127.0.0.1", { "x-rimeplan-mark": "" }))).toBe(false);
    expect(devMailShown(ON, req("127.0.0.1", { "x-rimeplan-mark": "guessed-mark-of-the-server" }))).toBe(false);
  });

  it("is never on for a deployment: APP_URL elsewhere, or a proxy configured", () => {
    expect(devMailShown({ ...ON, appUrl: "https://rimeplan.example.com" }, req("127.0.0.1"))).toBe(false);
    expect(devMailShown({ ...ON, appUrl: "http://192.0.2.2:3000" }, req("127.0.0.1"))).toBe(false);
    expect(devMailShown({ ...ON, appUrl: "not a url" }, req("127.0.0.1"))).toBe(false);
    expect(devMailShown({ ...ON, trustProxy: 1 }, req("127.0.0.1"))).toBe(false);
  });

  it("is off when the Host header names another site (a rebinding DNS pointing at 127.0.0.1)", () => {
    expect(devMailShown(ON, req("127.0.0.1", { host: "evil.example:3000" }))).toBe(false);
    expect(devMailShown(ON, new Headers({ "x-rimeplan-mark": MARK, "x-rimeplan-peer": "127.0.0.1", "x-rimeplan-client": "127.0.0.1" }))).toBe(false);
  });

  it("knows which host names are this machine", () => {
    for (const h of ["localhost", "LOCALHOST", "app.localhost", "127.0.0.1", "127.1.2.3", "[::1]", "::1", "localhost."]) expect(isLoopbackHost(h), h).toBe(true);
    for (const h of ["localhost.example.com", "127.0.0.1.nip.io", "0.0.0.0", "192.0.2.2", "[fd00::2]", ""]) expect(isLoopbackHost(h), h).toBe(false);
  });
});
