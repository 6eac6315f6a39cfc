import { describe, expect, it } from "vitest";
import { parseBlock } from "@/checks";
import { toleranceCorners } from "@/checks/corners";
import { evaluateBlock } from "@/checks/engine/evaluate-block";

const rc = (limit: string, extra = "", more = "") => `---
slug: rc-corner
title: RC corner
category: filter
summary: corners of a first-order RC
params:
  - { name: R, value: 10 kohm, tol: 1% }
  - { name: C, value: 100 nF, tol: 10% }
${extra}---
\`\`\`check
fc = 1 / (2 pi R C)
check("corner below the limit", fc < ${limit})
${more}\`\`\`
`;

describe("tolerance corners", () => {
  it("visits all 2^k corners and names the worst one: fc = 1/(2πRC) is highest at R -tol, C -tol", () => {
    // fc = 1/(2πRC), first-order RC low-pass (any circuits text, e.g. Horowitz & Hill,
    // The Art of Electronics, 3rd ed., §1.7, from memory); fc falls as R or C rises.
    const nominal = 1 / (2 * Math.PI * 10e3 * 100e-9);
    const worst = 1 / (2 * Math.PI * 10e3 * 0.99 * 100e-9 * 0.9);
    const r = evaluateBlock(rc("180 Hz")).report;
    const c = r.checks[0];
    expect(c.status).toBe("pass");
    expect(c.worst!.corner).toEqual({ R: "-1%", C: "-10%" });
    expect(c.worst!.detail).toBe(`fc = ${(Math.round(worst * 10) / 10).toString()} Hz < 180 Hz ✓`);
    expect(c.corners!.values).toHaveLength(4);
    expect(Math.max(...c.corners!.values)).toBeCloseTo(worst, 9);
    expect(Math.min(...c.corners!.values)).toBeCloseTo(1 / (2 * Math.PI * 10.1e3 * 110e-9), 9);
    expect(c.corners!.nominal).toBeCloseTo(nominal, 9);
    expect(c.corners!.limits).toEqual([180]);
  });

  it("fails a check that passes at nominal but not at every corner", () => {
    // Nominal 159.15 Hz; C -10% gives 178.6 Hz (R -1%) and 175.1 Hz (R +1%), both past 170 Hz.
    const c = evaluateBlock(rc("170 Hz")).report.checks[0];
    expect(c.status).toBe("fail");
    expect(c.detail).toMatch(/^fc = 159.2 Hz < 170 Hz ✓; fails at 2 of 4 tolerance corners$/);
    expect(c.worst!.corner).toEqual({ R: "-1%", C: "-10%" });
  });

  it("uses an absolute tolerance in the value's unit", () => {
    const { block } = parseBlock(rc("1 kHz", "  - { name: Vs, value: 5 V, tol: 0.25 V }\n"));
    const { corners } = toleranceCorners(block!.params);
    expect(corners).toHaveLength(8);
    expect(new Set(corners.map((c) => c.values.Vs))).toEqual(new Set([4.75, 5.25]));
    expect(corners.find((c) => c.values.Vs === 4.75)!.label.Vs).toBe("-0.25 V");
  });

  it("above 10 toleranced parameters finds the worst corner from sensitivities, not from a random sample", () => {
    // A gain set by twelve 1 % resistors in a product: its worst error is all twelve at +1 %,
    // 20·log10(1.01^12) = 1.037 dB (exact arithmetic). 500 uniform samples stay far below it:
    // their sum of twelve uniform deviations has σ = 2 % and almost never reaches 12 %.
    const extra = Array.from({ length: 12 }, (_, k) => `  - { name: X${k}, value: 1 kohm, tol: 1% }\n`).join("");
    const product = Array.from({ length: 12 }, (_, k) => `(X${k} / 1 kohm)`).join(" * ");
    const text = rc("1 kHz", extra, `err_db = 20 log10(${product})\ncheck("gain error under 1 dB", abs(err_db) < 1)\ncheck("RC only", fc < 1 kHz)\n`);
    const { block } = parseBlock(text);
    const a = toleranceCorners(block!.params);
    expect(a.method).toBe("worst-case");
    expect(a.corners).toHaveLength(500);
    expect(toleranceCorners(block!.params).corners).toEqual(a.corners);
    const r = evaluateBlock(text).report;
    const gain = r.checks[1];
    expect(gain).toMatchObject({ status: "fail", over: "worst-case" });
    expect(gain.worst!.corner).toEqual(Object.fromEntries(Array.from({ length: 12 }, (_, k) => [`X${k}`, "+1%"])));
    expect(gain.worst!.detail).toMatch(/^abs\(err_db\) = 1\.037 < 1 ✗$/);
    expect(r.quantities.err_db.spread!.max).toBeCloseTo(20 * Math.log10(1.01 ** 12), 9);
    // The worst-corner line names only the parameters a check reads.
    expect(r.checks[2].worst!.corner).toEqual({ R: "-1%", C: "-10%" });
    // R, C and eight more: exactly 10 toleranced parameters, still every corner.
    const ten = parseBlock(rc("1 kHz", extra.split("\n").slice(4).join("\n"))).block!;
    expect(ten.params.filter((p) => p.tol)).toHaveLength(10);
    expect(toleranceCorners(ten.params)).toMatchObject({ method: "corners" });
    expect(toleranceCorners(ten.params).corners).toHaveLength(1024);
  });

  it("runs simulated checks at nominal only and reports them skipped without a simulation", () => {
    const text = rc("1 kHz", "", 'res = ac(1 Hz, 1 MHz, 10)\ncheck("sim", f3db(res, "out") < 1 kHz)\n');
    const r = evaluateBlock(text).report;
    expect(r.checks.map((c) => [c.simulated, c.status])).toEqual([[false, "pass"], [true, "skipped"]]);
    expect(r.checks[1].worst).toBeUndefined();
    expect(r.status).toBe("unchecked");
  });
});
