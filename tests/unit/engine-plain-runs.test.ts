import { describe, expect, it } from "vitest";
import { evaluateBlock } from "@/checks/engine/evaluate-block";
import { readsAreKnown } from "@/checks/engine/plain-runs";
import { analyzeScript } from "@/checks/script/analyze";

// fc = 1/(2πRC), first-order RC low-pass (any circuits text, e.g. Horowitz & Hill, The Art of
// Electronics, 3rd ed., §1.7, from memory): highest at R -tol, C -tol, lowest at R +tol, C +tol.
const FC_MAX = 1 / (2 * Math.PI * 10e3 * 0.99 * 100e-9 * 0.9);
const FC_MIN = 1 / (2 * Math.PI * 10e3 * 1.01 * 100e-9 * 1.1);

// R and C, plus eight parameters the RC corner does not read: 1024 corners.
const block = (script: string) => `---
slug: plain-runs
title: Plain runs
category: filter
summary: corners of a first-order RC among parameters it does not read
params:
  - { name: R, value: 10 kohm, tol: 1% }
  - { name: C, value: 100 nF, tol: 10% }
${Array.from({ length: 8 }, (_, k) => `  - { name: X${k}, value: 1 kohm, tol: 5% }\n`).join("")}---
\`\`\`check
${script}
check("corner below 180 Hz", fc < 180 Hz)
check("X0 and X1 under 2.1 kohm", X0 + X1 < 2.1 kohm)
\`\`\`
`;

describe("plain checks at 2^10 corners, each outcome from the parameters it reads", () => {
  const cases: [string, string][] = [
    ["an ordinary formula", "fc = 1 / (2 pi R C) to Hz"],
    // a[2] takes R after `a` was assigned.
    ["an element assignment", "a = [1 ohm, 1 ohm]\na[2] = R\nfc = 1 / (2 pi a[2] C) to Hz"],
    // f reads k at call time, and k is assigned on a later line: what fc reads is not known before it runs.
    ["a function reading a later line", "f(x) = x / k\nk = 2 pi R C\nfc = f(1) to Hz"],
  ];
  it.each(cases)("%s: the worst corner and the spread are those of the closed form", (_, script) => {
    const r = evaluateBlock(block(script)).report;
    const [rc, sum] = r.checks;
    expect(rc).toMatchObject({ status: "pass", over: "corners" });
    expect(rc.corners!.values).toHaveLength(1024);
    expect(rc.worst!.detail).toBe("fc = 178.6 Hz < 180 Hz ✓");
    expect(Math.max(...rc.corners!.values)).toBeCloseTo(FC_MAX, 9);
    expect(r.quantities.fc.spread!.max).toBeCloseTo(FC_MAX, 9);
    expect(r.quantities.fc.spread!.min).toBeCloseTo(FC_MIN, 9);
    // 1.05 + 1.05 kohm = 2.1 kohm is not under 2.1 kohm: fails where both sit at +5 %, 2^8 of 1024 corners.
    expect(sum.status).toBe("fail");
    expect(sum.detail).toMatch(/fails at 256 of 1024 tolerance corners$/);
    expect(sum.worst!.corner).toEqual({ X0: "+5%", X1: "+5%" });
  });

  it("runs every corner where a line's reads are not fixed by the parameters", () => {
    const known = (script: string) => readsAreKnown(analyzeScript(script, 1, [], ["R", "C"]));
    expect(known("fc = 1 / (2 pi R C)\ncheck(\"c\", fc < 1 kHz)")).toBe(true);
    expect(known("f(x) = x / k\nk = R C")).toBe(false);
    expect(known("n = R * random()")).toBe(false);
    expect(known("y = 2 * (z = R)")).toBe(false);
  });
});
