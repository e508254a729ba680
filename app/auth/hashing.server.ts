import { createHash, createHmac, randomBytes, timingSafeEqual } from "node:crypto";

/** A URL-safe random secret (32 bytes = 256 bits by default), for links, tokens and session ids. */
export function randomToken(bytes = 32): string {
  return randomBytes(bytes).toString("base64url");
}

/**
 * SHA-256 hex of a high-entropy secret (invitation tokens, API tokens, session ids). A plain hash
 * is enough there because the input cannot be guessed; the database only ever sees the hash.
 */
export function sha256Hex(value: string): string {
  return createHash("sha256").update(value, "utf8").digest("hex");
}

/**
 * Keyed hash for low-entropy secrets (six-character sign-in codes): without the key, a copy of
 * the table does not let anyone brute-force the codes offline.
 */
export function hmacHex(key: string, value: string): string {
  return createHmac("sha256", key).update(value, "utf8").digest("hex");
}

/** Constant-time comparison of two hex digests. */
export function sameHex(a: string, b: string): boolean {
  const x = Buffer.from(a, "hex");
  const y = Buffer.from(b, "hex");
  return x.length === y.length && x.length > 0 && timingSafeEqual(x, y);
}
