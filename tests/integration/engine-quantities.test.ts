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
    expect(report.quantities.fc).toEqual({ value: expect.closeTo(fc, 6), unit: "Hz", text: "2.192 kHz" });
    expect(report.quantities.fc).not.toHaveProperty("simulated");
    expect(report.quantities.f3).toMatchObject({ unit: "Hz", simulated: true });
    expect(report.quantities.f3.value / fc).toBeCloseTo(1, 2);
    // |H| = 1/√(1 + (f/fc)²) for a first-order low-pass: at 1 kHz, -0.7928 dB.
    expect(report.quantities.g1k).toMatchObject({ unit: "dB", simulated: true });
    expect(report.quantities.g1k.value).toBeCloseTo(-10 * Math.log10(1 + (1000 / fc) ** 2), 2);
    expect(report.quantities).not.toHaveProperty("res");
  });
});
