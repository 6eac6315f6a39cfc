import { describe, expect, it } from "vitest";
import { evaluateBlock } from "@/checks/engine/evaluate-block";

// Script rules of DESIGN.md "Check scripts".
const block = (script: string, params = "  - { name: R, value: 2 kohm }\n  - { name: F, value: 3 }\n") => `---
slug: script-rules
title: Script rules
category: other
summary: rules
params:
${params}---
\`\`\`check
${script}
\`\`\`
`;
const first = 11; // file line of the first script line
const run = (script: string, params?: string) => evaluateBlock(block(script, params)).report;

describe("check scripts", () => {
  it("lets a parameter named like a unit win over the unit", () => {
    const r = run("x = 2 F\ny = 1 kohm / R");
    expect(r.quantities.x).toEqual({ value: 6, unit: "", text: "6" });
    expect(r.quantities.y.value).toBe(0.5);
  });

  it("reports top-level numbers and units only, in their report units", () => {
    const r = run('a = 3 mA\nb = "text"\nc = true\nf(x) = 2 x\nd = f(4)\nm = [1, 2]');
    expect(Object.keys(r.quantities)).toEqual(["a", "d"]);
    expect(r.quantities.a).toEqual({ value: 0.003, unit: "A", text: "3 mA" });
    expect(r.status).toBe("unchecked");
  });

  it("reads a value name before a parenthesis as a product, not a call", () => {
    const r = run("g = R (1 + 1)\nh = sqrt(4) (R / 1 kohm)");
    expect(r.quantities.g.value).toBe(4000);
    expect(r.quantities.h.value).toBe(4);
  });

  it("shows each comparison's operands with units, naming a variable once", () => {
    const r = run('I = 12 V / R\ncheck("current in range", I > 5 mA and I < 10 mA)\ncheck("chained", 1 mA < I < 8 mA)');
    expect(r.checks[0]).toMatchObject({ status: "pass", detail: "I = 6 mA > 5 mA ✓ and 6 mA < 10 mA ✓", line: first + 1 });
    expect(r.checks[1]).toMatchObject({ status: "pass", detail: "1 mA < I = 6 mA ✓ and 6 mA < 8 mA ✓" });
    const n = run('check("near", near(R, 2.1 kohm, 2%))');
    expect(n.checks[0]).toMatchObject({ status: "fail", detail: "R = 2 kohm ≈ 2.1 kohm ± 2% ✗ (off by -4.8%)" });
  });

  it("reports syntax errors, unit mismatches and their consequences on the right lines", () => {
    const r = run('x = 1 +\ny = R + 1 V\ncheck("uses y", y > 1 V)\ncheck("mixed units", R > 1 V)');
    expect(r.status).toBe("error");
    expect(r.errors.map((e) => e.line)).toEqual([first, first + 1]);
    expect(r.checks[0]).toMatchObject({ status: "error", detail: expect.stringMatching(new RegExp(`^y \\(line ${first + 1}\\) could not be evaluated: cannot add .* ohm and V are different dimensions`, "i")) });
    expect(r.checks[1]).toMatchObject({ status: "error", detail: "cannot compare R = 2 kohm with 1 V: ohm and V are different dimensions" });
  });

  it("refuses an assignment to a parameter, which would hide it from the tolerance corners", () => {
    const r = run("R = 5 kohm\nx = R");
    expect(r.errors).toEqual([{ message: expect.stringMatching(/^R is a parameter/), line: first }]);
    expect(r.quantities.x.value).toBe(2000);
  });

  it("keeps check() a statement of its own, with a label and a condition", () => {
    const r = run('x = check("a", true)\ncheck("only a label")');
    expect(r.errors).toEqual([
      { message: "check() must stand on a line of its own", line: first },
      { message: expect.stringMatching(/takes a label and a condition/), line: first + 1 },
    ]);
  });

  it("reads near() tolerances: a plain number is relative, a quantity absolute", () => {
    const r = run('check("rel", near(R, 2.03 kohm, 2%))\ncheck("abs", near(R, 2.03 kohm, 20 ohm))\nok = near(1 V, 1.05 V, 0.1 V)');
    expect(r.checks.map((c) => c.status)).toEqual(["pass", "fail"]);
    expect(r.errors).toEqual([]);
  });

  it("refuses a simulation result used outside the nominal run and a measure on the wrong analysis", () => {
    // Checks on simulations are skipped without a simulator; nothing downstream is evaluated.
    const r = run('res = tran(1 ms, 1 us)\npk = peak(res, "out", 0 s, 1 ms)\ncheck("peak", pk < 1 V)');
    expect(r.checks).toEqual([expect.objectContaining({ simulated: true, status: "skipped" })]);
    expect(r.quantities).toEqual({});
  });
});
