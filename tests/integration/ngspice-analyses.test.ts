import { spawnSync } from "node:child_process";
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { afterAll, describe, expect, it } from "vitest";
import {
  at, crossing, cross_freq, f3db, max_gain_db, min_gain_db, noise_density, noise_rms, overshoot, peak_freq, peak_gain_db,
  phase_margin, rise_time, settling_time, slew_rate, slope, tf_gain, tf_rin, tf_rout,
} from "@/checks/measures";
import { simulate, type SimRequest } from "@/checks/spice";

// The dc, noise and tf analyses and the band and step measures, against closed forms and
// against ngspice's own .meas and .noise output for the same circuit.
const cacheDir = fs.mkdtempSync(path.join(os.tmpdir(), "assay-cache-"));
afterAll(() => fs.rmSync(cacheDir, { recursive: true, force: true }));
const run = (circuit: string, analysis: SimRequest["analysis"], params: Record<string, number> = {}) =>
  simulate({ title: "analyses", circuit, params, analysis }, { cacheDir });

/** ngspice's own .meas results for a deck: `name = value` lines of its output (it prints them only without -r). */
function ngspiceMeas(deck: string): Record<string, number> {
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), "assay-meas-"));
  fs.writeFileSync(path.join(dir, "spinit"), "");
  fs.writeFileSync(path.join(dir, "deck.cir"), `meas deck\n${deck}\n.end\n`);
  const r = spawnSync("ngspice", ["-b", "deck.cir"], { cwd: dir, encoding: "utf8", env: { PATH: process.env.PATH, HOME: dir, SPICE_SCRIPTS: dir, NODE_ENV: process.env.NODE_ENV } });
  fs.rmSync(dir, { recursive: true, force: true });
  const log = `${r.stdout}\n${r.stderr}`;
  return Object.fromEntries([...log.matchAll(/^(\w+)\s+=\s+([-+0-9.e]+)/gim)].map((m) => [m[1].toLowerCase(), Number(m[2])]));
}

const k = 1.380649e-23; // Boltzmann constant, SI Brochure (BIPM, 9th ed., 2019)
const T27 = 300.15; // ngspice's default temperature, 27 °C

