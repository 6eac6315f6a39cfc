import { describe, expect, it } from "vitest";
import { at, avg, freq, MeasureError, NothingToMeasure, peak, pp, rms, startup, thd, trough } from "@/checks/measures";
import type { SimResult } from "@/checks/spice";

// A transient result built from a formula on an uneven time grid, as ngspice's adaptive steps are.
function tran(stop: number, points: number, f: (t: number) => number, node = "out"): SimResult {
  const t = new Float64Array(points);
  for (let k = 1; k < points; k++) t[k] = stop * (k / (points - 1) + 0.3 * Math.sin((7 * k) / points) / points);
  t[points - 1] = stop;
  const v = t.map(f);
  return { analysis: "tran", scale: t, vectors: { [node]: v, [`v(${node})`]: v }, points, ms: 0, cached: false };
}

const sine = (A: number, f0: number, phase = 0) => (t: number) => A * Math.sin(2 * Math.PI * f0 * t + phase);

describe("window measures of a sine", () => {
  const res = tran(10e-3, 20001, (t) => 0.5 + sine(2, 1e3)(t));
  it("peak, trough, pp and avg", () => {
    // Closed form: 0.5 + 2 sin(ωt) spans 0.5 ± 2 and averages 0.5 over whole periods.
    expect(peak(res, "out", 0, 10e-3)).toBeCloseTo(2.5, 4);
    expect(trough(res, "out", 0, 10e-3)).toBeCloseTo(-1.5, 4);
    expect(pp(res, "out")).toBeCloseTo(4, 4);
    expect(avg(res, "out", 2e-3, 7e-3)).toBeCloseTo(0.5, 5);
  });
  it("rms of a sine with offset is sqrt(dc² + A²/2)", () => {
    // Textbook definition of RMS: sqrt(0.25 + 2) for 0.5 V dc plus a 2 V-peak sine.
    expect(rms(res, "out", 0, 10e-3)).toBeCloseTo(Math.sqrt(0.25 + 2), 5);
  });
  it("at() interpolates, and refuses times outside the run", () => {
    expect(at(res, "out", 0.25e-3)).toBeCloseTo(2.5, 4);
    expect(() => at(res, "out", 11e-3)).toThrow(MeasureError);
  });
  it("names the nodes it has when asked for one it lacks", () => {
    expect(() => peak(res, "outp")).toThrow(/no node "outp".*out/);
  });
  it("refuses a window outside the simulation", () => {
    expect(() => rms(res, "out", 5e-3, 20e-3)).toThrow(/outside the simulated/);
  });
});

describe("freq()", () => {
  it("finds the frequency of a generated sine", () => {
    // A 1234.5 Hz sine: the mean-crossing count over whole cycles gives its frequency.
    const res = tran(20e-3, 40001, (t) => 1 + sine(0.3, 1234.5, 0.7)(t));
    expect(Math.abs(freq(res, "out", 1e-3, 20e-3) / 1234.5 - 1)).toBeLessThan(1e-5);
  });
  it("ignores ripple near the mean (hysteresis)", () => {
    // 1 kHz square-ish wave with 40 kHz ripple riding on it: still 1 kHz.
    const res = tran(10e-3, 100001, (t) => Math.tanh(20 * Math.sin(2 * Math.PI * 1e3 * t)) + 0.01 * Math.sin(2 * Math.PI * 4e4 * t));
    expect(Math.abs(freq(res, "out") / 1e3 - 1)).toBeLessThan(1e-3);
  });
  it("refuses a window with less than a cycle", () => {
    const res = tran(10e-3, 10001, sine(1, 1e3));
    expect(() => freq(res, "out", 0, 0.9e-3)).toThrow(/does not complete a cycle/);
  });
});

describe("thd()", () => {
  it("is about zero for a pure sine", () => {
    // THD = RMS of the harmonics over the fundamental (common practice): a sine has none.
    const res = tran(20e-3, 40001, sine(1, 1e3, 0.3));
    expect(thd(res, "out", 2e-3, 20e-3)).toBeLessThan(1e-4);
  });
  it("equals the ratio of an added 3rd harmonic", () => {
    // sin(ωt) + 0.05 sin(3ωt + φ): THD = 0.05 by the definition.
    const res = tran(20e-3, 40001, (t) => sine(2, 1e3)(t) + sine(0.1, 3e3, 1.1)(t));
    expect(thd(res, "out", 1e-3, 20e-3)).toBeCloseTo(0.05, 4);
  });
  it("sums harmonics in quadrature", () => {
    // 3 % 2nd and 4 % 5th: sqrt(0.03² + 0.04²) = 0.05.
    const res = tran(20e-3, 40001, (t) => sine(1, 500)(t) + sine(0.03, 1000)(t) + sine(0.04, 2500, 0.4)(t));
    expect(thd(res, "out")).toBeCloseTo(0.05, 4);
  });
});

describe("startup()", () => {
  it("is the first time |v| reaches the level", () => {
    // Envelope 1 - e^{-t/τ} under a 10 kHz carrier: |v| first reaches 0.5 near its first crest after the envelope does.
    const res = tran(5e-3, 50001, (t) => -(1 - Math.exp(-t / 1e-3)) * Math.cos(2 * Math.PI * 1e4 * t));
    const t = startup(res, "out", 0.5);
    const envelope = -1e-3 * Math.log(0.5);
    expect(t).toBeGreaterThanOrEqual(envelope);
    expect(t).toBeLessThan(envelope + 0.5e-4);
  });
  it("refuses a level that is never reached instead of giving a time", () => {
    expect(() => startup(tran(1e-3, 101, sine(0.1, 1e3)), "out", 1)).toThrow(NothingToMeasure);
    expect(() => startup(tran(1e-3, 101, sine(0.1, 1e3)), "out", 1)).toThrow(/never reaches 1 V within 0.001 s/);
  });
});

describe("a dead window", () => {
  // A kick that decays to nothing: e^{-t/0.2 ms}, then the solver's residue alternating step to step.
  const residue = (t: number) => (t < 5e-3 ? 0.1 * Math.exp(-t / 2e-4) * Math.cos(2 * Math.PI * 1e3 * t) : 2.5e-19 * Math.cos(Math.PI * Math.round(t / 5e-6)));
  const res = tran(10e-3, 2001, residue);
  it("freq and thd refuse a window of numerical noise", () => {
    expect(() => freq(res, "out", 6e-3, 10e-3)).toThrow(NothingToMeasure);
    expect(() => freq(res, "out", 6e-3, 10e-3)).toThrow(/does not oscillate .* numerical noise/);
    expect(() => thd(res, "out", 6e-3, 10e-3)).toThrow(NothingToMeasure);
  });
  it("freq refuses a flat window and one that alternates every step", () => {
    expect(() => freq(tran(1e-3, 101, () => 1.5), "out")).toThrow(NothingToMeasure);
    // A 1e-3 V signal flipping sign every sample: two steps a cycle, the solver rather than a waveform.
    const flip = tran(1e-3, 1001, (t) => 1e-3 * Math.sign(Math.sin(Math.PI * t * 1e6 + 0.5)));
    expect(() => freq(flip, "out")).toThrow(NothingToMeasure);
  });
  it("freq still measures a small ringing well above the floor", () => {
    // 25 µV of a 1 kHz ring beside a 0.35 V start (a decaying Wien bridge): a real waveform.
    const ring = tran(10e-3, 20001, (t) => (t < 1e-4 ? 0.35 : 25e-6 * Math.sin(2 * Math.PI * 1e3 * t)));
    expect(freq(ring, "out", 2e-3, 10e-3)).toBeCloseTo(1e3, 0);
  });
});
