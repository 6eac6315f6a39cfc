import { mkdtempSync, readFileSync, rmSync } from "node:fs";
import os from "node:os";
import path from "node:path";
import { afterAll, describe, expect, it } from "vitest";
import { localExecutor, verifyBlock, type SimExecutor } from "@/checks";

// Real ngspice through the sandbox child: tolerance corners, Monte Carlo and sweeps.
const cacheDir = mkdtempSync(path.join(os.tmpdir(), "assay-tol-"));
afterAll(() => rmSync(cacheDir, { recursive: true, force: true }));
const verify = (text: string, extra: Parameters<typeof verifyBlock>[1] = {}) => verifyBlock(text, { cacheDir, timeoutMs: 240_000, ...extra });

const block = (params: string, spice: string, script: string) =>
  `---\nslug: tol-test\ntitle: tolerance test\ncategory: other\nsummary: test\nparams:\n${params}---\n\`\`\`spice\n${spice}\`\`\`\n\`\`\`check\n${script}\`\`\`\n`;

// A linear Wien-bridge oscillator (no amplitude control) with its two arms as separate parts.
// It starts when the amplifier gain 1 + Rf/Rg exceeds 1 + Rs/Rp + Cp/Cs (the Wien bridge's
// balance condition; Sedra & Smith, Microelectronic Circuits, Wien-bridge oscillator, from memory).
// Nominal: 3.09 against 3, a loop gain of 1.03. At Rs +1 %, Rp -1 %, Cs -5 %, Cp +5 %, Rf -1 %,
// Rg +1 % it needs 3.126 and has 3.049, so there it does not start.
const wien = block(
  `  - { name: Rs, value: 15.8 kohm, tol: 1% }
  - { name: Rp, value: 15.8 kohm, tol: 1% }
  - { name: Cs, value: 10 nF, tol: 5% }
  - { name: Cp, value: 10 nF, tol: 5% }
  - { name: Rg, value: 10 kohm, tol: 1% }
  - { name: Rf, value: 20.9 kohm, tol: 1% }
`,
  `.include opamp-1pole.lib
X1 p n out OA1P
R1 out a {Rs}
C1 a p {Cs}
R2 p 0 {Rp}
C2 p 0 {Cp}
R3 n 0 {Rg}
R4 n out {Rf}
.ic v(p)=10m
`,
  `res = tran(20 ms, 5 us)
swing = pp(res, "out", 17 ms, 20 ms)
check("the oscillation grows from the kick", swing > 0.2 V)
`,
);

describe("simulated checks over tolerances", () => {
  it("fails an oscillator that starts at nominal but not at its worst corner, naming the corner", async () => {
    const { report, waveforms } = await verify(wien);
    expect(report.errors).toEqual([]);
    expect(report.status).toBe("failing");
    const c = report.checks[0];
    expect(c).toMatchObject({ status: "fail", over: "worst-case" });
    expect(c.detail).toMatch(/^swing = \d+(\.\d+)? V > 200 mV ✓; fails at 1 of 7 evaluated corners$/);
    expect(c.worst!.corner).toEqual({ Rs: "+1%", Rp: "-1%", Cs: "-5%", Cp: "+5%", Rg: "+1%", Rf: "-1%" });
    expect(c.worst!.detail).toMatch(/^swing = \d+(\.\d+)? mV > 200 mV ✗$/);
    // Nominal, one +tol run per parameter, then the predicted worst corner: 8 simulations.
    expect(c.simulations).toBe(8);
    expect(report.quantities.swing).toMatchObject({ simulated: true, spread: { over: "worst-case" } });
    expect(report.quantities.swing.spread!.min).toBeLessThan(0.2);
    // The worst corner's waveform is stored beside the nominal one.
    expect(waveforms.map((w) => w.variant)).toEqual(["nominal", "worst"]);
    expect(waveforms[1].corner).toEqual(c.worst!.corner);
  }, 240_000);

  it("fails an RC low-pass whose simulated corner frequency leaves the spec at a tolerance corner", async () => {
    // fc = 1/(2πRC) (first-order RC, Horowitz & Hill, The Art of Electronics, 3rd ed., §1.7, from memory):
    // 1.592 kHz at nominal, 1.786 kHz at R -1 %, C -10 %, past the 1.7 kHz limit.
    const text = block(
      "  - { name: R, value: 10 kohm, tol: 1% }\n  - { name: C, value: 10 nF, tol: 10% }\n",
      "V1 in 0 AC 1\nR1 in out {R}\nC1 out 0 {C}\n",
      'res = ac(10 Hz, 1 MHz, 100)\nf3 = f3db(res, "out")\ncheck("simulated corner below 1.7 kHz", f3 < 1.7 kHz)\n',
    );
    const { report } = await verify(text);
    const c = report.checks[0];
    expect(c).toMatchObject({ status: "fail", over: "corners", simulations: 5 });
    expect(c.detail).toMatch(/^f3 = 1\.59\d? kHz < 1\.7 kHz ✓; fails at 2 of 4 tolerance corners$/);
    expect(c.worst!.corner).toEqual({ R: "-1%", C: "-10%" });
    const fc = (r: number, cap: number) => 1 / (2 * Math.PI * r * cap);
    const spread = report.quantities.f3.spread!;
    expect(spread.over).toBe("corners");
    expect(spread.max / fc(9.9e3, 9e-9)).toBeCloseTo(1, 2);
    expect(spread.min / fc(10.1e3, 11e-9)).toBeCloseTo(1, 2);
  }, 240_000);
});

