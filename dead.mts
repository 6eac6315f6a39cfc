import { readFileSync } from "node:fs";
import { evaluateBlock } from "./checks/engine/evaluate-block";
import { simBackend } from "./checks/sandbox/sim-backend";
import * as m from "./checks/measures";
const text = readFileSync("content/blocks/wien-bridge-sine-1k.md", "utf8");
const backend = simBackend({ cacheDir: "/tmp/engine-scratch/cache" });
let last: any;
const b = { ...backend, simulate: (req: any) => { const r = backend.simulate(req); last = r.result; return r; } };
const { report } = evaluateBlock(text, { simulate: true, backend: b, params: JSON.parse(process.argv[2] ?? "{}") });
console.log(report.checks.filter(c=>c.simulated).map(c => c.status + " " + c.detail).join("\n"));
const v = last.vectors["out"]; const t = last.scale;
let mx = 0; for (const x of v) mx = Math.max(mx, Math.abs(x));
let wmin = Infinity, wmax = -Infinity; for (let k = 0; k < t.length; k++) if (t[k] >= 0.03) { wmin = Math.min(wmin, v[k]); wmax = Math.max(wmax, v[k]); }
console.log("max|v|", mx, "window swing", wmax - wmin, wmin, wmax);
