import { mkdtempSync, readFileSync } from "node:fs";
import os from "node:os";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { previewBlock, verifyBlock } from "@/checks";

// End to end through the sandbox child and a real ngspice run.
const rc = readFileSync(path.join(__dirname, "../unit/fixtures/rc-lowpass.md"), "utf8");

describe("verifyBlock with ngspice", () => {
  it("verifies the RC low-pass: simulated -3 dB point at 1/(2πRC)", async () => {
    // fc = 1/(2πRC) for a first-order RC low-pass (Horowitz & Hill, The Art of Electronics,
    // 3rd ed., §1.7, from memory): 3.3 kohm and 22 nF give 2.192 kHz.
    const cacheDir = mkdtempSync(path.join(os.tmpdir(), "assay-sim-"));
    const { report, waveforms } = await verifyBlock(rc, { cacheDir });
    expect(report.errors).toEqual([]);
    expect(report.status).toBe("verified");
    const fc = (r: number, c: number) => 1 / (2 * Math.PI * r * c);
    expect(report.quantities.fc).toEqual({
      value: expect.closeTo(fc(3300, 22e-9), 6), unit: "Hz", text: "2.192 kHz",
      // R ±1 %, C ±5 %: all four corners of the formula.
      spread: { min: expect.closeTo(fc(3333, 23.1e-9), 6), max: expect.closeTo(fc(3267, 20.9e-9), 6), over: "corners" },
    });
    expect(report.checks[1]).toMatchObject({ simulated: true, status: "pass" });
    expect(report.checks[1].detail).toMatch(/^f3db\(res, "out"\) = 2\.19\d? kHz ≈ fc = 2\.192 kHz ± 1% ✓/);
    // 10 Hz to 1 MHz at 50 points a decade: 5 decades, 251 points; nominal and the 2^2 corners.
    expect(report.simulations).toHaveLength(5);
    // The card is the analysis line as ngspice reads it (ngspice manual, ".AC": dec nd fstart fstop).
    expect(report.simulations[0]).toEqual({ analysis: "ac", card: ".ac dec 50 10 1000000", points: 251, ms: expect.any(Number), cached: false, corner: null });
    expect(report.checks[1]).toMatchObject({ over: "corners", simulations: 5 });
    // The nominal sweep and the same sweep at the worst corner of the simulated check.
    expect(waveforms.map((w) => w.variant)).toEqual(["nominal", "worst"]);
    const w = waveforms[0];
    expect(w.analysis).toBe("ac");
    expect(w.series[0].node).toBe("out");
    expect(w.x).toHaveLength(251);
    expect(w.series[0].values[0]).toBeCloseTo(0, 3); // flat in the pass band
    expect(w.marks.find((m) => /3 dB/.test(m.label))!.x).toBeCloseTo(2192.2, -1);

    const again = await verifyBlock(rc, { cacheDir });
    expect(again.report.simulations[0].cached).toBe(true);
    expect(again.report.checks).toEqual(report.checks);
  });

  it("fails the simulated check when the formula is wrong, and skips it without simulation", async () => {
    const wrong = rc.replace("fc = 1 / (2 pi R C)", "fc = 1 / (2 R C)");
    const cacheDir = mkdtempSync(path.join(os.tmpdir(), "assay-sim-"));
    const { report } = await verifyBlock(wrong, { cacheDir });
    expect(report.checks.map((c) => c.status)).toEqual(["fail", "fail"]);
    expect(report.status).toBe("failing");
    const dry = await verifyBlock(rc, { simulate: false });
    expect(dry.report.checks.map((c) => c.status)).toEqual(["pass", "skipped"]);
    expect(dry.report.status).toBe("unchecked");
  });

  it("reports a refused netlist on its line in the block file, in previews too", async () => {
    const bad = rc.replace("C1 out 0 {C}", "C1 out 0 {C}\n.control\nshell ls\n.endc");
    const line = bad.split("\n").indexOf(".control") + 1;
    const { report } = await verifyBlock(bad);
    expect(report.status).toBe("error");
    expect(report.errors[0]).toMatchObject({ line, message: expect.stringMatching(/^netlist:/) });
    const preview = await previewBlock(bad);
    expect(preview.errors[0]).toMatchObject({ line });
    expect(preview.quantities.fc.text).toBe("2.192 kHz");
  });
});
