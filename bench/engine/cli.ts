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

// CPU time of the whole process tree (npm, the CLI, its sandbox children, ngspice) from `perf stat`, where perf runs:
// on a busy machine wall time mostly measures the wait for a core, CPU time much less so.
const PERF = spawnSync("perf", ["stat", "-x,", "-e", "task-clock", "true"], { encoding: "utf8" }).status === 0;

function timedCommand(args: string[], env: Record<string, string> = {}): { ms: number; cpuMs: number; stdout: string; status: number | null } {
  const [cmd, argv] = PERF ? ["perf", ["stat", "-x,", "-e", "task-clock", "npm", ...args]] : ["npm", args];
  const t0 = performance.now();
  const r = spawnSync(cmd, argv, { encoding: "utf8", env: { ...process.env, ...env }, maxBuffer: 64 * 2 ** 20 });
  const cpu = /^([\d.]+),[^,]*,task-clock/m.exec(r.stderr ?? "");
  return { ms: performance.now() - t0, cpuMs: cpu ? Number(cpu[1]) : NaN, stdout: r.stdout, status: r.status };
}

/** CPU time of one bare `ngspice -b -r out.raw deck.cir` (NaN without perf). */
function bareCpu(tmp: string, deck: string): number {
  if (!PERF) return NaN;
  const dir = fs.mkdtempSync(path.join(tmp, "bare-cpu-"));
  fs.writeFileSync(path.join(dir, "spinit"), "");
  fs.writeFileSync(path.join(dir, "deck.cir"), deck);
  const env = { PATH: process.env.PATH, HOME: dir, SPICE_SCRIPTS: dir, NODE_ENV: process.env.NODE_ENV };
  const r = spawnSync("perf", ["stat", "-x,", "-e", "task-clock", "ngspice", "-b", "-r", "out.raw", "deck.cir"], { cwd: dir, env, encoding: "utf8" });
  fs.rmSync(dir, { recursive: true, force: true });
  const cpu = /^([\d.]+),[^,]*,task-clock/m.exec(r.stderr ?? "");
  return cpu ? Number(cpu[1]) : NaN;
}

/** Medians of wall and CPU time over `runs` runs of the command. */
function medians(runs: number, run: () => { ms: number; cpuMs: number }): { ms: number; cpuMs: number } {
  const rs = Array.from({ length: runs }, run);
  return { ms: median(rs.map((r) => r.ms)), cpuMs: median(rs.map((r) => r.cpuMs)) };
}
const cpuText = (cpuMs: number) => (Number.isNaN(cpuMs) ? "" : `, CPU ${s(cpuMs)}`);

/** The simulation cache would answer a second run without ngspice: each timed run gets an empty one. */
const freshCache = (tmp: string) => ({ ASSAY_SIM_CACHE: fs.mkdtempSync(path.join(tmp, "cache-")) });

export async function benchCli(tmp: string, runs: number, bareNgspice: (deck: string) => number): Promise<void> {
  spawnSync("node", ["scripts/engine-build.mjs"], { stdio: "inherit" }); // a build is not what a CI run pays
  const npm = medians(runs, () => timedCommand(["run", "-s", "env"]));
  const npmCost = npm.ms;
  console.log(
    `\nnpm run -s verify (compiled CLI), medians of ${runs}, load average ${os.loadavg()[0].toFixed(1)}; npm run -s itself costs ` +
      `${s(npm.ms)}${cpuText(npm.cpuMs)} here and is subtracted`,
  );

  const exprFile = path.join(tmp, "expressions.md");
  fs.writeFileSync(exprFile, expressionBlock);
  const expr = medians(runs, () => timedCommand(["run", "-s", "verify", "--", exprFile, "--json"]));
  console.log(`  expression-only block: ${s(expr.ms - npm.ms)}${cpuText(expr.cpuMs - npm.cpuMs)}   (target <= 0.40 s)`);

  const oscFile = path.join(tmp, "oscillator.md");
  fs.writeFileSync(oscFile, oscillatorBlock);
  const deck = spiceDeck(oscillatorBlock).replace(/\.end\n$/, `${OSC_ANALYSIS}\n.end\n`);
  const bare = median(Array.from({ length: runs }, () => bareNgspice(deck)));
  const sim = medians(runs, () => timedCommand(["run", "-s", "verify", "--", oscFile, "--json"], freshCache(tmp)));
  const simMs = sim.ms - npm.ms;
  const bareCpuMs = median(Array.from({ length: runs }, () => bareCpu(tmp, deck)));
  console.log(
    `  simulated block (60 ms transient): ${s(simMs)}${cpuText(sim.cpuMs - npm.cpuMs)}; bare ngspice ${s(bare)}${cpuText(bareCpuMs)}; ` +
      `overhead ${s(simMs - bare)}${cpuText(sim.cpuMs - npm.cpuMs - bareCpuMs)}   (target <= 0.40 s)`,
  );

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
