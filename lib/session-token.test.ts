import { describe, expect, it } from "vitest";
import { encode } from "next-auth/jwt";
import { decodeSessionToken } from "./session-token";

// Tokens are made by next-auth's own encode(), exactly as it writes the session cookie, so a
// change in next-auth's format shows up here rather than as everyone being signed out.
const SECRET = "unit-test-secret-0123456789abcdef";
const NAME = "authjs.session-token";

describe("decodeSessionToken", () => {
  it("reads a token next-auth wrote, for both cookie names, and again from the cached key", async () => {
    for (const salt of [NAME, "__Secure-authjs.session-token"]) {
      const token = await encode({ token: { sid: "3f0c1c1e-8d7a-4d55-9a51-1c1f2b0f5a10", email: "a@b.example" }, secret: SECRET, salt, maxAge: 3600 });
      for (let i = 0; i < 2; i++) {
        const p = await decodeSessionToken(token, SECRET, salt);
        expect(p?.sid).toBe("3f0c1c1e-8d7a-4d55-9a51-1c1f2b0f5a10");
        expect(p?.email).toBe("a@b.example");
      }
    }
  });

  it("refuses a token under another secret or another cookie name (the salt)", async () => {
    const token = await encode({ token: { sid: "x" }, secret: SECRET, salt: NAME, maxAge: 3600 });
    expect(await decodeSessionToken(token, "another-secret-0123456789abcdef", NAME)).toBeNull();
    expect(await decodeSessionToken(token, SECRET, "__Secure-authjs.session-token")).toBeNull();
  });

  it("refuses an expired token (beyond next-auth's 15 s tolerance) and a tampered one", async () => {
    const expired = await encode({ token: { sid: "x" }, secret: SECRET, salt: NAME, maxAge: -60 });
    expect(await decodeSessionToken(expired, SECRET, NAME)).toBeNull();
    const good = await encode({ token: { sid: "x" }, secret: SECRET, salt: NAME, maxAge: 3600 });
    const parts = good.split(".");
    const ct = parts[3];
    parts[3] = (ct[0] === "A" ? "B" : "A") + ct.slice(1);
    expect(await decodeSessionToken(parts.join("."), SECRET, NAME)).toBeNull();
    expect(await decodeSessionToken("not-a-token", SECRET, NAME)).toBeNull();
  });
});