describe("divider: tf, dc sweep, thermal noise", () => {
  const [R1, R2] = [1e3, 3e3];
  const divider = "V1 in 0 DC 1 AC 1\nR1 in out {R1}\nR2 out 0 {R2}";
  it("tf gives the divider ratio, R1 + R2 and R1 ∥ R2", () => {
    // Voltage divider and Thévenin equivalent (any circuits text, common practice).
    const res = run(divider, { kind: "tf", node: "out", source: "V1" }, { R1, R2 });
    expect(tf_gain(res)).toBeCloseTo(R2 / (R1 + R2), 12);
    expect(tf_rin(res)).toBeCloseTo(R1 + R2, 9);
    expect(tf_rout(res)).toBeCloseTo((R1 * R2) / (R1 + R2), 9);
  });

  it("a source sweep gives value, slope and crossing, as ngspice's .meas dc does", () => {
    const res = run(divider, { kind: "dc", source: "V1", from: 0, to: 5, step: 0.25 }, { R1, R2 });
    expect(at(res, "out", 2.1)).toBeCloseTo(2.1 * 0.75, 12);
    expect(slope(res, "out", 3.3)).toBeCloseTo(0.75, 12);
    expect(crossing(res, "out", 1)).toBeCloseTo(1 / 0.75, 12);
    const meas = ngspiceMeas(`V1 in 0 DC 1\nR1 in out 1k\nR2 out 0 3k\n.dc V1 0 5 0.25\n.meas dc vin1 WHEN v(out)=1`);
    expect(crossing(res, "out", 1) / meas.vin1).toBeCloseTo(1, 5); // ngspice prints 7 digits
  });

  it("a temperature sweep runs in K, written to ngspice in °C", () => {
    // R(T) = R0 (1 + tc1 (T - 27 °C)) (ngspice manual, resistor temperature coefficients).
    const tc1 = 4e-3;
    const res = run(`V1 in 0 DC 1\nR1 in out 1k tc1=${tc1}\nR2 out 0 3k`, { kind: "dc", source: "temp", from: 233.15, to: 398.15, step: 5 });
    expect(res.scale[0]).toBeCloseTo(233.15, 9);
    const vout = (T: number) => 3e3 / (1e3 * (1 + tc1 * (T - T27)) + 3e3);
    expect(at(res, "out", 358.15)).toBeCloseTo(vout(358.15), 9);
    const h = 1e-3;
    expect(slope(res, "out", 298.15) / ((vout(298.15 + h) - vout(298.15 - h)) / (2 * h))).toBeCloseTo(1, 3);
  });

  it("noise density is √(4kT R1∥R2), its rms over the band matches ngspice's integrated total", () => {
    // Johnson–Nyquist thermal noise, v_n = √(4kTR) per √Hz (Nyquist, Phys. Rev. 32, 110, 1928).
    const res = run(divider, { kind: "noise", node: "out", source: "V1", f1: 10, f2: 1e5, perDecade: 10 }, { R1, R2 });
    const Rp = (R1 * R2) / (R1 + R2);
    expect(noise_density(res, "out", 1234) / Math.sqrt(4 * k * T27 * Rp)).toBeCloseTo(1, 5);
    expect(noise_density(res, "in", 1234) / (Math.sqrt(4 * k * T27 * Rp) / 0.75)).toBeCloseTo(1, 5);
    expect(noise_rms(res, "out") / Math.sqrt(4 * k * T27 * Rp * (1e5 - 10))).toBeCloseTo(1, 5);
    expect(noise_rms(res, "out") / res.totals!.onoise_total).toBeCloseTo(1, 6);
    expect(noise_rms(res, "in") / res.totals!.inoise_total).toBeCloseTo(1, 6);
  });

  it("noise rms of a shaped spectrum matches ngspice's own integration", () => {
    // An RC low-pass on the resistor's noise: ngspice integrates its own total; ours is independent.
    const res = run("V1 in 0 DC 0 AC 1\nR1 in out 10k\nC1 out 0 10n", { kind: "noise", node: "out", source: "V1", f1: 1, f2: 1e6, perDecade: 20 });
    expect(noise_rms(res, "out") / res.totals!.onoise_total).toBeCloseTo(1, 3);
    // kT/C noise: the whole band's rms is √(kT/C) (Johnson noise of an RC, common practice); 1 Hz–1 MHz holds nearly all of it.
    expect(noise_rms(res, "out") / Math.sqrt((k * T27) / 10e-9)).toBeCloseTo(1, 2);
  });
});

describe("MFB band-pass: peak, band extremes, edges", () => {
  // Multiple-feedback band-pass with C1 = C2 = C (Op Amps for Everyone, Mancini ed., TI 2002, ch. 16,
  // from memory): f0 = √((R1 + R2)/(R1 R2 R3)) / (2πC), Q = π f0 R3 C, centre gain R3/(2 R1).
  const p = { R1: 10e3, R2: 1e3, R3: 47e3, C: 10e-9 };
  const f0 = Math.sqrt((p.R1 + p.R2) / (p.R1 * p.R2 * p.R3)) / (2 * Math.PI * p.C);
  const Q = Math.PI * f0 * p.R3 * p.C;
  const circuit = ["V1 in 0 AC 1", "R1 in a {R1}", "R2 a 0 {R2}", "C1 a out {C}", "C2 a b {C}", "R3 b out {R3}", "E1 out 0 0 b 1e7"].join("\n");
  const res = run(circuit, { kind: "ac", f1: 100, f2: 100e3, perDecade: 50 }, p);
  it("peak_freq and peak_gain_db match f0 and the centre gain, refined between sweep points", () => {
    expect(peak_freq(res, "out") / f0).toBeCloseTo(1, 3);
    expect(peak_gain_db(res, "out")).toBeCloseTo(20 * Math.log10(p.R3 / (2 * p.R1)), 2);
    // The nearest sample alone is further off: refinement is doing the work.
    const g = res.scale.map((_, i) => 20 * Math.log10(res.vectors.out[i]));
    const sample = res.scale[g.indexOf(Math.max(...g))];
    expect(Math.abs(peak_freq(res, "out") / f0 - 1)).toBeLessThan(Math.abs(sample / f0 - 1));
  });
  it("the -3 dB edges give Q", () => {
    // f3db interpolates linearly between points: a finer sweep for the edges.
    const fine = run(circuit, { kind: "ac", f1: 100, f2: 100e3, perDecade: 400 }, p);
    expect(f0 / (f3db(fine, "out", "upper") - f3db(fine, "out", "lower")) / Q).toBeCloseTo(1, 3);
  });
  it("max and min over a band agree with ngspice's .meas on a dense sweep", () => {
    // ngspice's .meas reads vdb() only of a vector named in .save.
    const deck = `${circuit.replace("{R1}", "10k").replace("{R2}", "1k").replace(/\{C\}/g, "10n").replace("{R3}", "47k")}\n.save v(out)\n.ac dec 2000 100 100k\n.meas ac gmax MAX vdb(out) FROM=500 TO=5k\n.meas ac gmin MIN vdb(out) FROM=500 TO=5k\n.meas ac fx WHEN vdb(out)=0 CROSS=1`;
    const meas = ngspiceMeas(deck);
    expect(max_gain_db(res, "out", 500, 5e3)).toBeCloseTo(meas.gmax, 2);
    expect(min_gain_db(res, "out", 500, 5e3)).toBeCloseTo(meas.gmin, 2);
    expect(cross_freq(res, "out", 0) / meas.fx).toBeCloseTo(1, 2);
  });
});

