import { spawnSync } from "node:child_process";
import { mkdtempSync, writeFileSync } from "node:fs";
import os from "node:os";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { previewBlock, verifyBlock } from "@/checks";

// The refusals follow the mathjs documentation, "Security" page: disable import, createUnit,
// evaluate, parse, simplify, derivative, resolve (and friends) in an instance given to users.
const probe = (script: string) => `---
slug: sandbox-probe
title: Sandbox probe
category: other
summary: probe
params:
  - { name: R, value: 1 kohm, tol: 1% }
---
\`\`\`check
${script}
check("R is positive", R > 0 ohm)
\`\`\`
`;
const scriptLine = 10;

describe("script sandbox", () => {
  it.each([
    ['x = import({ a: 1 })', /import\(\) is not available/],
    ['createUnit("furlong")', /createUnit\(\) is not available/],
    ['y = evaluate("1 + 1")', /evaluate\(\) is not available/],
    ['p = parse("1 + 1")', /parse\(\) is not available/],
    ['s = simplify("x + x")', /simplify\(\) is not available/],
    ['d = derivative("x^2", "x")', /derivative\(\) is not available/],
    ['config({ number: "BigNumber" })', /config\(\) is not available/],
  ])("refuses %s with an error on its line", async (script, message) => {
    const r = await previewBlock(probe(script));
    expect(r.status).toBe("error");
    expect(r.errors).toEqual([{ message: expect.stringMatching(message), line: scriptLine }]);
  });

  it("stops runaway recursion with an error, not a hang", async () => {
    const r = await previewBlock(probe("f(x) = f(x) + 1\ny = f(1)"));
    expect(r.status).toBe("error");
    expect(r.errors[0]).toEqual({ message: expect.stringMatching(/recursed too deep/), line: scriptLine + 1 });
  });

  it("stops a huge matrix at the memory limit and recovers for the next request", async () => {
    const r = await previewBlock(probe("m = zeros(20000, 20000)"));
    expect(r.status).toBe("error");
    // Near the heap limit V8 collects garbage hard; on a busy machine the wall-clock limit may come first.
    expect(r.errors[0].message).toMatch(/ran out of memory|took longer than/);
    expect((await previewBlock(probe("a = 2"))).status).toBe("verified");
  });

  it("stops a long computation at the wall-clock limit", async () => {
    const { report } = await verifyBlock(probe("s = sum(ones(1500, 1500) * ones(1500, 1500))"), { timeoutMs: 1500 });
    expect(report.status).toBe("error");
    expect(report.errors[0].message).toMatch(/longer than 1500 ms/);
  });

  it("never throws for bad input: the report carries the error", async () => {
    const { report } = await verifyBlock("not a block file");
    expect(report).toMatchObject({ status: "error", errors: [{ line: 1 }] });
  });
});

describe("verify CLI", () => {
  // Exit codes and --json output as in DESIGN.md "Reports and badges".
  const root = path.resolve(__dirname, "../..");
  const cli = (file: string, ...args: string[]) =>
    spawnSync(process.execPath, ["--import", "tsx", path.join(root, "checks/cli.ts"), file, ...args], {
      cwd: root,
      encoding: "utf8",
      env: { ...process.env, INIT_CWD: path.dirname(file) },
      timeout: 60_000,
    });

  it("exits 2 with only the JSON report on stdout for a refused script", () => {
    const dir = mkdtempSync(path.join(os.tmpdir(), "assay-cli-"));
    writeFileSync(path.join(dir, "bad.md"), probe('y = evaluate("1")'));
    const r = cli(path.join(dir, "bad.md"), "--json");
    expect(r.status).toBe(2);
    const report = JSON.parse(r.stdout);
    expect(report).toMatchObject({ slug: "sandbox-probe", status: "error", errors: [{ line: scriptLine }] });
  });

  it("exits 1 for a failing block, reading FILE relative to INIT_CWD, with a human report", () => {
    const dir = mkdtempSync(path.join(os.tmpdir(), "assay-cli-"));
    writeFileSync(path.join(dir, "fail.md"), probe("").replace("R > 0 ohm", "R > 2 kohm"));
    const r = spawnSync(process.execPath, ["--import", "tsx", path.join(root, "checks/cli.ts"), "fail.md"], {
      cwd: root, encoding: "utf8", env: { ...process.env, INIT_CWD: dir }, timeout: 60_000,
    });
    expect(r.status).toBe(1);
    expect(r.stdout).toMatch(/^fail\.md: FAILING/);
    expect(r.stdout).toContain("R = 1 kohm > 2 kohm ✗");
  });
  it("checks several files and a glob in one call, compiled: one JSON report a line in the order given, exit of the worst", () => {
    const dir = mkdtempSync(path.join(os.tmpdir(), "assay-cli-"));
    writeFileSync(path.join(dir, "a-ok.md"), probe(""));
    writeFileSync(path.join(dir, "b-fail.md"), probe("").replace("R > 0 ohm", "R > 2 kohm"));
    writeFileSync(path.join(dir, "c-ok.md"), probe(""));
    // The path `npm run -s verify` takes: the compiled CLI, rebuilt first when checks/ changed.
    const r = spawnSync(process.execPath, [path.join(root, "scripts/engine-build.mjs"), "--run-cli", "c-ok.md", "[ab]-*.md", "--json"], {
      cwd: root, encoding: "utf8", env: { ...process.env, INIT_CWD: dir }, timeout: 120_000,
    });
    expect(r.status, r.stderr).toBe(1);
    const lines = r.stdout.trim().split("\n").map((l) => JSON.parse(l) as { file: string; status: string });
    expect(lines.map((l) => [l.file, l.status])).toEqual([["c-ok.md", "verified"], ["a-ok.md", "verified"], ["b-fail.md", "failing"]]);
  }, 180_000);
});
