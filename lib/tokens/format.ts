import { randomSecret, sha256Hex } from "./secret";

// `asy_` + base64url of 32 random bytes (43 characters): easy to spot in logs and secret scanners.
export const TOKEN_PREFIX = "asy_";
const TOKEN_RE = /^asy_[A-Za-z0-9_-]{43}$/;
const DISPLAY_LENGTH = 12;

export function newTokenString(): string {
  return TOKEN_PREFIX + randomSecret(32);
}

export const isWellFormedToken = (text: string): boolean => TOKEN_RE.test(text);

export const tokenHash = (token: string): string => sha256Hex(token);

/** What the settings page shows to tell tokens apart: not enough to guess the rest. */
export const displayPrefix = (token: string): string => token.slice(0, DISPLAY_LENGTH);
