import { describe, expect, it } from "vitest";
import { evaluateBlock } from "@/checks/engine/evaluate-block";

// The report's `compared` field is what the block page draws: the value, its limits and a near()'s target, in SI numbers.
const block = (lines: string) => `---
slug: compared
title: Compared
category: other
summary: what a check compared
params:
  - { name: R, value: 10 kohm }
  - { name: C, value: 100 nF }
---
\`\`\`check
fc = 1 / (2 pi R C)
${lines}
\`\`\`
`;

// fc = 1/(2πRC) = 159.15 Hz for 10 kΩ and 100 nF (first-order RC, common practice).
const FC = 1 / (2 * Math.PI * 10e3 * 100e-9);

describe("what a check compared", () => {
  it("gives a near() check its target and its band as two limits", () => {
    const [c] = evaluateBlock(block('check("fc near 160 Hz", near(fc, 160 Hz, 3%))')).report.checks;
    expect(c.compared!.quantity).toBe("fc");
    expect(c.compared!.unit).toBe("Hz");
    expect(c.compared!.value).toBeCloseTo(FC, 9);
    expect(c.compared!.target).toBe(160);
    expect(c.compared!.limits[0]).toBeCloseTo(160 * 0.97, 9);
    expect(c.compared!.limits[1]).toBeCloseTo(160 * 1.03, 9);
    expect(c.compared!.relations).toEqual(["≥", "≤"]);
  });

  it("reads a limit written first the right way round, and keeps both limits of a band", () => {
    const [c] = evaluateBlock(block('check("fc in band", 150 Hz < fc and fc < 170 Hz)')).report.checks;
    expect(c.compared!.limits).toEqual([150, 170]);
    expect(c.compared!.relations).toEqual([">", "<"]);
    expect(c.compared!.target).toBeUndefined();
  });

  it("leaves it out when the condition compares nothing numeric", () => {
    const [c] = evaluateBlock(block('check("always", true)')).report.checks;
    expect(c.compared).toBeUndefined();
  });
});
