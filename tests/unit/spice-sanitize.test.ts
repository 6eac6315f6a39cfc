import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { afterAll, describe, expect, it } from "vitest";
import { sanitizeNetlist, SpiceError, writeDeck, simulate } from "@/checks/spice";

const models = fs.mkdtempSync(path.join(os.tmpdir(), "assay-models-"));
fs.writeFileSync(path.join(models, "opamp-test.lib"), ".subckt optest p n out\nE1 out 0 p n 1e5\n.ends\n");
afterAll(() => fs.rmSync(models, { recursive: true, force: true }));

const ok = "* divider\nV1 in 0 DC 5\nR1 in out {R}\nR2 out 0 10k\n";

/** The refusal for a circuit whose line `line` is `bad`. */
function refusal(bad: string, line = 3): SpiceError {
  const lines = ok.trim().split("\n");
  lines.splice(line - 1, 0, bad);
  try {
    sanitizeNetlist(lines.join("\n"), models);
  } catch (e) {
    expect(e).toBeInstanceOf(SpiceError);
    return e as SpiceError;
  }
  throw new Error(`"${bad}" was accepted`);
}

describe("sanitizeNetlist refuses what could run commands, read files or steer the output", () => {
  it.each([
    [".control", /control blocks/],
    ["  .ENDC", /control blocks/],
    ["shell rm -rf /", /shell/],
    [".include /etc/passwd", /only NAME\.lib/],
    [".include ../models/opamp-test.lib", /only NAME\.lib/],
    [".inc missing.lib", /no such file in the team.s or the shared model library \(shared: opamp-test\.lib\)/],
    [".lib /usr/share/lib.lib tt", /\.lib is not allowed/],
    [".tran 1u 1m", /analysis card \.tran/],
    [".ac dec 10 1 1meg", /analysis card \.ac/],
    [".op", /analysis card \.op/],
    [".dc V1 0 5 0.1", /analysis card/],
    [".noise v(out) V1 dec 10 1 1k", /analysis card/],
    [".meas tran x max v(out)", /analysis card \.meas/],
    [".four 1k v(out)", /analysis card \.four/],
    [".save v(out)", /runner decides what ngspice writes/],
    [".print tran v(out)", /runner decides/],
    [".end", /runner ends the deck/],
    [".options filetype=ascii", /option "filetype" is not allowed/],
    ["A1 in out filesrc", /A element/],
    ["a2 [in] [out] dgate", /A element/],
    ["N1 a b osdimodel", /not a SPICE element line/],
    [".endl", /not allowed/],
  ])("%s", (bad, message) => {
    const e = refusal(bad);
    expect(e.message).toMatch(message);
    expect(e.line).toBe(3);
  });

  it("checks continuation lines as part of their card and names the continued line", () => {
    const e = refusal(".options reltol=1e-4\n+ filetype=ascii", 2);
    expect(e.message).toMatch(/filetype/);
    expect(e.line).toBe(3);
  });

  it("keeps allowed cards and resolves a library include to its absolute path", () => {
    const circuit = [
      "* allowed", ".param G=2", ".func half(x) {x/2}", ".include opamp-test.lib", "X1 in fb out optest",
      ".model dfast D(IS=1e-14", "+ N=1.8)", ".options reltol=1e-4 abstol = 1e-12", ".ic v(out)=0", ".nodeset v(fb)=1",
      ".temp 50", ".global vcc", "Rload out 0 10k ; trailing comment .control", "B1 b 0 V={half(v(in))}",
    ].join("\n");
    const out = sanitizeNetlist(circuit, models).split("\n");
    expect(out).toHaveLength(14);
    expect(out[3]).toBe(`.include "${path.join(models, "opamp-test.lib")}"`);
    expect(out[12]).toBe("Rload out 0 10k ; trailing comment .control");
  });
});

describe("writeDeck", () => {
  it("writes title, .param lines in SI numbers, the circuit, the analysis and .end", () => {
    const deck = writeDeck({ title: "Divider\nsecond line", circuit: ok.trim(), params: { R: 3300, C: 2.2e-8 }, analysis: { kind: "tran", stop: 1e-3, step: 1e-6, uic: true } }, models);
    expect(deck.split("\n")).toEqual([
      "Divider second line", ".param R=3300", ".param C=2.2e-8", "* divider", "V1 in 0 DC 5", "R1 in out {R}", "R2 out 0 10k",
      ".tran 0.000001 0.001 uic", ".end", "",
    ]);
  });
  it("writes ac and op cards", () => {
    const base = { title: "t", circuit: ok, params: {} };
    expect(writeDeck({ ...base, analysis: { kind: "ac", f1: 10, f2: 1e6, perDecade: 50 } }, models)).toContain("\n.ac dec 50 10 1000000\n");
    expect(writeDeck({ ...base, analysis: { kind: "op" } }, models)).toContain("\n.op\n.end");
  });
  it("refuses bad parameter names and values", () => {
    const base = { title: "t", circuit: ok, analysis: { kind: "op" as const } };
    expect(() => writeDeck({ ...base, params: { "R 1": 1 } }, models)).toThrow(/not an identifier/);
    expect(() => writeDeck({ ...base, params: { R: NaN } }, models)).toThrow(/not a finite number/);
  });
});

describe("points cap", () => {
  it("refuses oversized analyses before ngspice runs", () => {
    // With no PATH ngspice cannot start, so the cap message proves nothing was run.
    const path0 = process.env.PATH;
    process.env.PATH = "";
    try {
      const base = { title: "t", circuit: ok, params: { R: 1e3 } };
      expect(() => simulate({ ...base, analysis: { kind: "tran", stop: 1, step: 1e-7 } }, { modelsDir: models, noCache: true })).toThrow(/1\.00e\+7 points, more than the cap/);
      expect(() => simulate({ ...base, analysis: { kind: "ac", f1: 1, f2: 1e9, perDecade: 20000 } }, { modelsDir: models, noCache: true })).toThrow(/more than the cap/);
      expect(() => simulate({ ...base, analysis: { kind: "tran", stop: 1e-3, step: 0 } }, { modelsDir: models, noCache: true })).toThrow(/positive times/);
    } finally {
      process.env.PATH = path0;
    }
  });
});
