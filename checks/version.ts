import { createHash } from "node:crypto";
import { readdirSync, readFileSync } from "node:fs";
import path from "node:path";
import { defaultModelsDir } from "./spice/paths";

// Bump whenever a change could alter a report for the same block file.
// 1.8.1: a circuit setting .options interp or cshunt no longer shares an ngspice process, so a run simulated in a
// worker's group beside one could have been changed by it: badges made before are stale and verified again.
export const ENGINE_VERSION = "1.8.1";

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
