// The engine's command-line and sandbox entries as plain JavaScript, so `node` starts them directly (tsx costs
// about 1.5 s a start), with the packages they use bundled in (mathjs loads in a fifth of the time from one file
// as from its thousand), and a startup snapshot of the sandbox child with mathjs already built. Built by npm start,
// npm test and npm run verify when a source under checks/ is newer.
// Usage: node scripts/engine-build.mjs [--run-cli ARGS...]
import { spawnSync } from "node:child_process";
import { existsSync, readdirSync, renameSync, rmSync, statSync } from "node:fs";
import path from "node:path";
import { fileURLToPath, pathToFileURL } from "node:url";

const ROOT = path.resolve(path.dirname(fileURLToPath(import.meta.url)), "..");
export const OUT_DIR = path.join(ROOT, ".build", "engine");
const ENTRIES = { cli: "checks/cli.ts", "sandbox-child": "checks/sandbox/child.ts" };
// The sandbox lanes' heap limits (checks/sandbox/client.ts, checks/cli.ts). A snapshot is read only by the node
// version that wrote it and with the same V8 flags, so one per limit, named as checks/sandbox/root.ts looks for it.
const SNAPSHOT_HEAP_MB = [256, 768];
const snapshotFile = (mb) => path.join(OUT_DIR, `sandbox-child-${process.version}-${mb}mb.blob`);

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
  const outs = [...Object.keys(ENTRIES).map((name) => path.join(OUT_DIR, `${name}.js`)), ...SNAPSHOT_HEAP_MB.map(snapshotFile)];
  if (!outs.every(existsSync)) return false;
  const built = Math.min(...outs.map((f) => statSync(f).mtimeMs));
  return built >= newestSource();
}

/** Builds when stale. */
export async function ensureEngineBuilt() {
  if (isFresh()) return false;
  const { build } = await import("esbuild");
  const common = { absWorkingDir: ROOT, outdir: OUT_DIR, bundle: true, platform: "node", format: "cjs", target: "node20", sourcemap: "linked", logLevel: "warning" };
  const entry = (name) => ({ [name]: path.join(ROOT, ENTRIES[name]) });
  // The CLI loads no mathjs (the child evaluates); its glob package stays in node_modules, as its ESM build asks to.
  await build({ ...common, entryPoints: entry("cli"), packages: "external" });
  await build({ ...common, entryPoints: entry("sandbox-child") });
  // The child runs its warm-up (checks/sandbox/warm-up.ts) and is written out as a heap snapshot. Without one
  // (a node that cannot write it) the child still starts, from the bundle, only slower.
  for (const f of readdirSync(OUT_DIR)) if (/\.blob(\.\d+\.tmp)?$/.test(f)) rmSync(path.join(OUT_DIR, f));
  for (const mb of SNAPSHOT_HEAP_MB) {
    // Written under another name and renamed, so a child starting meanwhile never reads half a snapshot.
    const tmp = `${snapshotFile(mb)}.${process.pid}.tmp`;
    const args = [`--max-old-space-size=${mb}`, "--snapshot-blob", tmp, "--build-snapshot", path.join(OUT_DIR, "sandbox-child.js")];
    const snap = spawnSync(process.execPath, args, { cwd: OUT_DIR, encoding: "utf8", env: { PATH: process.env.PATH } });
    if (snap.status === 0) renameSync(tmp, snapshotFile(mb));
    else process.stderr.write(`engine-build: no startup snapshot for the sandbox child (${snap.stderr.trim().split("\n").slice(-2).join(" ")}); it starts from the bundle\n`);
  }
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
