import { createDecipheriv, createHmac, hkdfSync, timingSafeEqual } from "node:crypto";

/**
 * Reads next-auth's session token: a JWE in compact form, `alg: "dir"` with
 * `enc: "A256CBC-HS512"` (or the older "A256GCM"), the key derived from AUTH_SECRET by HKDF-SHA256
 * with the cookie's name as salt — the format next-auth's `encode` writes and its `decode`
 * reads (@auth/core jwt.ts), checked the same way: only those algorithms, no compression or
 * critical headers, and `exp`/`nbf` with a 15 s tolerance.
 *
 * Why not next-auth's `auth()` or `decode`: a model read spent much of its time there (the
 * profile is in docs/operations.md): `auth()` derives the key again on every request (HKDF plus
 * a SHA-512 thumbprint), runs the callbacks and encrypts a refreshed token a route handler
 * never sends, and jose's decryption goes through WebCrypto's asynchronous jobs (two key
 * imports, an HMAC and a decryption, each a hop to the thread pool). Here each key is derived
 * once per process and the decryption is node:crypto's synchronous one. The key depends only
 * on the secret, so every instance with the same AUTH_SECRET reads every token.
 *
 * Formats: RFC 7516 (JWE compact serialisation) and RFC 7518 §5.2 (AES_CBC_HMAC_SHA2: MAC key
 * the first half, encryption key the second, tag = first 32 bytes of HMAC-SHA-512 over
 * AAD ‖ IV ‖ ciphertext ‖ AAD length in bits as a 64-bit big-endian number) and §5.3 (AES-GCM).
 */
const KEY_BYTES: Record<string, number> = { "A256CBC-HS512": 64, A256GCM: 32 };
const CLOCK_TOLERANCE_S = 15;
const keys = new Map<string, Buffer>();

function derivedKey(secret: string, salt: string, enc: string): Buffer {
  const id = `${enc}\u0000${salt}\u0000${secret}`;
  let key = keys.get(id);
  if (!key) {
    key = Buffer.from(hkdfSync("sha256", secret, salt, `Auth.js Generated Encryption Key (${salt})`, KEY_BYTES[enc]));
    keys.set(id, key);
  }
  return key;
}

function decrypt(enc: string, key: Buffer, aad: Buffer, iv: Buffer, ciphertext: Buffer, tag: Buffer): Buffer {
  if (enc === "A256CBC-HS512") {
    if (iv.length !== 16 || tag.length !== 32) throw new Error("bad iv or tag length");
    const al = Buffer.alloc(8);
    al.writeBigUInt64BE(BigInt(aad.length * 8));
    const mac = createHmac("sha512", key.subarray(0, 32)).update(aad).update(iv).update(ciphertext).update(al).digest().subarray(0, 32);
    if (!timingSafeEqual(mac, tag)) throw new Error("tag mismatch");
    const d = createDecipheriv("aes-256-cbc", key.subarray(32), iv);
    return Buffer.concat([d.update(ciphertext), d.final()]);
  }
  if (iv.length !== 12 || tag.length !== 16) throw new Error("bad iv or tag length");
  const d = createDecipheriv("aes-256-gcm", key, iv, { authTagLength: 16 });
  d.setAAD(aad);
  d.setAuthTag(tag);
  return Buffer.concat([d.update(ciphertext), d.final()]);
}

/** The token's payload, or null when it is malformed, cannot be decrypted with this secret, or has expired. */
export function decodeSessionToken(token: string, secret: string, salt: string, nowS = Date.now() / 1000): Record<string, unknown> | null {
  try {
    const parts = token.split(".");
    if (parts.length !== 5 || parts[1] !== "") return null;
    const [h, , iv, ct, tag] = parts;
    const header = JSON.parse(Buffer.from(h, "base64url").toString("utf8")) as Record<string, unknown>;
    if (header.alg !== "dir" || typeof header.enc !== "string" || !(header.enc in KEY_BYTES)) return null;
    if ("zip" in header || "crit" in header) return null;
    const plain = decrypt(header.enc, derivedKey(secret, salt, header.enc), Buffer.from(h, "ascii"), Buffer.from(iv, "base64url"), Buffer.from(ct, "base64url"), Buffer.from(tag, "base64url"));
    const payload = JSON.parse(plain.toString("utf8")) as unknown;
    if (typeof payload !== "object" || payload === null || Array.isArray(payload)) return null;
    const p = payload as Record<string, unknown>;
    for (const claim of ["exp", "nbf", "iat"]) if (claim in p && typeof p[claim] !== "number") return null;
    if (typeof p.exp === "number" && p.exp <= nowS - CLOCK_TOLERANCE_S) return null;
    if (typeof p.nbf === "number" && p.nbf > nowS + CLOCK_TOLERANCE_S) return null;
    return p;
  } catch {
    return null;
  }
}
