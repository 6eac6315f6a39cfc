import { randomBytes } from "node:crypto";
import { mkdirSync, readFileSync, writeFileSync } from "node:fs";
import path from "node:path";

// The master key: MEILI_MASTER_KEY when set, else the one kept in
// <varDir>/search-key, made once at random (readable by the owner only).
export function ensureMasterKey(varDir: string): string {
  const fromEnv = process.env.MEILI_MASTER_KEY;
  if (fromEnv) return fromEnv;
  const file = path.join(varDir, "search-key");
  try {
    const saved = readFileSync(file, "utf8").trim();
    if (saved) return saved;
  } catch (e) {
    if ((e as NodeJS.ErrnoException).code !== "ENOENT") throw e;
  }
  mkdirSync(varDir, { recursive: true });
  const key = randomBytes(24).toString("base64url");
  writeFileSync(file, `${key}\n`, { mode: 0o600 });
  return key;
}
