import { spawnSync } from "node:child_process";
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { afterAll, describe, expect, it } from "vitest";
import { freq, peak, startup, thd } from "@/checks/measures";
import { simulate, writeDeck, type SimRequest } from "@/checks/spice";

// RC-bridge (Wien) oscillator: series R C and parallel R C from the output to the + input of an
// ideal op-amp (a VCVS of gain 1e5); the - input sees Rg to ground and Rf1 + Rf2 from the output,
// with anti-parallel diodes across Rf2 to limit the amplitude. At f0 = 1/(2πRC) the bridge passes
// 1/3, so the small-signal loop gain is G = (1 + (Rf1 + Rf2)/Rg)/3; Rf2 is set from G.
const circuit = [
  "* Wien bridge, diode-limited",
  "Rs out a {R}", "Cs a p {C}", "Rp p 0 {R}", "Cp p 0 {C}",
  "Rg n 0 {Rg}", "Rf1 out m {Rf1}", "Rf2 m n {(3*G - 1)*Rg - Rf1}",
  "D1 m n dlim", "D2 n m dlim", ".model dlim D(IS=1e-14 N=1)",
  "E1 out 0 p n 1e5", ".ic v(p)=0.01",
].join("\n");
const R = 10e3;
const C = 15.9e-9;
const f0 = 1 / (2 * Math.PI * R * C);
const cacheDir = fs.mkdtempSync(path.join(os.tmpdir(), "assay-cache-"));
afterAll(() => fs.rmSync(cacheDir, { recursive: true, force: true }));

const request = (G: number): SimRequest => ({
  title: `wien bridge G=${G}`, circuit, params: { R, C, Rg: 10e3, Rf1: 15e3, G },
  analysis: { kind: "tran", stop: 60e-3, step: 1e-6, uic: true },
});
const runs = new Map([0.9, 1.03, 1.2, 1.4].map((G) => [G, simulate(request(G), { cacheDir })]));
const settled = (G: number) => thd(runs.get(G)!, "out", 40e-3, 60e-3);

describe("Wien-bridge oscillator (common practice: loop gain sets start-up and distortion)", () => {
  it("with loop gain below one the kick decays", () => {
    const res = runs.get(0.9)!;
    expect(peak(res, "out", 50e-3, 60e-3)).toBeLessThan(1e-3 * peak(res, "out", 0, 5e-3));
    // A level never reached is a refusal with its reason, never a time a check could pass on (DESIGN.md).
    expect(() => startup(res, "out", 0.5)).toThrow(/never reaches 0.5 V/);
  });

  it("just above one it grows into a sine at 1/(2πRC) with low distortion", () => {
    const res = runs.get(1.03)!;
    expect(startup(res, "out", 1)).toBeLessThan(30e-3);
    expect(peak(res, "out", 40e-3, 60e-3)).toBeGreaterThan(2);
    expect(Math.abs(freq(res, "out", 40e-3, 60e-3) / f0 - 1)).toBeLessThan(0.01);
    expect(settled(1.03)).toBeLessThan(0.03);
  });

  it("distortion rises with loop gain, and at 1.4 it is several times that near 1", () => {
    expect(settled(1.2)).toBeGreaterThan(settled(1.03));
    expect(settled(1.4)).toBeGreaterThan(settled(1.2));
    expect(settled(1.4)).toBeGreaterThan(2.5 * settled(1.03));
  });

  it("more loop gain starts faster", () => {
    expect(startup(runs.get(1.4)!, "out", 1)).toBeLessThan(startup(runs.get(1.03)!, "out", 1));
  });

  it("our THD agrees with ngspice's own Fourier analysis of the same run", () => {
    // Outside reference: ngspice's `.four` (THD over harmonics 1..9 of the last period, 200-point grid).
    const res = runs.get(1.4)!;
    const f = freq(res, "out", 40e-3, 60e-3);
    const dir = fs.mkdtempSync(path.join(os.tmpdir(), "assay-four-"));
    try {
      fs.writeFileSync(path.join(dir, "spinit"), "");
      fs.writeFileSync(path.join(dir, "deck.cir"), writeDeck(request(1.4)).replace(/\.end\n$/, `.four ${f} v(out)\n.end\n`));
      const out = spawnSync("ngspice", ["-b", "deck.cir"], { cwd: dir, encoding: "utf8", env: { ...process.env, SPICE_SCRIPTS: dir, HOME: dir } });
      const m = /THD:\s*([0-9.eE+-]+)\s*%/.exec(out.stdout);
      expect(m, out.stdout + out.stderr).not.toBeNull();
      const reference = Number(m![1]) / 100;
      expect(Math.abs(thd(res, "out", 40e-3, 60e-3) / reference - 1)).toBeLessThan(0.01);
    } finally {
      fs.rmSync(dir, { recursive: true, force: true });
    }
  });
});
