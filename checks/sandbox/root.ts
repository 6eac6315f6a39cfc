import { existsSync } from "node:fs";
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
