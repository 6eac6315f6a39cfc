import { readFileSync } from "node:fs";
import { verifyBlock } from "@/checks";
(async () => { for (const f of process.argv.slice(2)) {
  const t0 = Date.now();
  const { report, waveforms } = await verifyBlock(readFileSync(f, "utf8"), { timeoutMs: 300_000, onProgress: (d, t) => process.stderr.write(`${d}/${t} `) });
  console.log("\n==", f, report.status, Date.now() - t0, "ms", report.errors.map((e) => `${e.line}: ${e.message}`).join("; "));
  console.log(JSON.stringify(report.quantities).slice(0, 800));
  for (const c of report.checks) console.log(" ", c.status, c.over, c.simulations, c.label, "|", c.detail, "\n    worst:", JSON.stringify(c.worst), c.yield ? JSON.stringify(c.yield) : "");
  console.log(" sims", report.simulations.length, "waveforms", waveforms.map((w) => `${w.group}:${w.variant}:${w.sweep?.text ?? ""}:${JSON.stringify(w.corner ?? {})}`).join(" "));
} process.exit(0); })();
