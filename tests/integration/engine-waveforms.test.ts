import { mkdtempSync, rmSync } from "node:fs";
import os from "node:os";
import path from "node:path";
import { afterAll, describe, expect, it } from "vitest";
import { verifyBlock } from "@/checks";

// The plot data verifyBlock returns: every measured window of a transient, the -3 dB point of
// an AC sweep, once each. The circuit is a first-order RC low-pass driven by a 1 kHz sine:
// fc = 1/(2πRC) and the steady-state amplitude is A/√(1 + (f/fc)²) (Horowitz & Hill, The Art
// of Electronics, 3rd ed., ch. 1, RC filters, from memory).
const block = `---
slug: rc-window-test
title: RC low-pass windows
category: filter
summary: windows and marks
params:
  - { name: R, value: 1.6 kohm }
  - { name: C, value: 100 nF }
---
\`\`\`spice
V1 in 0 SIN(0 1 1k) AC 1
R1 in out {R}
C1 out 0 {C}
\`\`\`

\`\`\`check
fc = 1 / (2 pi R C) to Hz
amp = 1 V / sqrt(1 + (1 kHz / fc)^2)
res = tran(10 ms, 2 us)
check("peak", near(peak(res, "out", 6 ms, 10 ms), amp, 2%))
check("trough", near(trough(res, "out", 6 ms, 10 ms), -amp, 2%))
check("swing", near(pp(res, "out", 6 ms, 10 ms), 2 amp, 2%))
check("rms", near(rms(res, "out", 6 ms, 10 ms), amp / sqrt(2), 2%))
check("mean", abs(avg(res, "out", 6 ms, 10 ms)) < 10 mV)
check("frequency", near(freq(res, "out", 5 ms, 10 ms), 1 kHz, 1%))
check("distortion", thd(res, "out", 5 ms, 10 ms) < 1%)
check("measured twice", peak(res, "out", 6 ms, 10 ms) > 0.5 amp)
sweep = ac(10 Hz, 100 kHz, 50)
check("corner", near(f3db(sweep, "out"), fc, 1%))
\`\`\`
`;

const cacheDir = mkdtempSync(path.join(os.tmpdir(), "assay-wave-"));
afterAll(() => rmSync(cacheDir, { recursive: true, force: true }));

describe("verifyBlock waveforms", () => {
  it("carries each measured window of the transient and the measured -3 dB mark of the sweep", async () => {
    const { report, waveforms } = await verifyBlock(block, { cacheDir });
    expect(report.errors).toEqual([]);
    expect(report.checks.filter((c) => c.status !== "pass")).toEqual([]);
    expect(waveforms.map((w) => w.analysis)).toEqual(["tran", "ac"]);
    const [tran, ac] = waveforms;
    expect(tran.series.map((s) => s.node)).toEqual(["out"]);
    const w = (measure: string, from: number, to: number) => ({ node: "out", measure, from: expect.closeTo(from, 9), to: expect.closeTo(to, 9), value: expect.any(Number) });
    // One window per distinct measure and span; peak measured twice is listed once.
    expect(tran.windows).toEqual([
      w("peak", 6e-3, 10e-3), w("trough", 6e-3, 10e-3), w("pp", 6e-3, 10e-3), w("rms", 6e-3, 10e-3),
      w("avg", 6e-3, 10e-3), w("freq", 5e-3, 10e-3), w("thd", 5e-3, 10e-3),
    ]);
    expect(tran.marks).toEqual([]);
    expect(tran.x.length).toBeLessThanOrEqual(2000);
    const fc = 1 / (2 * Math.PI * 1.6e3 * 100e-9);
    expect(ac.windows).toEqual([]);
    expect(ac.marks).toHaveLength(1);
    expect(ac.marks[0]).toMatchObject({ node: "out", label: "−3 dB" });
    expect(Math.abs(ac.marks[0].x / fc - 1)).toBeLessThan(0.01);
  }, 60_000);
});
