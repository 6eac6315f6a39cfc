import { createHash, randomBytes, timingSafeEqual } from "node:crypto";

// Secrets handed to people (API tokens, sign-in links, invitations): 32 random bytes, only the sha256 is stored.
export const randomSecret = (bytes = 32): string => randomBytes(bytes).toString("base64url");

export const sha256Hex = (text: string): string => createHash("sha256").update(text, "utf8").digest("hex");

/** Constant-time comparison of two hex digests of equal length. */
export function sameDigest(a: string, b: string): boolean {
  const x = Buffer.from(a, "hex");
  const y = Buffer.from(b, "hex");
  return x.length === y.length && timingSafeEqual(x, y);
}
