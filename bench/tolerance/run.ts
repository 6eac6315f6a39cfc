// Tolerance runs against bare ngspice: `npm run bench:tolerance`. Prints figures and ratios.
//  1. A 64-sample Monte Carlo of the demo Wien oscillator's transient, verified on one worker
//     (the engine's local executor, cold cache), against 64 × one bare `ngspice -b -r` of the same deck.
//  2. A filter's AC Monte Carlo (200 samples): per-simulation cost in the engine's batches against
//     one bare process per deck, and how much of a bare run is process start-up.
import { spawnSync } from "node:child_process";
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { localExecutor, spiceDeck, verifyBlock, warmEngine } from "@/checks";

const tmp = fs.mkdtempSync(path.join(os.tmpdir(), "assay-bench-tol-"));
const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)];
const f = (x: number, d = 0) => x.toFixed(d);

/** `ngspice -b -r out.raw deck.cir` with an empty spinit, as a user would run the downloaded deck. */
function bare(deck: string): number {
  const dir = fs.mkdtempSync(path.join(tmp, "bare-"));
  fs.writeFileSync(path.join(dir, "spinit"), "");
  fs.writeFileSync(path.join(dir, "deck.cir"), deck);
  const t0 = performance.now();
  const r = spawnSync("ngspice", ["-b", "-r", "out.raw", "deck.cir"], { cwd: dir, env: { PATH: process.env.PATH, HOME: dir, SPICE_SCRIPTS: dir, NODE_ENV: process.env.NODE_ENV } });
  const t = performance.now() - t0;
  if (r.status !== 0) throw new Error(`bare ngspice failed: ${r.stderr}`);
  fs.rmSync(dir, { recursive: true, force: true });
  return t;
}

/** The circuit deck with the script's analysis card, as the engine writes it, before .end. */
const withCard = (deck: string, card: string) =>
  deck
    .replace(/^\.include\s+(\S+\.lib)\s*$/gm, (_, name) => `.include "${path.join(process.cwd(), "content/models", name)}"`)
    .replace(/^\.end\s*$/m, `${card}\n.end`);

/** The demo block with `montecarlo(n)` as the script's first line. */
function withMonteCarlo(file: string, n: number): string {
  const text = fs.readFileSync(path.join(process.cwd(), "content/blocks", file), "utf8");
  return text.replace("```check\n", `\`\`\`check\nmontecarlo(${n})\n`);
}

async function monteCarlo(file: string, n: number, concurrency?: number, batch = true) {
  const text = withMonteCarlo(file, n);
  const cacheDir = fs.mkdtempSync(path.join(tmp, "cache-"));
  const executor = localExecutor({ cacheDir, batch, ...(concurrency ? { concurrency } : {}) });
  const t0 = performance.now();
  const { report } = await verifyBlock(text, { executor, cacheDir, timeoutMs: 600_000 });
  const wall = performance.now() - t0;
  if (report.errors.length) throw new Error(`${file}: ${JSON.stringify(report.errors)}`);
  const sims = report.simulations.length;
  const simMs = report.simulations.reduce((s, x) => s + x.ms, 0);
  return { wall, sims, simMs, status: report.status };
}

async function main() {
  warmEngine();
  console.log(`cores: ${os.availableParallelism()}, load average ${os.loadavg().map((x) => f(x, 1)).join(" ")}`);

  // 1. Wien oscillator, 40 ms transient at 5 us.
  const wien = fs.readFileSync(path.join(process.cwd(), "content/blocks/wien-bridge-sine-1k.md"), "utf8");
  const wienDeck = withCard(spiceDeck(wien), ".tran 5e-06 0.04"); // the script's tran(40 ms, 5 us)
  bare(wienDeck);
  await monteCarlo("wien-bridge-sine-1k.md", 2); // sandbox child and ngspice warm
  // Transients of up to 50,000 points run up to 16 to one ngspice process (checks/spice/local-executor.ts); the
  // same run with one process per simulation shows what that saves.
  for (const [c, batch] of [[1, true], [1, false], [undefined, true], [undefined, false]] as const) {
    // Bare runs just before and after the engine's, so both see the same machine load.
    const before = Array.from({ length: 5 }, () => bare(wienDeck));
    const r = await monteCarlo("wien-bridge-sine-1k.md", 64, c, batch);
    const wienBare = median([...before, ...Array.from({ length: 5 }, () => bare(wienDeck))]);
    const cores = c ?? os.availableParallelism();
    console.log(
      `Wien 64-sample Monte Carlo, one worker, ${cores} ngspice at a time, ${batch ? "transients batched" : "one process each"}: ` +
        `${f(r.wall)} ms wall for ${r.sims} simulations (64 samples + nominal, sensitivity pass and worst corners), ${r.status}`,
    );
    console.log(
      `  bare ngspice of the same deck: ${f(wienBare)} ms; 64 × bare = ${f(64 * wienBare)} ms; ` +
        `ratio ${f(r.wall / (64 * wienBare), 2)}x (target ≤ 1.15x); per simulation ${f(r.wall / r.sims)} ms wall = ` +
        `${f((r.wall * cores) / r.sims / wienBare, 2)}x a bare run per core; load average ${f(os.loadavg()[0], 1)}`,
    );
  }

  // 2. Sallen-Key low-pass, AC sweep: start-up against the analysis itself.
  const sk = fs.readFileSync(path.join(process.cwd(), "content/blocks/sallen-key-lowpass-unity.md"), "utf8");
  const skDeck = withCard(spiceDeck(sk), ".ac dec 50 10 100000"); // the script's ac(10 Hz, 100 kHz, 50)
  bare(skDeck);
  await monteCarlo("sallen-key-lowpass-unity.md", 2);
  const skBefore = Array.from({ length: 9 }, () => bare(skDeck));
  const r = await monteCarlo("sallen-key-lowpass-unity.md", 200);
  const skBare = median([...skBefore, ...Array.from({ length: 9 }, () => bare(skDeck))]);
  const empty = median(Array.from({ length: 9 }, () => bare("empty\nR1 a 0 1k\nI1 0 a 1m\n.op\n.end\n")));
  console.log(
    `Sallen-Key AC, 200-sample Monte Carlo: ${f(r.wall)} ms wall for ${r.sims} simulations = ${f(r.wall / r.sims, 1)} ms each ` +
      `(batches of up to 16 decks per ngspice process, ${os.availableParallelism()} processes at a time)`,
  );
  console.log(
    `  one bare ngspice per deck: ${f(skBare, 1)} ms, of which process start-up (an empty .op deck) ${f(empty, 1)} ms = ` +
      `${f((100 * empty) / skBare)} %; ${r.sims} bare runs in a row would take ${f(r.sims * skBare)} ms ` +
      `(${f((r.sims * skBare) / r.wall, 1)}x the engine's wall time)`,
  );
  fs.rmSync(tmp, { recursive: true, force: true });
  process.exit(0);
}

main().catch((e) => {
  console.error(e);
  process.exit(1);
});
