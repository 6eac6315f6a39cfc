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
/**
 * Beside it, startup snapshots of the loaded child (mathjs built and its functions created, by scripts/engine-build.mjs):
 * a child starts from one in about a third of the time. A snapshot is read only by the node version that wrote it and
 * with the same V8 flags, so there is one per heap limit the lanes use (SNAPSHOT_HEAP_MB there); a child with another
 * limit starts from the bundle.
 */
export const snapshotFile = (root: string, memoryMb: number, version = process.version) =>
  path.join(root, ".build", "engine", `sandbox-child-${version}-${memoryMb}mb.blob`);

function newestSource(dir: string): number {
  let newest = 0;
  for (const entry of readdirSync(dir, { withFileTypes: true })) {
    const full = path.join(dir, entry.name);
    if (entry.isDirectory()) newest = Math.max(newest, newestSource(full));
    else if (entry.name.endsWith(".ts")) newest = Math.max(newest, statSync(full).mtimeMs);
  }
  return newest;
}

/**
 * How to start a child with this heap limit: the compiled entry when it is newer than every engine source (from its
 * snapshot when that is as new), else the source under tsx.
 */
export function childCommand(memoryMb: number): { entry: string; execArgv: string[] } {
  const root = assayRoot();
  const compiled = path.join(root, COMPILED);
  const heap = `--max-old-space-size=${memoryMb}`;
  if (!existsSync(compiled) || statSync(compiled).mtimeMs < newestSource(path.join(root, "checks"))) return { entry: childEntry(), execArgv: ["--import", "tsx", heap] };
  const snapshot = snapshotFile(root, memoryMb);
  if (existsSync(snapshot) && statSync(snapshot).mtimeMs >= statSync(compiled).mtimeMs) return { entry: compiled, execArgv: ["--snapshot-blob", snapshot, heap] };
  return { entry: compiled, execArgv: [heap] };
}
