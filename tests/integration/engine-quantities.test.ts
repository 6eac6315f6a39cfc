import { mkdtempSync, readFileSync, rmSync } from "node:fs";
import os from "node:os";
import path from "node:path";
import { afterAll, describe, expect, it } from "vitest";
import { verifyBlock } from "@/checks";

// DESIGN.md "Check scripts": every top-level assignment of a number or quantity is reported,
// simulated ones marked, so the hand value and the simulated one sit side by side.
const rc = readFileSync(path.join(__dirname, "../unit/fixtures/rc-lowpass.md"), "utf8");
const cacheDir = mkdtempSync(path.join(os.tmpdir(), "assay-sim-"));
afterAll(() => rmSync(cacheDir, { recursive: true, force: true }));

describe("reported quantities", () => {
  it("reports a simulated measure beside the hand value, marked simulated", async () => {
    const text = rc.replace('check("simulated -3 dB', 'f3 = f3db(res, "out")\ng1k = gain_db(res, "out", 1 kHz)\ncheck("simulated -3 dB');
    const { report } = await verifyBlock(text, { cacheDir });
    expect(report.errors).toEqual([]);
    // fc = 1/(2πRC) (Horowitz & Hill, The Art of Electronics, 3rd ed., §1.7, from memory).
    const fc = 1 / (2 * Math.PI * 3300 * 22e-9);
    expect(report.quantities.fc).toMatchObject({ value: expect.closeTo(fc, 6), unit: "Hz", text: "2.192 kHz" });
    expect(report.quantities.fc).not.toHaveProperty("simulated");
    expect(report.quantities.f3).toMatchObject({ unit: "Hz", simulated: true });
    expect(report.quantities.f3.value / fc).toBeCloseTo(1, 2);
    // |H| = 1/√(1 + (f/fc)²) for a first-order low-pass: at 1 kHz, -0.7928 dB.
    expect(report.quantities.g1k).toMatchObject({ unit: "dB", simulated: true });
    expect(report.quantities.g1k.value).toBeCloseTo(-10 * Math.log10(1 + (1000 / fc) ** 2), 2);
    expect(report.quantities).not.toHaveProperty("res");
  });

  it("simulates a temperature parameter given in K at the same temperature in °C", async () => {
    // R(T) = R0 (1 + tc1 (T - Tnom)), Tnom = 27 °C (ngspice manual, resistor temperature model):
    // 358.15 K is 85 °C, so 1 kohm with tc1 = 0.01 is 1.58 kohm and draws 1 V / 1.58 kohm.
    const text = `---
slug: temperature-deck
title: Temperature reaches the deck in degrees Celsius
category: other
summary: tc1 resistor at 85 degC
params:
  - { name: T, value: 358.15 K }
---
\`\`\`spice
.options temp={T}
V1 in 0 1
R1 in 0 1k tc1=0.01
\`\`\`

\`\`\`check
I85 = -i(op(), "V1")
check("current at 85 degC", near(I85, 1 V / 1.58 kohm, 0.01%))
\`\`\`
`;
    const { report } = await verifyBlock(text, { cacheDir });
    expect(report.errors).toEqual([]);
    expect(report.checks[0].status).toBe("pass");
    expect(report.quantities.I85).toMatchObject({ unit: "A", simulated: true });
  });
});
