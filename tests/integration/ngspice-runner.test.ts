import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { afterAll, describe, expect, it } from "vitest";
import { simulate, SpiceError, writeDeck, type SimRequest } from "@/checks/spice";
import { runNgspice } from "@/checks/spice/run-ngspice";
import { peak } from "@/checks/measures";

const cacheDir = fs.mkdtempSync(path.join(os.tmpdir(), "assay-cache-"));
const modelsDir = fs.mkdtempSync(path.join(os.tmpdir(), "assay-models-"));
fs.writeFileSync(path.join(modelsDir, "follower.lib"), "* test follower\n.subckt follower p out\nE1 out 0 p out 1e6\n.ends\n");
afterAll(() => {
  fs.rmSync(cacheDir, { recursive: true, force: true });
  fs.rmSync(modelsDir, { recursive: true, force: true });
});

const rc: SimRequest = {
  title: "rc step", params: { R: 1e3, C: 1e-6 }, analysis: { kind: "tran", stop: 5e-3, step: 1e-5 },
  circuit: "V1 in 0 PULSE(0 1 0 1n 1n 1 2)\nR1 in out {R}\nC1 out 0 {C}",
};

function thrown(fn: () => unknown): SpiceError {
  try {
    fn();
  } catch (e) {
    expect(e).toBeInstanceOf(SpiceError);
    return e as SpiceError;
  }
  throw new Error("no error");
}

describe("simulate()", () => {
  it("serves an identical rerun from the cache", () => {
    const first = simulate(rc, { cacheDir });
    const second = simulate(rc, { cacheDir });
    expect(first.cached).toBe(false);
    expect(second.cached).toBe(true);
    expect(second.points).toBe(first.points);
    expect(Array.from(second.vectors.out)).toEqual(Array.from(first.vectors.out));
    // Any change in the deck is a different key.
    expect(simulate({ ...rc, params: { R: 1.1e3, C: 1e-6 } }, { cacheDir }).cached).toBe(false);
    expect(simulate(rc, { cacheDir, engineVersion: "other" }).cached).toBe(false);
  });

  it("gives the RC step response of 1 - e^(-t/RC)", () => {
    // Closed form of a first-order step response: 1 - e^{-5} = 0.99326 after 5 RC.
    const res = simulate(rc, { cacheDir });
    expect(peak(res, "out", 4.9e-3, 5e-3)).toBeCloseTo(1 - Math.exp(-5), 3);
    expect(Object.keys(res.vectors)).toEqual(expect.arrayContaining(["v(out)", "out", "v(in)", "in", "i(v1)"]));
  });

  it("resolves an .include of the model library", () => {
    const res = simulate(
      { title: "follower", params: {}, analysis: { kind: "op" }, circuit: "V1 in 0 DC 1.25\n.include follower.lib\nX1 in out follower\nRl out 0 1k" },
      { cacheDir, modelsDir },
    );
    expect(res.vectors.out[0]).toBeCloseTo(1.25, 5);
  });

  it("maps an ngspice netlist error to the circuit line", () => {
    const e = thrown(() => simulate({ ...rc, circuit: "V1 in 0 DC 1\nR1 in out 1k\nC1 out 0 {Cx}" }, { cacheDir }));
    expect(e.message).toMatch(/cx/i);
    expect(e.line).toBe(3);
  });

  it("finds the circuit line of a card ngspice quotes instead of numbering", () => {
    const e = thrown(() => simulate({ ...rc, circuit: "V1 in 0 DC 1\nR1 in out 1k\nX1 out 0 nosuchsub" }, { cacheDir }));
    expect(e.message).toMatch(/unknown subckt/);
    expect(e.line).toBe(3);
    const m = thrown(() => simulate({ ...rc, circuit: "V1 in 0 DC 1\nQ1 out in 0 nosuchmodel\nR1 in out 1k" }, { cacheDir }));
    expect(m.message).toMatch(/nosuchmodel/);
    expect(m.line).toBe(2);
  });

  it("reports an aborted transient as an error", () => {
    // Positive feedback with gain 2 around an RC and no limit: the state grows as e^{t/RC} until
    // ngspice gives up with "timestep too small".
    const circuit = "E1 out 0 x 0 2\nR1 out x 1k\nC1 x 0 1n\n.ic v(x)=1";
    const e = thrown(() => simulate({ ...rc, circuit, analysis: { kind: "tran", stop: 1e-3, step: 1e-6, uic: true } }, { cacheDir }));
    expect(e.message).toMatch(/ngspice: .*timestep too small/i);
  });

  it("kills a run that exceeds its wall-clock limit", () => {
    const slow: SimRequest = {
      title: "slow", params: {}, analysis: { kind: "tran", stop: 2, step: 1e-6 },
      circuit: "V1 in 0 SIN(0 1 100k)\nR1 in out 1k\nC1 out 0 1n\nD1 out 0 dd\n.model dd D(IS=1e-14)",
    };
    const t0 = Date.now();
    expect(thrown(() => simulate(slow, { noCache: true, timeoutMs: 400 })).message).toMatch(/did not finish within 0.4 s/);
    expect(Date.now() - t0).toBeLessThan(5000);
  });

  it("stops ngspice when its raw file outgrows the size limit", () => {
    // 1e5 points of 4 vectors is about 3 MB: over a 1 MB limit the kernel stops the writer (SIGXFSZ).
    const deck = writeDeck({ ...rc, analysis: { kind: "tran", stop: 0.1, step: 1e-6 } });
    expect(thrown(() => runNgspice(deck, { maxRawBytes: 2 ** 20 })).message).toMatch(/output exceeds 1 MB/);
  });
});
