import { existsSync, readdirSync, statSync } from "node:fs";
import path from "node:path";

const ENTRY = path.join("checks", "sandbox", "child.ts");

/**
 * The repository root, found without __dirname (a Next.js server bundle moves this file):
 * ASSAY_ROOT when set, else the nearest folder above the working directory holding the child entry.
 */
export function assayRoot(): string {
  const fromEnv = process.env.ASSAY_ROOT;
  if (fromEnv && existsSync(path.join(fromEnv, ENTRY))) return path.resolve(fromEnv);
  for (let dir = process.cwd(); ; dir = path.dirname(dir)) {
    if (existsSync(path.join(dir, ENTRY))) return dir;
    if (path.dirname(dir) === dir) break;
  }
  throw new Error(`cannot find ${ENTRY} above ${process.cwd()}; set ASSAY_ROOT to the repository root`);
}

export const childEntry = () => path.join(assayRoot(), ENTRY);

// scripts/engine-build.mjs writes the child as plain JavaScript; node starts that without tsx's second and a half.
const COMPILED = path.join(".build", "engine", "sandbox-child.js");

function newestSource(dir: string): number {
  let newest = 0;
  for (const entry of readdirSync(dir, { withFileTypes: true })) {
    const full = path.join(dir, entry.name);
    if (entry.isDirectory()) newest = Math.max(newest, newestSource(full));
    else if (entry.name.endsWith(".ts")) newest = Math.max(newest, statSync(full).mtimeMs);
  }
  return newest;
}

/** How to start the child: the compiled entry when it is newer than every engine source, else the source under tsx. */
export function childCommand(): { entry: string; execArgv: string[] } {
  const root = assayRoot();
  const compiled = path.join(root, COMPILED);
  if (existsSync(compiled) && statSync(compiled).mtimeMs >= newestSource(path.join(root, "checks"))) return { entry: compiled, execArgv: [] };
  return { entry: childEntry(), execArgv: ["--import", "tsx"] };
}
