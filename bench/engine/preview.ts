// Preview speed, the editor's per-keystroke call: `npx tsx bench/engine/preview.ts`.
// Prints wall-clock medians through the sandbox child; the target is < 150 ms for a typical block.
import fs from "node:fs";
import path from "node:path";
import { previewBlock, warmEngine } from "@/checks";
import { expressionBlock } from "./blocks";

const RUNS = Number(process.env.BENCH_RUNS ?? 15);
const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)];

async function main() {
  warmEngine();
  const blocks: [string, string][] = [
    ["expression block, 10 toleranced params (1024 corners)", expressionBlock],
    ...["rc-lowpass-antialias", "wien-bridge-sine-1k", "sallen-key-lowpass-unity"].map(
      (n) => [n, fs.readFileSync(path.join("content/blocks", `${n}.md`), "utf8")] as [string, string],
    ),
  ];
  const t0 = performance.now();
  await previewBlock(blocks[1][1]);
  console.log(`first previewBlock (waits for the sandbox child): ${(performance.now() - t0).toFixed(0)} ms`);
  for (const [name, text] of blocks) {
    const times: number[] = [];
    let corners = 0;
    for (let k = 0; k < RUNS; k++) {
      // A keystroke changes the text: vary a parameter so nothing can be served from a cache.
      const edited = text.replace(/(value: )(\d+(\.\d+)?)/, (_, a, v) => `${a}${Number(v) * (1 + k / 1000)}`);
      const s = performance.now();
      const r = await previewBlock(edited);
      times.push(performance.now() - s);
      corners = r.checks.find((c) => c.corners)?.corners?.values.length ?? 0;
    }
    console.log(`${name}: median ${median(times).toFixed(1)} ms, min ${Math.min(...times).toFixed(1)} ms (${corners} corners)`);
  }
}

main().catch((e) => {
  console.error(e);
  process.exitCode = 1;
});
