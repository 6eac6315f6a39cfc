import { describe, expect, it } from "vitest";
import { readQuantity, retune } from "@/checks";
import { retuneBlock } from "@/checks/engine/retune";

// Non-inverting amplifier gain G = 1 + Rf/Rg (any op-amp text, e.g. Horowitz & Hill,
// The Art of Electronics, 3rd ed., §4.2.3, from memory).
const stage = `---
slug: noninverting-stage
title: Non-inverting gain stage
category: amplifier
summary: G = 1 + Rf/Rg
params:
  - { name: Rf, value: 10 kohm, tol: 1% }
  - { name: Rg, value: 1 kohm, tol: 1% }
---
\`\`\`check
G = 1 + Rf / Rg
check("gain between 10 and 12", G > 10 and G < 12)
\`\`\`
`;

describe("retune", () => {
  it("solves G = 1 + Rf/Rg for Rf and snaps it to E24", async () => {
    // G = 23.5 needs Rf = 22.5 kohm; E24 neighbours 22 and 24 kohm, 22 is nearer by ratio.
    const r = await retune(stage, { param: "Rf", target: { quantity: "G", value: "23.5" }, series: "E24" });
    expect(readQuantity(r.value).si).toBeCloseTo(22.5e3, 3);
    expect(r.value).toBe("22.5 kohm");
    expect(r.snapped).toBe("22 kohm");
    expect(r.report.quantities.G.value).toBeCloseTo(23, 12);
    expect(r.report.checks[0].status).toBe("fail");
  });

  it("solves for the denominator resistor too, across decades", () => {
    // G = 101 with Rf = 10 kohm needs Rg = 100 ohm (an E-series value itself).
    const r = retuneBlock(stage, { param: "Rg", target: { quantity: "G", value: "101" }, series: "E96" });
    expect(readQuantity(r.value).si).toBeCloseTo(100, 6);
    expect(r.snapped).toBe("100 ohm");
    // G = 11.5 → Rg = 10k/10.5 = 952.4 ohm; E96 has 953.
    const s = retuneBlock(stage, { param: "Rg", target: { quantity: "G", value: "11.5" }, series: "E96" });
    expect(s.value).toBe("952.4 ohm"); // four significant digits
    expect(readQuantity(s.value).si / (10e3 / 10.5)).toBeCloseTo(1, 4);
    expect(s.snapped).toBe("953 ohm");
    expect(s.report.status).toBe("verified");
  });

  it("explains requests it cannot meet", () => {
    expect(() => retuneBlock(stage, { param: "Rx", target: { quantity: "G", value: "2" }, series: "E24" })).toThrow(/unknown parameter/);
    expect(() => retuneBlock(stage, { param: "Rf", target: { quantity: "H", value: "2" }, series: "E24" })).toThrow(/not a quantity/);
    expect(() => retuneBlock(stage, { param: "Rf", target: { quantity: "G", value: "2 V" }, series: "E24" })).toThrow(/plain numbers.*V/);
    // G = 1 + Rf/Rg never reaches 0.5 for a positive Rf.
    expect(() => retuneBlock(stage, { param: "Rf", target: { quantity: "G", value: "0.5" }, series: "E24" })).toThrow(/no value of Rf/);
    expect(() => retuneBlock(stage, { param: "Rf", target: { quantity: "G", value: "20" }, series: "E5" })).toThrow(/unknown series/);
  });
});
