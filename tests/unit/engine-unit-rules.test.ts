import { describe, expect, it } from "vitest";
import { evaluateBlock } from "@/checks/engine/evaluate-block";
import { deckValues, prepare } from "@/checks/engine/prepare";
import { withParams } from "@/checks";

// DESIGN.md "Check scripts" and "Block file format": units as engineers use them.
const block = (script: string, params = "  - { name: Rs, value: 1 kohm }\n  - { name: Rp, value: 2 kohm }\n") => `---
slug: unit-rules
title: Unit rules
category: other
summary: rules
params:
${params}---
\`\`\`check
${script}
\`\`\`
`;
const run = (script: string, params?: string) => evaluateBlock(block(script, params)).report;
const first = 11; // file line of the first script line

describe("dB and deg beside plain numbers", () => {
  it("compares dB with a plain number as dB, and near() takes a plain target in dB", () => {
    // 20 log10(Q) for Q = 10 is 20 dB (definition of the decibel for amplitude ratios, IEC 60027-3).
    const r = run('Q = 10\ng = 20.02 dB\ncheck("over", g > 15)\ncheck("near", near(g, 20 log10(Q), 0.05))\ncheck("abs", near(g, 20 log10(Q), 0.01 dB))\nd = g - 20');
    expect(r.checks.map((c) => c.status)).toEqual(["pass", "pass", "fail"]);
    expect(r.checks[0].detail).toBe("g = 20.02 dB > 15 ✓");
    expect(r.quantities.d).toEqual({ value: expect.closeTo(0.02, 12), unit: "dB", text: "0.02 dB" });
  });

  it("reads a plain number beside a phase as degrees", () => {
    const r = run('p = -120 deg\ncheck("margin", p + 180 > 45)');
    expect(r.checks[0]).toMatchObject({ status: "pass" });
  });
});

describe("mismatched dimensions", () => {
  it("names both units, never the math library's type list", () => {
    const r = run('check("v", Rs > 1 V)\ncheck("plain", Rs > 3)\nx = Rs + 2 V\ncheck("near", near(Rs, 1 V, 1%))');
    expect(r.checks[0].detail).toBe("cannot compare Rs = 1 kohm with 1 V: ohm and V are different dimensions");
    expect(r.checks[1].detail).toBe("cannot compare Rs = 1 kohm with 3: ohm against a plain number; give the number a unit");
    expect(r.errors).toEqual([{ message: "cannot add 1 kohm and 2 V: ohm and V are different dimensions", line: first + 2 }]);
    expect(r.checks[2].detail).toMatch(/^near\(\): cannot compare 1 kohm with 1 V: ohm and V/);
    for (const c of r.checks) expect(c.detail).not.toMatch(/Unexpected type|expected:|different base/);
  });
});

describe("units written in a script", () => {
  it("reads `300 K (Rs + Rp)` as a product and converts `to nV / Hz^0.5`", () => {
    // Johnson–Nyquist noise density √(4kTR) (Johnson, Phys. Rev. 32, 97, 1928; Nyquist, Phys. Rev. 32, 110, 1928):
    // at 300 K and 3 kohm, 7.050 nV/√Hz (k = 1.380649e-23 J/K, SI Brochure 9th ed.).
    const r = run("en = sqrt(4 boltzmann 300 K (Rs + Rp)) to nV / Hz^0.5");
    expect(r.errors).toEqual([]);
    expect(r.quantities.en.unit).toBe("V/Hz^0.5");
    expect(r.quantities.en.value).toBeCloseTo(Math.sqrt(4 * 1.380649e-23 * 300 * 3000), 15);
    expect(r.quantities.en.text).toBe("7.05 nV/Hz^0.5");
  });
});

describe("parameter values", () => {
  it("refuses a negative or zero resistance, capacitance or inductance at its field", () => {
    const r = run("x = 1", "  - { name: R, value: -5 kohm }\n  - { name: C, value: 0 nF }\n  - { name: V0, value: -5 V }\n");
    expect(r.errors).toEqual([
      { message: 'parameter "R": a resistance must be positive, not -5 kohm', line: 7 },
      { message: 'parameter "C": a capacitance must be positive, not 0 nF', line: 8 },
    ]);
    expect(() => withParams(block("x = 1"), { Rs: "-5 kohm" })).toThrow('parameter "Rs": a resistance must be positive, not -5 kohm');
    expect(() => withParams(block("x = 1"), { Rs: "5 V" })).toThrow(/"Rs" is in ohm; "5 V" is in V/);
  });

  it("writes a temperature given in K or degF to the deck in °C", () => {
    // 358.15 K = 85 °C and 185 °F = 85 °C (ITS-90 offsets; °F = °C × 9/5 + 32).
    const { block: b } = prepare(block("x = 1", "  - { name: Tk, value: 358.15 K }\n  - { name: Tf, value: 185 degF }\n  - { name: Rs, value: 1 kohm }\n"));
    const deck = deckValues(b!, Object.fromEntries(b!.params.map((p) => [p.name, p.si])));
    expect(deck.Tk).toBeCloseTo(85, 12);
    expect(deck.Tf).toBeCloseTo(85, 12);
    expect(deck.Rs).toBe(1000);
  });
});
