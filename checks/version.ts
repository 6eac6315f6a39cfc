import { createHash } from "node:crypto";
import { readdirSync, readFileSync } from "node:fs";
import path from "node:path";
import { defaultModelsDir } from "./spice/paths";

// Bump whenever a change could alter a report for the same block file.
export const ENGINE_VERSION = "1.8.0";

/** sha256 over the shared model library: each .lib file's name and bytes, in sorted name order. */
export function modelLibraryHash(modelsDir?: string): string {
  const dir = modelsDir ?? defaultModelsDir();
  const h = createHash("sha256");
  let names: string[] = [];
  try {
    names = readdirSync(dir).filter((n) => n.endsWith(".lib")).sort();
  } catch {
    // no model library: hash of nothing, so a missing folder still gives a stable value
  }
  for (const n of names) {
    h.update(`${n}\0`);
    h.update(readFileSync(path.join(dir, n)));
    h.update("\0");
  }
  return h.digest("hex");
}
