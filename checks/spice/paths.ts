import fs from "node:fs";
import path from "node:path";

// Found by walking up from the working directory, so bundlers (Next) that move __dirname don't matter.
let root: string | undefined;
export function repoRoot(): string {
  if (root) return root;
  let dir = process.cwd();
  for (;;) {
    try {
      const pkg = JSON.parse(fs.readFileSync(path.join(dir, "package.json"), "utf8"));
      if (pkg.name === "assay") return (root = dir);
    } catch {
      // no package.json here: keep walking up
    }
    const up = path.dirname(dir);
    if (up === dir) return (root = process.cwd());
    dir = up;
  }
}

export function defaultModelsDir(): string {
  return path.resolve(process.env.ASSAY_MODELS_DIR || path.join(repoRoot(), "content/models"));
}

export function defaultCacheDir(): string {
  return path.resolve(process.env.ASSAY_SIM_CACHE || path.join(repoRoot(), "var/sim-cache"));
}