// A 1 mA source into R: the operating point is V = I·R exactly. R is normal with the 3 % tolerance
// as 3σ, so σ = 1 % of R, and Vout < 1.01 V exactly when z < 1: probability Φ(1) = 0.841345 (standard
// normal CDF, Abramowitz & Stegun, Handbook of Mathematical Functions, Table 26.1).
const PHI_1 = 0.841345;
const mc = (statement: string) =>
  block(
    "  - { name: R, value: 1 kohm, tol: 3% }\n",
    "I1 0 out DC 1m\nR1 out 0 {R}\n",
    `${statement}\nres = op()\nVout = v(res, "out")\ncheck("Vout below 1.01 V", Vout < 1.01 V)\n`,
  );

describe("Monte Carlo", () => {
  it("gives a yield whose 95 % interval holds the closed-form probability, the same report for the same seed", async () => {
    const { report } = await verify(mc("montecarlo(300)"));
    expect(report.errors).toEqual([]);
    const c = report.checks[0];
    expect(c.over).toBe("montecarlo");
    const y = c.yield!;
    expect(y).toMatchObject({ samples: 300, interval: "Wilson score, 95 %" });
    expect(y.lo).toBeLessThanOrEqual(PHI_1);
    expect(y.hi).toBeGreaterThanOrEqual(PHI_1);
    expect(c.status).toBe("fail"); // without a target every sample must pass (and R +3 % fails)
    expect(report.quantities.Vout.samples).toHaveLength(300);
    expect(report.quantities.Vout.spread!.over).toBe("montecarlo");
    expect(report.tolerance!.montecarlo).toEqual({ samples: 300, interval: "Wilson score, 95 %" });

    const again = await verify(mc("montecarlo(300)"));
    expect(again.report.checks).toEqual(report.checks);
    expect(again.report.quantities).toEqual(report.quantities);
    expect(again.report.simulations.every((s) => s.cached)).toBe(true);
  }, 240_000);

  it("judges a target by the lower end of the interval", async () => {
    const reached = (await verify(mc("montecarlo(300, 70%)"))).report.checks[0];
    expect(reached.status).toBe("pass");
    expect(reached.yield!.target).toBeCloseTo(0.7, 12);
    const missed = (await verify(mc("montecarlo(300, 95%)"))).report.checks[0];
    expect(missed.status).toBe("fail");
    expect(missed.detail).toMatch(/yield 8\d(\.\d+)? % \(\d+(\.\d+)? %–\d+(\.\d+)? %, Wilson score, 95 %\) over 300 samples, target 95 %/);
  }, 240_000);

  it("refuses a run over the cap before any simulation, naming the limits", async () => {
    const { report } = await verify(mc("montecarlo(300)"), { cap: { simulations: 100, simSeconds: 100 } });
    expect(report.status).toBe("error");
    expect(report.simulations).toEqual([]);
    expect(report.errors[0].message).toMatch(/needs about 303 simulations .* at most 100 simulations .*ASSAY_RUN_MAX_SIMULATIONS/);
  }, 60_000);

  it("sends every simulation through an injected executor and reports progress", async () => {
    const local = localExecutor({ cacheDir });
    const seen: number[] = [];
    let last = [0, 0];
    const executor: SimExecutor = {
      runMany: (reqs, progress) => {
        seen.push(reqs.length);
        return local.runMany(reqs, progress);
      },
    };
    const { report } = await verify(mc("montecarlo(40)"), { executor, onProgress: (d, t) => (last = [d, t]) });
    expect(report.errors).toEqual([]);
    expect(seen.reduce((a, b) => a + b, 0)).toBe(report.simulations.length);
    expect(last).toEqual([report.simulations.length, report.simulations.length]);
  }, 120_000);
});

describe("sweeps", () => {
  it("runs a loop-gain family: below one it decays, above one it runs, and THD rises with the gain", async () => {
    // Barkhausen: a loop gain below one lets a kick die away, above one it grows, and the harder
    // the limiter has to work the more it distorts (common practice).
    const text = readFileSync(path.join(process.cwd(), "content/blocks/wien-bridge-loop-gain-family.md"), "utf8");
    const { report, waveforms } = await verify(text);
    expect(report.errors).toEqual([]);
    expect(report.status).toBe("verified");
    expect(report.checks.find((c) => c.label === "THD rises with loop gain")!.detail).toMatch(/dist\[3\] = .* > dist\[2\] = .* ✓ and dist\[4\] = .* > .* ✓/);
    const members = waveforms.filter((w) => w.variant === "member");
    expect(members.map((w) => w.sweep!.name)).toEqual(["Rf1", "Rf1", "Rf1", "Rf1"]);
    expect(new Set(members.map((w) => w.group)).size).toBe(1);
  }, 240_000);

  it("sweeps a diode's forward voltage over temperature at about -2 mV/°C", async () => {
    // A silicon junction's forward drop falls by about 2 mV per °C at constant current (common practice).
    const text = block(
      "  - { name: Rb, value: 4.3 kohm, tol: 1% }\n",
      ".include diode-si.lib\nV1 vcc 0 DC 5\nR1 vcc a {Rb}\nD1 a 0 DSI\n",
      'res = op(sweep("temp", [-40 degC, 25 degC, 85 degC]))\nvf = v(res, "a")\ntc = (vf[3] - vf[1]) / (125 K) to mV/K\ncheck("forward drop falls with temperature", vf[1] > vf[2] and vf[2] > vf[3])\ncheck("about -2 mV/K", near(tc, -2 mV/K, 25%))\n',
    );
    const { report } = await verify(text);
    expect(report.errors).toEqual([]);
    expect(report.status).toBe("verified");
    expect(report.quantities.tc.value).toBeGreaterThan(-2.5e-3);
    expect(report.quantities.tc.value).toBeLessThan(-1.5e-3);
    // Three temperatures at nominal and at the two corners of Rb.
    expect(report.simulations).toHaveLength(9);
  }, 240_000);
});
