import { hkdfSync } from "node:crypto";
import { jwtDecrypt, type JWTPayload } from "jose";

/**
 * Reads next-auth's session token (an encrypted JWT, `dir` + A256CBC-HS512, the key derived
 * from AUTH_SECRET by HKDF with the cookie's name as salt) the way next-auth's own `decode`
 * does — same derivation, same algorithms, expiry checked with the same 15 s tolerance — but
 * derives each key once per process instead of on every request. The derived key is a pure
 * function of the secret, so every instance with the same AUTH_SECRET reads every token.
 *
 * The profile of a model read showed next-auth's `auth()` spending its time deriving the key
 * (HKDF and a SHA-512 thumbprint through WebCrypto) and then encrypting a refreshed token a
 * route handler never sends; see docs/operations.md.
 */
const LENGTHS: Record<string, number> = { "A256CBC-HS512": 64, A256GCM: 32 };
const keys = new Map<string, Uint8Array>();

function derivedKey(secret: string, salt: string, enc: string): Uint8Array {
  const length = LENGTHS[enc];
  if (!length) throw new Error(`unsupported token encryption ${enc}`);
  const id = `${enc}\u0000${salt}\u0000${secret}`;
  let key = keys.get(id);
  if (!key) {
    key = new Uint8Array(hkdfSync("sha256", secret, salt, `Auth.js Generated Encryption Key (${salt})`, length));
    keys.set(id, key);
  }
  return key;
}

/** The token's payload, or null when it cannot be decrypted with this secret or has expired. */
export async function decodeSessionToken(token: string, secret: string, salt: string): Promise<JWTPayload | null> {
  try {
    const { payload } = await jwtDecrypt(token, (header) => derivedKey(secret, salt, header.enc), {
      clockTolerance: 15,
      keyManagementAlgorithms: ["dir"],
      contentEncryptionAlgorithms: ["A256CBC-HS512", "A256GCM"],
    });
    return payload;
  } catch {
    return null;
  }
}
