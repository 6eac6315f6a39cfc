// The engine's command-line and sandbox entries as plain JavaScript, so `node` starts them directly (tsx costs
// about 1.5 s a start). Built by npm start, npm test and npm run verify when a source under checks/ is newer.
// Usage: node scripts/engine-build.mjs [--run-cli ARGS...]
import { existsSync, readdirSync, statSync } from "node:fs";
import path from "node:path";
import { fileURLToPath, pathToFileURL } from "node:url";

const ROOT = path.resolve(path.dirname(fileURLToPath(import.meta.url)), "..");
export const OUT_DIR = path.join(ROOT, ".build", "engine");
const ENTRIES = { cli: "checks/cli.ts", "sandbox-child": "checks/sandbox/child.ts" };

function newestSource(dir = path.join(ROOT, "checks")) {
  let newest = statSync(path.join(ROOT, "package-lock.json")).mtimeMs;
  for (const entry of readdirSync(dir, { withFileTypes: true })) {
    const full = path.join(dir, entry.name);
    if (entry.isDirectory()) newest = Math.max(newest, newestSource(full));
    else if (entry.name.endsWith(".ts")) newest = Math.max(newest, statSync(full).mtimeMs);
  }
  return newest;
}

function isFresh() {
  const outs = Object.keys(ENTRIES).map((name) => path.join(OUT_DIR, `${name}.js`));
  if (!outs.every(existsSync)) return false;
  const built = Math.min(...outs.map((f) => statSync(f).mtimeMs));
  return built >= newestSource();
}

/** Builds when stale; packages stay in node_modules (external), only our own TypeScript is bundled. */
export async function ensureEngineBuilt() {
  if (isFresh()) return false;
  const { build } = await import("esbuild");
  await build({
    absWorkingDir: ROOT,
    entryPoints: Object.fromEntries(Object.entries(ENTRIES).map(([name, file]) => [name, path.join(ROOT, file)])),
    outdir: OUT_DIR,
    bundle: true,
    packages: "external",
    platform: "node",
    format: "cjs",
    target: "node20",
    sourcemap: "linked",
    logLevel: "warning",
  });
  return true;
}

const [, , mode, ...rest] = process.argv;
if (import.meta.url === pathToFileURL(process.argv[1] ?? "").href) {
  await ensureEngineBuilt();
  if (mode === "--run-cli") {
    process.argv = [process.argv[0], path.join(OUT_DIR, "cli.js"), ...rest];
    await import(pathToFileURL(path.join(OUT_DIR, "cli.js")).href);
  }
}