describe("ladder filters: passband ripple and stopband attenuation", () => {
  // Doubly terminated LC ladders (1 ohm, 1 rad/s prototypes scaled to 1 kohm and 1 kHz). Element values
  // from Zverev, Handbook of Filter Synthesis (1967), from memory: Butterworth n = 3: 1, 2, 1;
  // Chebyshev 0.5 dB n = 3: 1.5963, 1.0967, 1.5963.
  const ladder = (g: number[]) => {
    const [R, w] = [1e3, 2 * Math.PI * 1e3];
    return ["V1 in 0 AC 2", `Rs in a ${R}`, `C1 a 0 ${g[0] / (R * w)}`, `L2 a b ${(g[1] * R) / w}`, `C3 b 0 ${g[2] / (R * w)}`, `RL b 0 ${R}`].join("\n");
  };
  it("Butterworth: 3.01 dB across the passband, 10 log10(1 + 2^6) down at 2 fc", () => {
    // |H|² = 1/(1 + (f/fc)^2n) (Butterworth, Wireless Engineer 7, 1930).
    const res = run(ladder([1, 2, 1]), { kind: "ac", f1: 10, f2: 10e3, perDecade: 40 });
    expect(max_gain_db(res, "b", 10, 1e3) - min_gain_db(res, "b", 10, 1e3)).toBeCloseTo(10 * Math.log10(2), 2);
    expect(peak_gain_db(res, "b") - min_gain_db(res, "b", 2e3, 2e3 * 1.0001)).toBeCloseTo(10 * Math.log10(1 + 2 ** 6), 2);
  });
  it("Chebyshev 0.5 dB: ripple 0.5 dB, attenuation 10 log10(1 + ε² T3(2)²) at 2 fc", () => {
    // |H|² = 1/(1 + ε² T_n²(f/fc)), ε² = 10^(ripple/10) - 1, T3(x) = 4x³ - 3x (any filter text, common practice).
    const res = run(ladder([1.5963, 1.0967, 1.5963]), { kind: "ac", f1: 10, f2: 10e3, perDecade: 200 });
    const eps2 = 10 ** 0.05 - 1;
    expect(max_gain_db(res, "b", 10, 1e3) - min_gain_db(res, "b", 10, 1e3)).toBeCloseTo(0.5, 2);
    expect(peak_gain_db(res, "b") - max_gain_db(res, "b", 2e3, 10e3)).toBeCloseTo(10 * Math.log10(1 + eps2 * 26 ** 2), 1);
  });
});

