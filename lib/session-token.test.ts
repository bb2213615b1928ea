import { describe, expect, it } from "vitest";
import { createCipheriv, createHmac, hkdfSync, randomBytes } from "node:crypto";
import { encode } from "next-auth/jwt";
import { EncryptJWT } from "jose";
import { decodeSessionToken } from "./session-token";

// Tokens are made by next-auth's own encode(), exactly as it writes the session cookie, so a
// change in next-auth's format shows up here rather than as everyone being signed out.
const SECRET = "unit-test-secret-0123456789abcdef";
const NAME = "authjs.session-token";
const SID = "3f0c1c1e-8d7a-4d55-9a51-1c1f2b0f5a10";

const flip = (s: string) => (s[0] === "A" ? "B" : "A") + s.slice(1);

describe("decodeSessionToken", () => {
  it("reads a token next-auth wrote, for both cookie names, and again from the cached key", async () => {
    for (const salt of [NAME, "__Secure-authjs.session-token"]) {
      const token = await encode({ token: { sid: SID, email: "a@b.example" }, secret: SECRET, salt, maxAge: 3600 });
      for (let i = 0; i < 2; i++) {
        const p = decodeSessionToken(token, SECRET, salt);
        expect(p?.sid).toBe(SID);
        expect(p?.email).toBe("a@b.example");
      }
    }
  });

  it("reads the older A256GCM form next-auth's decode also accepts", async () => {
    const key = new Uint8Array(hkdfSync("sha256", SECRET, NAME, `Auth.js Generated Encryption Key (${NAME})`, 32));
    const token = await new EncryptJWT({ sid: SID }).setProtectedHeader({ alg: "dir", enc: "A256GCM" }).setExpirationTime("1h").encrypt(key);
    expect(decodeSessionToken(token, SECRET, NAME)?.sid).toBe(SID);
    const parts = token.split(".");
    parts[4] = flip(parts[4]);
    expect(decodeSessionToken(parts.join("."), SECRET, NAME)).toBeNull();
  });

  it("refuses a token under another secret or another cookie name (the salt)", async () => {
    const token = await encode({ token: { sid: SID }, secret: SECRET, salt: NAME, maxAge: 3600 });
    expect(decodeSessionToken(token, "another-secret-0123456789abcdef", NAME)).toBeNull();
    expect(decodeSessionToken(token, SECRET, "__Secure-authjs.session-token")).toBeNull();
  });

  it("refuses an expired token beyond next-auth's 15 s tolerance, and keeps one within it", async () => {
    const token = await encode({ token: { sid: SID }, secret: SECRET, salt: NAME, maxAge: 60 });
    const now = Date.now() / 1000;
    expect(decodeSessionToken(token, SECRET, NAME, now + 70)?.sid).toBe(SID);
    expect(decodeSessionToken(token, SECRET, NAME, now + 80)).toBeNull();
  });

  it("refuses a token whose ciphertext, tag, IV or header was changed, and anything that is not a token", async () => {
    const good = await encode({ token: { sid: SID }, secret: SECRET, salt: NAME, maxAge: 3600 });
    for (const i of [0, 2, 3, 4]) {
      const parts = good.split(".");
      parts[i] = i === 0 ? Buffer.from(JSON.stringify({ ...JSON.parse(Buffer.from(parts[0], "base64url").toString()), kid: "x" })).toString("base64url") : flip(parts[i]);
      expect(decodeSessionToken(parts.join("."), SECRET, NAME), `part ${i}`).toBeNull();
    }
    for (const bad of ["", "not-a-token", "a.b.c.d.e", good + ".x", good.split(".").slice(0, 4).join(".")]) expect(decodeSessionToken(bad, SECRET, NAME)).toBeNull();
  });

  it("refuses other algorithms, compressed tokens, critical headers and claims of the wrong type", () => {
    const key = Buffer.from(hkdfSync("sha256", SECRET, NAME, `Auth.js Generated Encryption Key (${NAME})`, 64));
    // Seals by RFC 7518 §5.2.2 with a header of our choosing (jose refuses to write some of these).
    const seal = (header: object, payload: object) => {
      const h = Buffer.from(JSON.stringify(header)).toString("base64url");
      const iv = randomBytes(16);
      const c = createCipheriv("aes-256-cbc", key.subarray(32), iv);
      const ct = Buffer.concat([c.update(JSON.stringify(payload)), c.final()]);
      const al = Buffer.alloc(8);
      al.writeBigUInt64BE(BigInt(h.length * 8));
      const tag = createHmac("sha512", key.subarray(0, 32)).update(h).update(iv).update(ct).update(al).digest().subarray(0, 32);
      return [h, "", iv.toString("base64url"), ct.toString("base64url"), tag.toString("base64url")].join(".");
    };
    const plain = { alg: "dir", enc: "A256CBC-HS512" };
    const exp = Math.floor(Date.now() / 1000) + 3600;
    expect(decodeSessionToken(seal(plain, { sid: SID, exp }), SECRET, NAME)?.sid).toBe(SID);
    expect(decodeSessionToken(seal({ ...plain, zip: "DEF" }, { sid: SID, exp }), SECRET, NAME)).toBeNull();
    expect(decodeSessionToken(seal({ ...plain, crit: ["x"], x: 1 }, { sid: SID, exp }), SECRET, NAME)).toBeNull();
    expect(decodeSessionToken(seal({ ...plain, alg: "A256KW" }, { sid: SID, exp }), SECRET, NAME)).toBeNull();
    expect(decodeSessionToken(seal(plain, { sid: SID, exp: String(exp) }), SECRET, NAME)).toBeNull();
    expect(decodeSessionToken(seal(plain, { sid: SID, exp, nbf: exp }), SECRET, NAME)).toBeNull();
    expect(decodeSessionToken(seal(plain, [SID]), SECRET, NAME)).toBeNull();
  });
});
