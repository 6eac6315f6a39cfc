// Engine speed: `npm run bench:engine`. Prints figures and ratios; targets are in bench/README.md.
import { spawnSync } from "node:child_process";
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { spiceDeck, verifyBlock, warmEngine } from "@/checks";
import { benchAnalyses } from "./analyses";
import { OSC_ANALYSIS, expressionBlock, oscillatorBlock } from "./blocks";
import { benchCli } from "./cli";

const RUNS = Number(process.env.BENCH_RUNS ?? 7);
const tmp = fs.mkdtempSync(path.join(os.tmpdir(), "assay-bench-"));

const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)];
const ms = (x: number) => `${x.toFixed(1)} ms`;

async function timed<T>(fn: () => Promise<T> | T): Promise<[number, T]> {
  const t0 = performance.now();
  const value = await fn();
  return [performance.now() - t0, value];
}

/** The same deck run by hand, `ngspice -b -r out.raw deck.cir` (without -r and with no .print, ngspice runs nothing). */
function bareNgspice(deck: string): number {
  const dir = fs.mkdtempSync(path.join(tmp, "bare-"));
  fs.writeFileSync(path.join(dir, "spinit"), "");
  fs.writeFileSync(path.join(dir, "deck.cir"), deck);
  const args = ["-b", "-r", "out.raw", "deck.cir"];
  const t0 = performance.now();
  const r = spawnSync("ngspice", args, { cwd: dir, env: { PATH: process.env.PATH, HOME: dir, SPICE_SCRIPTS: dir, NODE_ENV: process.env.NODE_ENV } });
  const t = performance.now() - t0;
  if (r.status !== 0) throw new Error(`bare ngspice failed: ${r.stderr}`);
  fs.rmSync(dir, { recursive: true, force: true });
  return t;
}

async function main() {
  warmEngine();
  const [coldMs, cold] = await timed(() => verifyBlock(expressionBlock, { cacheDir: path.join(tmp, "c0") }));
  if (cold.report.errors.length) throw new Error(`expression block: ${JSON.stringify(cold.report.errors)}`);
  const expr: number[] = [];
  for (let k = 0; k < RUNS; k++) expr.push((await timed(() => verifyBlock(expressionBlock)))[0]);
  console.log(`expression-only block, 10 toleranced params (${cold.report.checks.length} checks x 1024 corners, status ${cold.report.status})`);
  console.log(`  verifyBlock first call (child start): ${ms(coldMs)}   warm median of ${RUNS}: ${ms(median(expr))}`);

  const deck = spiceDeck(oscillatorBlock).replace(/\.end\n$/, `${OSC_ANALYSIS}\n.end\n`);
  const bare: number[] = [];
  const engine: number[] = [];
  const cached: number[] = [];
  let status = "";
  for (let k = 0; k < RUNS; k++) {
    bare.push(bareNgspice(deck));
    const cacheDir = path.join(tmp, `osc-${k}`);
    const [t, first] = await timed(() => verifyBlock(oscillatorBlock, { cacheDir }));
    const sim = first.report.simulations[0];
    if (!sim || sim.cached) throw new Error(`oscillator block did not simulate: ${JSON.stringify(first.report.errors)}`);
    status = `${first.report.status}, ${sim.points} points`;
    engine.push(t);
    const [tc, again] = await timed(() => verifyBlock(oscillatorBlock, { cacheDir }));
    if (!again.report.simulations[0]?.cached) throw new Error("the rerun was not served from the cache");
    cached.push(tc);
  }
  const b = median(bare);
  const e = median(engine);
  console.log(`60 ms Wien-bridge transient (${status}), medians of ${RUNS}`);
  console.log(`  bare ngspice -b -r out.raw deck.cir: ${ms(b)}`);
  console.log(`  verifyBlock (parse, script, ngspice, raw read, measures): ${ms(e)}`);
  console.log(`  ratio engine / bare: ${(e / b).toFixed(2)}   (target <= 1.25)`);
  console.log(`  cached rerun verifyBlock: ${ms(median(cached))}`);
  await benchAnalyses(tmp, RUNS);
  await benchCli(tmp, RUNS, bareNgspice);
}

main()
  .catch((e) => {
    console.error(e);
    process.exitCode = 1;
  })
  .finally(() => fs.rmSync(tmp, { recursive: true, force: true }));
