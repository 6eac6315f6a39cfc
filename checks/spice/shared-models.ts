import fs from "node:fs";
import path from "node:path";
import { defaultModelsDir } from "./paths";
import { MODEL_FILE } from "./sanitize";

/** The shared model library's file names (content/models, versioned with the code), sorted. */
export function sharedModelNames(modelsDir = defaultModelsDir()): string[] {
  try {
    return fs.readdirSync(modelsDir).filter((n) => MODEL_FILE.test(n)).sort();
  } catch {
    return [];
  }
}

/** One shared model file's text, or null when the shared library has no file of that name. */
export function sharedModelFile(name: string, modelsDir = defaultModelsDir()): string | null {
  if (!MODEL_FILE.test(name)) return null;
  try {
    return fs.readFileSync(path.join(modelsDir, name), "utf8");
  } catch {
    return null;
  }
}
