import { mkdtempSync, rmSync } from "node:fs";
import os from "node:os";
import path from "node:path";
import { afterAll, describe, expect, it } from "vitest";
import { verifyBlock } from "@/checks";
import { at } from "@/checks/measures";
import { sanitizeNetlist, simulate } from "@/checks/spice";

// Vendor-style macro-models: POLY(n) controlled sources run (the engine's spinit loads the
// spice2poly code model alone); code models that read files stay refused; a simulator error
// points at the netlist line that caused it.
const cacheDir = mkdtempSync(path.join(os.tmpdir(), "assay-poly-"));
afterAll(() => rmSync(cacheDir, { recursive: true, force: true }));

// Our own op-amp macro-model in the classic style: a POLY(1) transconductance input stage into a
// dominant-pole node, and a POLY(2) output stage that adds a small common-mode term.
const MACRO = [
  ".subckt OAPOLY inp inn out",
  "Rin inp inn 2Meg",
  "G1 0 n1 POLY(1) inp inn 0 {GM}",
  "R1 n1 0 1Meg",
  "C1 n1 0 {CP}",
  "E2 out 0 POLY(2) n1 0 inp 0 0 1 1e-6",
  ".ends",
];
const block = (circuit: string[], script: string) => `---
slug: poly-macro
title: POLY macro-model
category: amplifier
summary: a follower on a POLY macro-model
params:
  - { name: GM, value: 0.2 S }
  - { name: CP, value: 31.83 nF }
---
\`\`\`spice
${[...MACRO, ...circuit].join("\n")}
\`\`\`

\`\`\`check
${script}
\`\`\`
`;

describe("POLY sources", () => {
  it("a macro-model with POLY(1) and POLY(2) sources simulates", async () => {
    // One-pole op-amp: A0 = gm R1 = 2e5, unity-gain frequency gm/(2π C1) = 1 MHz (common practice);
    // a follower's output is A0/(1 + A0) of its input.
    const text = block(
      ["V1 in 0 DC 1 AC 1", "X1 in out out OAPOLY", "RL out 0 10k", "X2 in 0 ol OAPOLY"],
      'vo = v(op(), "out")\ncheck("follows its input", near(vo, 1 V, 0.01%))\nres = ac(1 Hz, 100 MHz, 40)\nfu = cross_freq(res, "ol", 0)\ncheck("unity gain at gm/(2 pi C)", near(fu, GM / (2 pi CP), 1%))',
    );
    const { report } = await verifyBlock(text, { cacheDir });
    expect(report.errors).toEqual([]);
    expect(report.checks.map((c) => [c.label, c.status])).toEqual([["follows its input", "pass"], ["unity gain at gm/(2 pi C)", "pass"]]);
    expect(report.quantities.vo.value).toBeCloseTo(2e5 / (1 + 2e5), 5);
  });

  it("a simulator error names the netlist line that caused it, not the script's", async () => {
    const text = block(["V1 a 0 1", "V2 a 0 2", "R1 a 0 1k"], 'x = v(op(), "a")');
    const { report } = await verifyBlock(text, { cacheDir });
    const lines = text.split("\n");
    expect(report.errors).toHaveLength(1);
    expect(report.errors[0].line).toBe(lines.indexOf("V1 a 0 1") + 1);
    expect(report.errors[0].message).toMatch(/singular matrix/);
  });
});

describe("code models that read files stay refused", () => {
  it("refuses an A element (filesource reads a file) on its line", () => {
    expect(() => sanitizeNetlist("R1 a 0 1k\nA1 %v([a]) src\n.model src filesource (file=\"/etc/passwd\")")).toThrow(
      expect.objectContaining({ line: 2, message: expect.stringMatching(/code-model instance "a1"/) }),
    );
  });
});

describe("TABLE sources", () => {
  it("run as a B source with pwl(), clamped at the table's ends, continuation lines kept in place", () => {
    // A TABLE interpolates linearly between its points and holds the end values beyond them
    // (common practice for SPICE table sources).
    const circuit = "V1 in 0 DC 0\nR1 in 0 1k\nE1 t 0 TABLE {V(in)*2} =\n+ (0, 0) (1, 1.5)\n+ (3, 2)\nRT t 0 1k";
    const clean = sanitizeNetlist(circuit);
    expect(clean.split("\n")).toHaveLength(6);
    expect(clean.split("\n")[2]).toBe("BE1 t 0 V = pwl(min(max(V(in)*2, 0), 3), 0, 0, 1, 1.5, 3, 2)");
    const res = simulate({ title: "table", circuit, params: {}, analysis: { kind: "dc", source: "V1", from: -1, to: 3, step: 0.25 } }, { cacheDir });
    expect(at(res, "t", -1)).toBeCloseTo(0, 9);
    expect(at(res, "t", 0.25)).toBeCloseTo(0.75, 9);
    expect(at(res, "t", 1)).toBeCloseTo(1.75, 9);
    expect(at(res, "t", 3)).toBeCloseTo(2, 9);
  });
});
