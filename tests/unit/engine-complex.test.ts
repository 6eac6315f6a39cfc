import { describe, expect, it } from "vitest";
import { evaluateBlock } from "@/checks/engine/evaluate-block";

// Complex values in check scripts: a real formula pushed out of its domain (a fork that broke
// the design's assumptions) is an error on its own line, and the other checks still report.
const block = (script: string) => `---
slug: complex-values
title: Complex values
category: other
summary: domains
params:
  - { name: R, value: 10 kohm, tol: 1% }
---
\`\`\`check
${script}
\`\`\`
`;
const first = 10; // file line of the first script line
const run = (script: string) => evaluateBlock(block(script)).report;

describe("a value that becomes complex", () => {
  it("is an error on that line; earlier and independent checks are still reported", () => {
    // asin is real only on [-1, 1] (any calculus text: the inverse sine's domain, common practice).
    const r = run('x = 2\ncheck("earlier", x > 1)\nb = asin(x)\ncheck("uses b", b > 1)\ncheck("later", x < 3)');
    expect(r.status).toBe("error");
    expect(r.errors).toEqual([{ line: first + 2, message: expect.stringMatching(/^the value became complex: asin\(2\) = 1\.571 - 1\.317i/) }]);
    expect(r.checks.map((c) => [c.label, c.status])).toEqual([["earlier", "pass"], ["uses b", "error"], ["later", "pass"]]);
    expect(r.checks[1].detail).toMatch(new RegExp(`^b \\(line ${first + 2}\\) could not be evaluated: the value became complex`));
    expect(r.quantities.x.value).toBe(2);
    expect(r.quantities.b).toBeUndefined();
  });

  it("is caught where a unit would otherwise hide it (sqrt of a negative times a unit, a negative log)", () => {
    // √(-1) = i and ln(-2) = ln 2 + iπ: no real value (common practice).
    const r = run("a = sqrt(-1) * 1 kohm\nt = log(-2) / 1 ms\nok = 1 V");
    expect(r.errors.map((e) => [e.line, /became complex: (sqrt|log)\(-[12]\)/.test(e.message)])).toEqual([[first, true], [first + 1, true]]);
    expect(Object.keys(r.quantities)).toEqual(["ok"]);
  });

  it("inside a condition makes that check an error naming the complex value", () => {
    const r = run('check("inline", sqrt(1 - 4) < 1)\ncheck("fine", R > 1 kohm)');
    expect(r.checks[0]).toMatchObject({ status: "error", line: first, detail: expect.stringMatching(/became complex: sqrt\(-3\) = 1\.732i/) });
    expect(r.checks[1].status).toBe("pass");
  });

  it("at a tolerance corner only, says so in the check's detail", () => {
    // R/10 kohm - 1 is 0 at nominal and -0.01 at R -1%.
    const r = run('b = sqrt(R / 10 kohm - 1)\ncheck("b small", b < 1)');
    expect(r.checks[0].status).toBe("error");
    expect(r.checks[0].detail).toMatch(/at corner R -1%: b \(line 10\) could not be evaluated: the value became complex/);
  });

  it("leaves complex arithmetic the script asks for alone", () => {
    // |1/(1 + j2)| = 1/√5 (complex modulus, common practice).
    const r = run('H = 1 / (1 + complex(0, 1) * 2)\ng = abs(H)\ncheck("modulus", near(g, 1 / sqrt(5), 1e-9))');
    expect(r.errors).toEqual([]);
    expect(r.checks[0].status).toBe("pass");
  });
});
