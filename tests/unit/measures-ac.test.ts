import { describe, expect, it } from "vitest";
import { f3db, gain_db, i, MeasureError, phase, v, waveformFor } from "@/checks/measures";
import type { SimResult } from "@/checks/spice";

// An AC result from a transfer function H(jω) on a log sweep, as ngspice writes `.ac dec`.
function ac(h: (f: number) => [number, number], f1: number, f2: number, perDecade: number): SimResult {
  const n = Math.round(Math.log10(f2 / f1) * perDecade) + 1;
  const f = Float64Array.from({ length: n }, (_, k) => f1 * 10 ** (k / perDecade));
  const re = f.map((x) => h(x)[0]);
  const im = f.map((x) => h(x)[1]);
  const mag = re.map((r, k) => Math.hypot(r, im[k]));
  return { analysis: "ac", scale: f, vectors: { out: mag, "v(out)": mag }, complex: { out: { re, im }, "v(out)": { re, im } }, points: n, ms: 0, cached: false };
}

// First-order low-pass H = 1 / (1 + j f/fc).
const rc = (fc: number) => (f: number): [number, number] => {
  const x = f / fc;
  return [1 / (1 + x * x), -x / (1 + x * x)];
};

describe("AC measures on a one-pole response", () => {
  const fc = 2192.2;
  const res = ac(rc(fc), 10, 1e6, 50);
  it("f3db is the pole frequency", () => {
    // Closed form: |H| = 1/√2 at f = fc for H = 1/(1 + j f/fc) (any circuits textbook).
    expect(Math.abs(f3db(res, "out") / fc - 1)).toBeLessThan(1e-3);
  });
  it("gain and phase at fc are -3.01 dB and -45°", () => {
    expect(gain_db(res, "out", fc)).toBeCloseTo(-3.0103, 2);
    expect(phase(res, "out", fc)).toBeCloseTo(-45, 1);
  });
  it("a decade above fc the gain is about -20 dB", () => {
    // One pole rolls off at 20 dB/decade: |H(10 fc)| = -10 log10(101) = -20.04 dB.
    expect(gain_db(res, "out", 10 * fc)).toBeCloseTo(-10 * Math.log10(101), 2);
  });
  it("refuses a frequency outside the sweep and a tran-only measure", () => {
    expect(() => gain_db(res, "out", 5)).toThrow(/outside the sweep/);
    expect(() => v(res, "out")).toThrow(MeasureError);
  });
});

describe("phase unwrapping", () => {
  it("follows a three-pole response past -180°", () => {
    // H = 1/(1 + j f/fp)^3 has phase -3 atan(f/fp): -270° far above fp, never wrapped to +90°.
    const fp = 1e3;
    const res = ac((f) => {
      const [a, b] = rc(fp)(f);
      const r2 = a * a - b * b, i2 = 2 * a * b;
      return [r2 * a - i2 * b, r2 * b + i2 * a];
    }, 10, 1e6, 40);
    expect(phase(res, "out", 1e5)).toBeCloseTo(-3 * (Math.atan(100) * 180) / Math.PI, 1);
  });
});

describe("f3db when the gain never falls", () => {
  it("is an error naming the sweep end", () => {
    const res = ac(() => [1, 0], 10, 1e3, 10);
    expect(() => f3db(res, "out")).toThrow(/does not fall 3 dB/);
  });
});

describe("operating point", () => {
  const res: SimResult = {
    analysis: "op", scale: new Float64Array(0), points: 1, ms: 0, cached: false,
    vectors: { out: Float64Array.of(2.5), "v(out)": Float64Array.of(2.5), "i(v1)": Float64Array.of(-1e-3) },
  };
  it("reads node voltages and source currents", () => {
    expect(v(res, "OUT")).toBe(2.5);
    expect(i(res, "V1")).toBe(-1e-3);
    expect(() => i(res, "V2")).toThrow(/writes currents of: v1/);
  });
});

describe("waveformFor()", () => {
  it("keeps at most 2000 points and the peaks of the first series", () => {
    const n = 100001;
    const t = Float64Array.from({ length: n }, (_, k) => (k / (n - 1)) * 0.01);
    const out = t.map((x) => Math.sin(2 * Math.PI * 1000 * x));
    const res: SimResult = { analysis: "tran", scale: t, vectors: { out, in: out.map((x) => x / 2) }, points: n, ms: 0, cached: false };
    const w = waveformFor(res, ["out", "in"], [{ node: "out", from: 5e-3, to: 1e-2, measure: "thd" }]);
    expect(w.x.length).toBeLessThanOrEqual(2000);
    expect(w.series[1].values.length).toBe(w.x.length);
    expect(Math.max(...w.series[0].values)).toBeCloseTo(1, 6);
    expect(w.x[0]).toBe(0);
    expect(w.x[w.x.length - 1]).toBe(0.01);
    expect(w.windows).toHaveLength(1);
  });
  it("marks the -3 dB point of an AC sweep and gives phase in degrees", () => {
    const w = waveformFor(ac(rc(1e3), 10, 1e5, 20), ["out"]);
    expect(w.analysis).toBe("ac");
    expect(Math.abs(w.marks[0].x / 1e3 - 1)).toBeLessThan(2e-3);
    expect(w.series[0].phase?.[0]).toBeCloseTo(-0.573, 2);
  });
});
