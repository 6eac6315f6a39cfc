// The dc, noise and tf analyses and the AC band measures: verifyBlock (parse, script in the
// sandbox, ngspice, raw read, measures) against a bare `ngspice -b -r out.raw deck.cir` of the
// very deck the engine writes. Run by `npm run bench:engine` after the transient figures.
import { spawnSync } from "node:child_process";
import fs from "node:fs";
import path from "node:path";
import { parseBlock, verifyBlock } from "@/checks";
import { writeDeck, type Analysis } from "@/checks/spice";

type Case = { name: string; circuit: string; analysis: Analysis; call: string; measures: string };

// Our own circuits, sized so that ngspice does real work (thousands of points).
const OPAMP = [".include opamp-1pole.lib", "V1 in 0 DC 0 AC 1", "Rs in p 1k", "X1 p n out OA1P", "Rf out n 100k", "Rg n 0 10k"].join("\n");
const DIODES = [".include diode-si.lib", ...Array.from({ length: 20 }, (_, k) => `I${k} 0 a${k} DC ${(k + 1) * 10}u\nD${k} a${k} 0 DSI`)].join("\n");
const LADDER = ["V1 in 0 DC 1", ...Array.from({ length: 4000 }, (_, k) => `Rs${k} n${k} n${k + 1} 10\nRp${k} n${k + 1} 0 100k`).map((l) => l.replace("n0 ", "in "))].join("\n");
const CHEBYSHEV = ["V1 in 0 AC 2", "Rs in a 1k", "C1 a 0 25.5n", "L2 a out 17.4m", "C3 out 0 25.5n", "RL out 0 1k"].join("\n");

const CASES: Case[] = [
  {
    name: "dc source sweep, 80,001 points",
    circuit: OPAMP, analysis: { kind: "dc", source: "V1", from: -2, to: 2, step: 5e-5 },
    call: 'r = dc("V1", -2 V, 2 V, 0.05 mV)', measures: 'check("gain", near(slope(r, "out", 0 V), 11, 1%))\nx = crossing(r, "out", 13 V)',
  },
  {
    name: "dc temperature sweep, 25,001 points x 20 diodes",
    circuit: DIODES, analysis: { kind: "dc", source: "temp", from: 233.15, to: 358.15, step: 0.005 },
    call: 'r = dc("temp", -40 degC, 85 degC, 0.005 degC)', measures: 'tc = slope(r, "a0", 25 degC)\ncheck("tempco", tc < -1 mV/K)',
  },
  {
    name: "noise, 35,001 points",
    circuit: OPAMP, analysis: { kind: "noise", node: "out", source: "V1", f1: 1, f2: 1e7, perDecade: 5000 },
    call: 'r = noise("out", "V1", 1 Hz, 10 MHz, 5000)', measures: 'en = noise_density(r, "in", 1 kHz)\ncheck("noise", noise_rms(r, "out") > 0 V)',
  },
  {
    name: "tf of a 4000-section ladder",
    circuit: LADDER, analysis: { kind: "tf", node: "n4000", source: "V1" },
    call: 'r = tf("n4000", "V1")', measures: 'g = tf_gain(r)\ncheck("rout", tf_rout(r) > 0 ohm)',
  },
  {
    name: "ac band measures, 15,001 points",
    circuit: CHEBYSHEV, analysis: { kind: "ac", f1: 100, f2: 100e3, perDecade: 5000 },
    call: "r = ac(100 Hz, 100 kHz, 5000)", measures: 'ripple = max_gain_db(r, "out", 100 Hz, 10 kHz) - min_gain_db(r, "out", 100 Hz, 10 kHz)\ncheck("ripple", ripple < 1)\npf = peak_freq(r, "out")',
  },
];

const block = (c: Case) => `---
slug: bench-analysis
title: Bench block, ${c.name}
category: other
summary: bench
params:
  - { name: Nb, value: 1 }
---
\`\`\`spice
${c.circuit}
\`\`\`

\`\`\`check
${c.call}
${c.measures}
\`\`\`
`;

function bare(deck: string, tmp: string): number {
  const dir = fs.mkdtempSync(path.join(tmp, "bare-"));
  fs.writeFileSync(path.join(dir, "spinit"), "");
  fs.writeFileSync(path.join(dir, "deck.cir"), deck);
  const t0 = performance.now();
  const r = spawnSync("ngspice", ["-b", "-r", "out.raw", "deck.cir"], { cwd: dir, env: { PATH: process.env.PATH, HOME: dir, SPICE_SCRIPTS: dir, NODE_ENV: process.env.NODE_ENV } });
  const t = performance.now() - t0;
  if (r.status !== 0 || !fs.existsSync(path.join(dir, "out.raw"))) throw new Error(`bare ngspice failed: ${r.stderr}`);
  fs.rmSync(dir, { recursive: true, force: true });
  return t;
}

export async function benchAnalyses(tmp: string, runs: number): Promise<void> {
  const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)];
  console.log(`new analyses: verifyBlock against bare ngspice of the same deck, medians of ${runs} (target ratio <= 1.25)`);
  for (const c of CASES) {
    const text = block(c);
    const parsed = parseBlock(text).block!;
    const deck = writeDeck({ title: parsed.title, circuit: parsed.netlist, params: { Nb: 1 }, analysis: c.analysis });
    const [b, e]: number[][] = [[], []];
    let status = "";
    for (let k = 0; k < runs; k++) {
      b.push(bare(deck, tmp));
      const t0 = performance.now();
      const { report } = await verifyBlock(text, { cacheDir: path.join(tmp, `an-${c.analysis.kind}-${k}-${Math.random()}`) });
      e.push(performance.now() - t0);
      if (report.status !== "verified" || report.simulations[0]?.cached !== false) throw new Error(`${c.name}: ${report.status} ${JSON.stringify([report.errors, report.checks])}`);
      status = `${report.status}, ${report.simulations[0].points} points`;
    }
    const [mb, me] = [median(b), median(e)];
    console.log(`  ${c.name} (${status}): bare ${mb.toFixed(1)} ms, verifyBlock ${me.toFixed(1)} ms, ratio ${(me / mb).toFixed(2)}`);
  }
}
