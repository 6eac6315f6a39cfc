// The path a CI job takes: `npm run -s verify -- FILE… --json` as a command, timed from outside, with the cost
// of `npm run -s` itself measured in the same run and subtracted. Called by bench/engine/run.ts.
import { spawnSync } from "node:child_process";
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { spiceDeck } from "@/checks";
import { OSC_ANALYSIS, expressionBlock, oscillatorBlock } from "./blocks";

const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)];
const s = (ms: number) => `${(ms / 1000).toFixed(2)} s`;

function timedCommand(args: string[], env: Record<string, string> = {}): { ms: number; stdout: string; status: number | null } {
  const t0 = performance.now();
  const r = spawnSync("npm", args, { encoding: "utf8", env: { ...process.env, ...env }, maxBuffer: 64 * 2 ** 20 });
  return { ms: performance.now() - t0, stdout: r.stdout, status: r.status };
}

/** The simulation cache would answer a second run without ngspice: each timed run gets an empty one. */
const freshCache = (tmp: string) => ({ ASSAY_SIM_CACHE: fs.mkdtempSync(path.join(tmp, "cache-")) });

export async function benchCli(tmp: string, runs: number, bareNgspice: (deck: string) => number): Promise<void> {
  spawnSync("node", ["scripts/engine-build.mjs"], { stdio: "inherit" }); // a build is not what a CI run pays
  const npmCost = median(Array.from({ length: runs }, () => timedCommand(["run", "-s", "env"]).ms));
  console.log(`\nnpm run -s verify (compiled CLI), medians of ${runs}; npm run -s itself costs ${s(npmCost)} here and is subtracted`);

  const exprFile = path.join(tmp, "expressions.md");
  fs.writeFileSync(exprFile, expressionBlock);
  const expr = median(Array.from({ length: runs }, () => timedCommand(["run", "-s", "verify", "--", exprFile, "--json"]).ms)) - npmCost;
  console.log(`  expression-only block: ${s(expr)}   (target <= 0.40 s)`);

  const oscFile = path.join(tmp, "oscillator.md");
  fs.writeFileSync(oscFile, oscillatorBlock);
  const deck = spiceDeck(oscillatorBlock).replace(/\.end\n$/, `${OSC_ANALYSIS}\n.end\n`);
  const bare = median(Array.from({ length: runs }, () => bareNgspice(deck)));
  const sim = median(Array.from({ length: runs }, () => timedCommand(["run", "-s", "verify", "--", oscFile, "--json"], freshCache(tmp)).ms)) - npmCost;
  console.log(`  simulated block (60 ms transient): ${s(sim)}; bare ngspice ${s(bare)}; overhead ${s(sim - bare)}   (target <= 0.40 s)`);

  // The 16 demo blocks in one call, every simulation they need run afresh, against the ngspice time of those same
  // simulations (each report's `simulations[].ms`, the ngspice process wall time the runner measured) over the cores.
  const all = timedCommand(["run", "-s", "verify", "--", "content/blocks/*.md", "--json"], freshCache(tmp));
  const reports = all.stdout.trim().split("\n").map((l) => JSON.parse(l) as { status: string; simulations: { ms: number; cached?: boolean }[] });
  const ngspiceMs = reports.flatMap((r) => r.simulations).reduce((sum, x) => sum + x.ms, 0);
  const cores = os.availableParallelism();
  const wall = all.ms - npmCost;
  const target = (1.3 * ngspiceMs) / cores;
  const verified = reports.filter((r) => r.status === "verified").length;
  console.log(`  ${reports.length} demo blocks in one call (${verified} verified, exit ${all.status}): ${s(wall)}; their ${reports.flatMap((r) => r.simulations).length} simulations took ${s(ngspiceMs)} of ngspice`);
  console.log(`  ratio wall / (ngspice sum / ${cores} cores): ${(wall / (ngspiceMs / cores)).toFixed(2)}   (target <= 1.30, i.e. <= ${s(target)})`);
}
