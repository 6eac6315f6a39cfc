import { describe, expect, it } from "vitest";
import { f3db, waveformFor } from "@/checks/measures";
import type { SimResult } from "@/checks/spice";

// An AC result from a transfer function H(jω) on a log sweep, as ngspice writes `.ac dec`.
function ac(h: (f: number) => [number, number], f1: number, f2: number, perDecade: number): SimResult {
  const n = Math.round(Math.log10(f2 / f1) * perDecade) + 1;
  const f = Float64Array.from({ length: n }, (_, k) => f1 * 10 ** (k / perDecade));
  const re = f.map((x) => h(x)[0]);
  const im = f.map((x) => h(x)[1]);
  const mag = re.map((r, k) => Math.hypot(r, im[k]));
  return { analysis: "ac", scale: f, vectors: { out: mag }, complex: { out: { re, im } }, points: n, ms: 0, cached: false };
}
const div = ([a, b]: [number, number], [c, d]: [number, number]): [number, number] => {
  const m = c * c + d * d;
  return [(a * c + b * d) / m, (b * c - a * d) / m];
};
const near = (x: number, y: number, rel: number) => expect(Math.abs(x / y - 1)).toBeLessThan(rel);

// Second-order sections with s = j f/f0 (normalised), Sedra & Smith, Microelectronic Circuits,
// 7th ed., chapter on filters, second-order filter functions (from memory):
// band-pass H = (s/Q) / (s² + s/Q + 1), notch H = (s² + 1) / (s² + s/Q + 1), low-pass H = 1 / (s² + s/Q + 1).
const den = (x: number, q: number): [number, number] => [1 - x * x, x / q];

describe("f3db on first-order responses", () => {
  it("a high-pass reads its corner from the top of the sweep", () => {
    // H = j(f/fc) / (1 + j f/fc): |H| = 1/√2 at f = fc = 1/(2πRC) (Horowitz & Hill, The Art of
    // Electronics, 3rd ed., ch. 1, RC filters, from memory).
    const fc = 1.59;
    const res = ac((f) => div([0, f / fc], [1, f / fc]), 0.01, 1e3, 50);
    near(f3db(res, "out"), fc, 1e-3);
  });
  it("a low-pass keeps the low-frequency reference", () => {
    const fc = 2192.2;
    const res = ac((f) => div([1, 0], [1, f / fc]), 10, 1e6, 50);
    near(f3db(res, "out"), fc, 1e-3);
  });
});

describe("f3db on second-order responses", () => {
  it("a band-pass asks for an edge; its edges are f0(√(1 + 1/4Q²) ∓ 1/2Q)", () => {
    const q = 2;
    const f0 = 1e3;
    const res = ac((f) => div([0, f / f0 / q], den(f / f0, q)), 10, 1e5, 100);
    expect(() => f3db(res, "out")).toThrow(/band-pass.*"lower"\) or "upper"/);
    const root = Math.sqrt(1 + 1 / (4 * q * q));
    near(f3db(res, "out", "lower"), f0 * (root - 1 / (2 * q)), 2e-3);
    near(f3db(res, "out", "upper"), f0 * (root + 1 / (2 * q)), 2e-3);
    // Edges multiply to f0² and differ by f0/Q (same source).
    near(f3db(res, "out", "upper") - f3db(res, "out", "lower"), f0 / q, 5e-3);
    expect(waveformFor(res, ["out"]).marks.map((m) => Math.round(m.x))).toEqual([
      Math.round(f3db(res, "out", "lower")), Math.round(f3db(res, "out", "upper")),
    ]);
  });
  it("a notch gives the lower stop-band edge from the low end and the upper one with edge", () => {
    // |H| = 1/√2 where |1 - x²| = x/Q: x = √(1 + 1/4Q²) ∓ 1/2Q, the band-pass edges again.
    const q = 1;
    const f0 = 1e3;
    const res = ac((f) => div([1 - (f / f0) ** 2, 0], den(f / f0, q)), 10, 1e5, 100);
    const root = Math.sqrt(1 + 1 / (4 * q * q));
    near(f3db(res, "out"), f0 * (root - 1 / (2 * q)), 2e-3);
    near(f3db(res, "out", "upper"), f0 * (root - 1 / (2 * q)), 2e-3); // from the maximum at the low end
  });
  it("a Butterworth low-pass (Q = 1/√2) keeps f3db = f0; a peaking one is read from DC", () => {
    const f0 = 1e3;
    near(f3db(ac((f) => div([1, 0], den(f / f0, Math.SQRT1_2)), 10, 1e5, 100), "out"), f0, 2e-3);
    // Q = 1: |H|² = 1/2 at x⁴ - x² - 1 = 0, x = √((1 + √5)/2) (derived from the same H).
    const peaked = ac((f) => div([1, 0], den(f / f0, 1)), 10, 1e5, 100);
    near(f3db(peaked, "out"), f0 * Math.sqrt((1 + Math.sqrt(5)) / 2), 2e-3);
  });
  it("refuses an unknown edge", () => {
    const res = ac((f) => div([1, 0], [1, f / 1e3]), 10, 1e5, 20);
    expect(() => f3db(res, "out", "middle" as never)).toThrow(/"lower" or "upper"/);
  });
});
