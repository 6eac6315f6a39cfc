import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { afterAll, describe, expect, it } from "vitest";
import { f3db, freq, gain_db, i, phase, rms, thd, v } from "@/checks/measures";
import { simulate, type SimRequest } from "@/checks/spice";

const cacheDir = fs.mkdtempSync(path.join(os.tmpdir(), "assay-cache-"));
afterAll(() => fs.rmSync(cacheDir, { recursive: true, force: true }));
const run = (req: SimRequest) => simulate(req, { cacheDir });

describe("first-order RC low-pass in ngspice", () => {
  const R = 4.7e3;
  const C = 15e-9;
  // Closed form (any circuits textbook): fc = 1/(2πRC), where |H| = 1/√2 and the phase is -45°.
  const fc = 1 / (2 * Math.PI * R * C);
  const res = run({
    title: "rc low-pass", params: { R, C }, analysis: { kind: "ac", f1: 10, f2: 1e6, perDecade: 100 },
    circuit: "V1 in 0 AC 1\nR1 in out {R}\nC1 out 0 {C}",
  });
  it("simulated -3 dB point matches 1/(2πRC)", () => {
    expect(Math.abs(f3db(res, "out") / fc - 1)).toBeLessThan(1e-3);
  });
  it("phase at fc is -45° and gain -3.01 dB", () => {
    expect(phase(res, "out", fc)).toBeCloseTo(-45, 1);
    expect(gain_db(res, "out", fc)).toBeCloseTo(-3.0103, 2);
  });
});

describe("unity-gain Sallen–Key low-pass in ngspice", () => {
  // Equal resistors; C1 from the middle node to the output, C2 to ground; ideal op-amp as a VCVS follower.
  // Closed forms (Sallen & Key, IRE Trans. Circuit Theory, 1955; any active-filter text, from memory):
  // f0 = 1/(2π√(R1 R2 C1 C2)), Q = √(R1 R2 C1 C2)/((R1 + R2) C2), and |H(j2πf0)| = Q at unity gain.
  const p = { R1: 12e3, R2: 12e3, C1: 33e-9, C2: 15e-9 };
  const f0 = 1 / (2 * Math.PI * Math.sqrt(p.R1 * p.R2 * p.C1 * p.C2));
  const Q = Math.sqrt(p.R1 * p.R2 * p.C1 * p.C2) / ((p.R1 + p.R2) * p.C2);
  const res = run({
    title: "sallen-key", params: p, analysis: { kind: "ac", f1: 10, f2: 1e5, perDecade: 200 },
    circuit: ["V1 in 0 AC 1", "R1 in a {R1}", "R2 a b {R2}", "C1 a out {C1}", "C2 b 0 {C2}", "E1 out 0 b out 1e6"].join("\n"),
  });
  it("gain at f0 equals Q", () => {
    expect(gain_db(res, "out", f0)).toBeCloseTo(20 * Math.log10(Q), 2);
  });
  it("phase at f0 is -90°", () => {
    // A second-order low-pass passes -90° at its natural frequency.
    expect(phase(res, "out", f0)).toBeCloseTo(-90, 0);
  });
  it("is flat (0 dB) well below f0", () => {
    expect(gain_db(res, "out", 10)).toBeCloseTo(0, 3);
  });
});

describe("operating point in ngspice", () => {
  it("a divider gives Ohm's-law voltage and source current", () => {
    // Ohm's law: 9 V across 6.8 k + 3.3 k; SPICE reports a source's current into its + terminal (negative here).
    const res = run({ title: "divider", params: { Vs: 9 }, analysis: { kind: "op" }, circuit: "V1 top 0 DC {Vs}\nR1 top mid 6.8k\nR2 mid 0 3.3k" });
    expect(v(res, "mid")).toBeCloseTo((9 * 3.3) / 10.1, 9);
    expect(i(res, "V1")).toBeCloseTo(-9 / 10.1e3, 12);
    expect(res.scale).toHaveLength(0);
  });
});

describe("transient measures on ngspice's own sources", () => {
  // Two stacked SIN sources: 1.5 V at 1 kHz plus 0.12 V at 3 kHz, i.e. an 8 % third harmonic.
  // 100 time steps per period: the documented resampling floor is π²/(2·100²) ≈ 5e-4.
  const res = run({
    title: "sine sources", params: {}, analysis: { kind: "tran", stop: 20e-3, step: 10e-6 },
    circuit: "V1 a 0 SIN(0 1.5 1k)\nV2 b a SIN(0 0.12 3k)\nR1 b 0 1k\nR2 a 0 1k",
  });
  it("a pure sine: freq exact, rms = A/√2, THD near zero", () => {
    expect(Math.abs(freq(res, "a", 2e-3, 20e-3) / 1e3 - 1)).toBeLessThan(1e-4);
    expect(rms(res, "a", 0, 20e-3)).toBeCloseTo(1.5 / Math.SQRT2, 3);
    expect(thd(res, "a", 2e-3, 20e-3)).toBeLessThan(1e-3);
  });
  it("sine plus a known third harmonic: THD is the amplitude ratio", () => {
    // THD = V3/V1 = 0.12/1.5 = 0.08 by definition (common practice).
    expect(thd(res, "b", 2e-3, 20e-3)).toBeCloseTo(0.08, 3);
  });
});
