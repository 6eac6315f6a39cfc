// npm run -s verify -- FILE.md [FILE.md | 'GLOB' ...] [--json]
// Checks block files; paths and globs are relative to where the command was typed (INIT_CWD). Files are verified
// in parallel, one sandbox child per core. With --json, stdout holds one report a line, in the order given.
// Exit code of the worst file: 0 verified, 1 failing or unchecked, 2 error.
import { readFileSync } from "node:fs";
import os from "node:os";
import path from "node:path";
import { globSync, isDynamicPattern } from "tinyglobby";
import type { Report } from "./engine/types";
import { verifyBlock } from "./sandbox/api";
import { SandboxLane, verifyLane } from "./sandbox/client";

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

const exitCode = (status: Report["status"] | "unreadable"): number => (status === "verified" ? 0 : status === "error" || status === "unreadable" ? 2 : 1);

function expand(args: string[], cwd: string): string[] {
  return args.flatMap((a) => (isDynamicPattern(a) ? globSync(a, { cwd, onlyFiles: true }).sort() : [a]));
}

type Outcome = { file: string; report?: Report; problem?: string };

async function verifyFile(file: string, cwd: string, lane: SandboxLane): Promise<Outcome> {
  let text: string;
  try {
    text = readFileSync(path.resolve(cwd, file), "utf8");
  } catch (e) {
    return { file, problem: `cannot read ${file}: ${(e as Error).message}` };
  }
  return { file, report: (await verifyBlock(text, { lane })).report };
}

async function main(): Promise<number> {
  verifyLane.warm(); // the child starts while the arguments are read and globbed
  const args = process.argv.slice(2);
  const json = args.includes("--json");
  const cwd = process.env.INIT_CWD ?? process.cwd();
  const files = expand(args.filter((a) => !a.startsWith("--")), cwd);
  if (files.length === 0) {
    process.stderr.write("usage: npm run -s verify -- FILE.md [MORE.md | 'content/blocks/*.md' ...] [--json]\n");
    return 2;
  }
  // One sandbox child per core at most: each runs its file's simulations, so files simulate side by side.
  const width = Math.min(files.length, os.availableParallelism());
  const lanes = [verifyLane, ...Array.from({ length: width - 1 }, () => new SandboxLane(768))];
  // Each file's outcome is a promise made up front; lanes fill them in turn, the printer reads them in order.
  const settle: ((o: Outcome) => void)[] = [];
  const outcomes = files.map((_, i) => new Promise<Outcome>((resolve) => (settle[i] = resolve)));
  let next = 0;
  const verifying = lanes.map(async (lane) => {
    for (let i = next++; i < files.length; i = next++) settle[i](await verifyFile(files[i], cwd, lane));
  });
  for (const outcome of outcomes) {
    const o = await outcome; // printed in the order given, each as soon as it and those before it are done
    if (o.problem) process.stderr.write(o.problem + "\n");
    else if (json) process.stdout.write(JSON.stringify(files.length > 1 ? { file: o.file, ...o.report } : o.report) + "\n");
    else process.stdout.write(human(o.report!, o.file) + "\n" + (files.length > 1 ? "\n" : ""));
  }
  await Promise.all(verifying);
  const done = await Promise.all(outcomes);
  const statuses = done.map((o) => o.report?.status ?? ("unreadable" as const));
  if (files.length > 1 && !json) {
    const count = (s: string) => statuses.filter((x) => x === s).length;
    process.stdout.write(`${files.length} files: ${count("verified")} verified, ${count("failing") + count("unchecked")} failing or unchecked, ${count("error") + count("unreadable")} error\n`);
  }
  return Math.max(...statuses.map(exitCode));
}

main().then(
  (code) => process.exit(code),
  (e) => {
    process.stderr.write(`${(e as Error).stack ?? e}\n`);
    process.exit(2);
  },
);
