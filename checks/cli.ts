// npm run -s verify -- FILE.md [--json]
// Checks one block file; FILE is relative to where the command was typed (INIT_CWD).
// Exit 0 verified, 1 failing or unchecked, 2 error.
import { readFileSync } from "node:fs";
import path from "node:path";
import type { Report } from "./engine/types";
import { verifyBlock } from "./sandbox/api";

const MARK: Record<string, string> = { pass: "✓", fail: "✗", error: "!", skipped: "-" };

function human(report: Report, file: string): string {
  const out = [`${file}: ${report.status.toUpperCase()}${report.slug ? ` (${report.slug})` : ""}`];
  const q = Object.entries(report.quantities);
  if (q.length) out.push("", "quantities:", ...q.map(([k, v]) => `  ${k} = ${v.text}${v.simulated ? " [simulated]" : ""}`));
  if (report.checks.length) {
    out.push("", "checks:");
    for (const c of report.checks) {
      out.push(`  ${MARK[c.status]} ${c.label}${c.line ? ` (line ${c.line})` : ""}${c.simulated ? " [simulated]" : ""}`);
      out.push(`      ${c.detail}`);
      if (c.worst && c.status !== "pass")
        out.push(`      worst corner ${Object.entries(c.worst.corner).map(([k, v]) => `${k} ${v}`).join(", ")}: ${c.worst.detail}`);
    }
  }
  if (report.simulations.length)
    out.push("", "simulations:", ...report.simulations.map((s) => `  ${s.analysis}: ${s.points} points, ${s.ms} ms${s.cached ? " (cached)" : ""}`));
  if (report.errors.length) out.push("", "errors:", ...report.errors.map((e) => `  ${e.line ? `line ${e.line}: ` : ""}${e.message}`));
  return out.join("\n");
}

async function main(): Promise<number> {
  const args = process.argv.slice(2);
  const json = args.includes("--json");
  const files = args.filter((a) => !a.startsWith("--"));
  if (files.length !== 1) {
    process.stderr.write("usage: npm run -s verify -- FILE.md [--json]\n");
    return 2;
  }
  const file = path.resolve(process.env.INIT_CWD ?? process.cwd(), files[0]);
  let text: string;
  try {
    text = readFileSync(file, "utf8");
  } catch (e) {
    process.stderr.write(`cannot read ${file}: ${(e as Error).message}\n`);
    return 2;
  }
  const { report } = await verifyBlock(text);
  process.stdout.write(json ? JSON.stringify(report, null, 2) + "\n" : human(report, files[0]) + "\n");
  return report.status === "verified" ? 0 : report.status === "error" ? 2 : 1;
}

main().then(
  (code) => process.exit(code),
  (e) => {
    process.stderr.write(`${(e as Error).stack ?? e}\n`);
    process.exit(2);
  },
);