describe("non-inverting amplifier on the one-pole op-amp model", () => {
  // Closed-loop bandwidth GBW/(1 + R2/R1) for a one-pole op-amp (Sedra & Smith, Microelectronic
  // Circuits, 7th ed., §2.9, from memory); a one-pole loop has 90° of phase margin.
  const amp = (loop: boolean) =>
    [".include opamp-1pole.lib", "V1 in 0 AC 1", loop ? "X1 0 fb out OA1P" : "X1 in n out OA1P", loop ? "Vfb fb nn AC 0" : "", "Rf out n 10k", "Rg n 0 1k"]
      .concat(loop ? ["Bret nn 0 V=0", "Etst fb 0 n 0 -1"] : [])
      .join("\n");
  it("closed-loop bandwidth is GBW/11", () => {
    const res = run(amp(false), { kind: "ac", f1: 10, f2: 10e6, perDecade: 40 });
    expect(f3db(res, "out") / (1e6 / 11)).toBeCloseTo(1, 2);
    expect(cross_freq(res, "out", 20 * Math.log10(11) - 3.0103) / (1e6 / 11)).toBeCloseTo(1, 2);
  });
  it("the loop gain crosses 0 dB at GBW β with 90° of phase margin", () => {
    // Loop gain of an ideal-divider feedback: T = A(f) β, β = 1/11; a single pole leaves PM = 90°.
    const open = run(".include opamp-1pole.lib\nV1 in 0 AC 1\nX1 in 0 o OA1P\nE1 t 0 o 0 {1/11}", { kind: "ac", f1: 10, f2: 10e6, perDecade: 40 });
    expect(cross_freq(open, "t", 0) / (1e6 / 11)).toBeCloseTo(1, 2);
    expect(phase_margin(open, "t")).toBeCloseTo(90, 0);
  });
});

describe("step responses", () => {
  it("first-order: 10–90 % rise in τ ln 9 ≈ 2.2 τ, as ngspice's .meas trig/targ", () => {
    // RC step response v = 1 - e^{-t/τ}: 10 % to 90 % takes τ ln 9 (any circuits text, common practice).
    const tau = 1e3 * 100e-9;
    const circuit = "V1 in 0 PULSE(0 1 0 1n 1n 1 2)\nR1 in out 1k\nC1 out 0 100n";
    const res = run(circuit, { kind: "tran", stop: 1e-3, step: 1e-7 });
    expect(rise_time(res, "out") / (tau * Math.log(9))).toBeCloseTo(1, 3);
    const meas = ngspiceMeas(`${circuit}\n.tran 0.1u 1m\n.meas tran tr TRIG v(out) VAL=0.1 RISE=1 TARG v(out) VAL=0.9 RISE=1`);
    expect(rise_time(res, "out") / meas.tr).toBeCloseTo(1, 3);
    expect(overshoot(res, "out")).toBe(0);
    // Within 2 % after τ ln 50 (common practice: about 4 τ).
    expect(settling_time(res, "out", 0.02) / (tau * Math.log(50))).toBeCloseTo(1, 2);
    expect(slew_rate(res, "out") / (1 / tau)).toBeCloseTo(1, 1);
  });
  it("second-order: overshoot exp(-πζ/√(1-ζ²))", () => {
    // Series RLC, ζ = (R/2)√(C/L) (Ogata, Modern Control Engineering, 5th ed., §5-3, from memory).
    const [R, L, C] = [100, 10e-3, 100e-9];
    const zeta = (R / 2) * Math.sqrt(C / L);
    const res = run(`V1 in 0 PULSE(0 1 0 1n 1n 1 2)\nR1 in a ${R}\nL1 a out ${L}\nC1 out 0 ${C}`, { kind: "tran", stop: 5e-3, step: 5e-8 });
    expect(overshoot(res, "out")).toBeCloseTo(Math.exp((-Math.PI * zeta) / Math.sqrt(1 - zeta ** 2)), 3);
    const meas = ngspiceMeas(`V1 in 0 PULSE(0 1 0 1n 1n 1 2)\nR1 in a ${R}\nL1 a out ${L}\nC1 out 0 ${C}\n.tran 50n 5m\n.meas tran vmax MAX v(out)`);
    expect(1 + overshoot(res, "out")).toBeCloseTo(meas.vmax / at(res, "out", 5e-3), 4);
  });
});
