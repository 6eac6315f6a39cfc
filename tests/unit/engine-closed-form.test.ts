import { readFileSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { previewBlock, withParams } from "@/checks";
import { evaluateBlock } from "@/checks/engine/evaluate-block";

// Textbook closed forms, each evaluated through a check script in tests/unit/fixtures.
const fixture = (name: string) => readFileSync(path.join(__dirname, "fixtures", `${name}.md`), "utf8");
const run = (text: string) => evaluateBlock(text).report;

describe("closed-form results through check scripts", () => {
  it("RC phase-shift oscillator: f = 1/(2πRC√6) and a needed gain of 29", () => {
    // J. Millman, C. C. Halkias, Integrated Electronics (1972), sinusoidal oscillators,
    // the RC phase-shift oscillator (from memory): f = 1/(2πRC√6), |A| ≥ 29.
    const r = run(fixture("closed-phase-shift"));
    expect(r.status).toBe("verified");
    expect(r.quantities.f0.value).toBeCloseTo(1 / (2 * Math.PI * 10e3 * 10e-9 * Math.sqrt(6)), 9);
    expect(r.quantities.f0.text).toBe("649.7 Hz");
    expect(r.quantities.A_needed.value).toBeCloseTo(29, 9);
    // Rf/R = 29.5 passes at nominal but not at R +1%, Rf -1% (29.5 × 0.99 / 1.01 = 28.9).
    const weak = run(withParams(fixture("closed-phase-shift"), { Rf: "295 kohm" }));
    const c = weak.checks.find((k) => k.label.startsWith("stage gain"))!;
    expect(c.status).toBe("fail");
    expect(c.worst!.corner).toMatchObject({ R: "+1%", Rf: "-1%" });
    expect(weak.status).toBe("failing");
  });

  it("op-amp astable: T = 2RC·ln((1+β)/(1−β))", () => {
    // A. S. Sedra, K. C. Smith, Microelectronic Circuits, the op-amp astable multivibrator
    // (from memory): T = 2τ ln((1+β)/(1−β)), β = R2/(R1+R2); with R1 = R2, T = 2RC ln 3.
    const r = run(fixture("closed-astable"));
    expect(r.errors).toEqual([]);
    expect(r.status).toBe("verified");
    expect(r.quantities.beta.value).toBe(0.5);
    expect(r.quantities.T.unit).toBe("s");
    expect(r.quantities.T.value).toBeCloseTo(2 * 10e3 * 100e-9 * Math.log(3), 12);
    expect(r.quantities.T.text).toBe("2.197 ms");
    expect(r.quantities.f.value).toBeCloseTo(1 / (2e-3 * Math.log(3)), 6);
  });

  it("Wien (RC bridge) network: f0 = 1/(2πRC), passes 1/3 in phase, needs a gain of 3", () => {
    // P. Horowitz, W. Hill, The Art of Electronics, 2nd ed., §5.17 Wien-bridge oscillator
    // (from memory): f0 = 1/(2πRC), the network passes 1/3 at f0, so the amplifier needs 3.
    const r = run(fixture("closed-wien"));
    expect(r.status).toBe("verified");
    expect(r.quantities.f0.value).toBeCloseTo(1 / (2 * Math.PI * 15.8e3 * 10e-9), 9);
    expect(r.checks.map((c) => c.status)).toEqual(["pass", "pass", "pass", "pass"]);
    // A gain of exactly 3 at nominal fails "above 3"; of the 4 Rf/Rg corners (×4 for R, C)
    // only Rf +1% with Rg -1% lifts it above 3, so 12 of 16 corners fail.
    const flat = run(withParams(fixture("closed-wien"), { Rf: "20 kohm" }));
    expect(flat.checks[2]).toMatchObject({
      status: "fail",
      detail: "A = 3 > 3 ✗; fails at nominal and at 12 of 16 tolerance corners",
      worst: { corner: { Rf: "-1%", Rg: "+1%" } },
    });
  });

  it("Sallen-Key unity-gain low-pass: f0 = 1/(2π√(R1R2C1C2)), Q = √(R1R2C1C2)/(C2(R1+R2))", () => {
    // R. P. Sallen, E. L. Key, "A Practical Method of Designing RC Active Filters",
    // IRE Trans. Circuit Theory CT-2 (1955) (from memory); equal R with C1 = 2 C2 gives Q = 1/√2.
    const r = run(fixture("closed-sallen-key"));
    expect(r.status).toBe("verified");
    expect(r.quantities.f0.value).toBeCloseTo(1 / (2 * Math.PI * Math.sqrt(10e3 * 10e3 * 22e-9 * 11e-9)), 9);
    expect(r.quantities.Q.value).toBeCloseTo(Math.SQRT1_2, 12);
    // Nodal analysis of the circuit (not the formula) gives |H(jω0)| = Q.
    expect(r.quantities.gain_f0.value).toBeCloseTo(Math.SQRT1_2, 9);
    const c = r.checks[1];
    expect(c.detail).toBe("Q = 0.7071 > 0.65 ✓ and 0.7071 < 0.76 ✓");
    expect(c.corners).toMatchObject({ quantity: "Q", unit: "", limits: [0.65, 0.76] });
    expect(c.corners!.values).toHaveLength(16);
  });

  it("gives the same report through the sandboxed preview", async () => {
    const text = fixture("closed-sallen-key");
    expect(await previewBlock(text)).toEqual(run(text));
  });
});
