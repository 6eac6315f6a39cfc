import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { afterAll, describe, expect, it } from "vitest";
import { f3db, gain_db, phase } from "@/checks/measures";
import { simulate, type SimRequest } from "@/checks/spice";

const cacheDir = fs.mkdtempSync(path.join(os.tmpdir(), "assay-cache-"));
afterAll(() => fs.rmSync(cacheDir, { recursive: true, force: true }));
const run = (req: SimRequest) => simulate(req, { cacheDir });

describe("first-order RC high-pass in ngspice", () => {
  const R = 100e3;
  const C = 1e-6;
  // Closed form: H = jωRC/(1 + jωRC), |H| = 1/√2 and phase +45° at fc = 1/(2πRC)
  // (Horowitz & Hill, The Art of Electronics, 3rd ed., ch. 1, RC filters, from memory).
  const fc = 1 / (2 * Math.PI * R * C);
  const res = run({
    title: "rc high-pass", params: { R, C }, analysis: { kind: "ac", f1: 0.01, f2: 1e3, perDecade: 100 },
    circuit: "V1 in 0 AC 1\nC1 in out {C}\nR1 out 0 {R}",
  });
  it("f3db reads the corner from the passband at the top of the sweep", () => {
    expect(Math.abs(f3db(res, "out") / fc - 1)).toBeLessThan(1e-3);
  });
  it("gain -3.01 dB and phase +45° at fc", () => {
    expect(gain_db(res, "out", fc)).toBeCloseTo(-3.0103, 2);
    expect(phase(res, "out", fc)).toBeCloseTo(45, 1);
  });
});

describe("series RLC band-pass in ngspice", () => {
  // Output across R: f0 = 1/(2π√(LC)), Q = (1/R)√(L/C), edges f0(√(1 + 1/4Q²) ∓ 1/2Q)
  // (Sedra & Smith, Microelectronic Circuits, 7th ed., second-order filter functions, from memory).
  const p = { R: 100, L: 10e-3, C: 2.533e-6 };
  const f0 = 1 / (2 * Math.PI * Math.sqrt(p.L * p.C));
  const Q = Math.sqrt(p.L / p.C) / p.R;
  const res = run({
    title: "rlc band-pass", params: p, analysis: { kind: "ac", f1: 10, f2: 1e5, perDecade: 200 },
    circuit: "V1 in 0 AC 1\nL1 in a {L}\nC1 a out {C}\nR1 out 0 {R}",
  });
  it("has two edges, asked for by name", () => {
    const root = Math.sqrt(1 + 1 / (4 * Q * Q));
    expect(() => f3db(res, "out")).toThrow(/band-pass/);
    expect(Math.abs(f3db(res, "out", "lower") / (f0 * (root - 1 / (2 * Q))) - 1)).toBeLessThan(2e-3);
    expect(Math.abs(f3db(res, "out", "upper") / (f0 * (root + 1 / (2 * Q))) - 1)).toBeLessThan(2e-3);
  });
});
