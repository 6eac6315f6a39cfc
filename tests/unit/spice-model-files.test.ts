import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { afterAll, describe, expect, it } from "vitest";
import { sanitizeModelFile, sanitizeNetlist, SpiceError, writeDeck } from "@/checks/spice";
import { includedNames, inlineIncludes, modelDefinitions } from "@/checks/spice/model-file";

const shared = fs.mkdtempSync(path.join(os.tmpdir(), "assay-shared-"));
fs.writeFileSync(path.join(shared, "shared-one.lib"), ".model DONE D(IS=1e-14)\n");
afterAll(() => fs.rmSync(shared, { recursive: true, force: true }));

const good = "* buffer\n.subckt BUF in out\nE1 out 0 in 0 1\n.ends BUF\n";

function refusal(text: string): SpiceError {
  try {
    sanitizeModelFile("hostile.lib", text, shared);
  } catch (e) {
    expect(e).toBeInstanceOf(SpiceError);
    return e as SpiceError;
  }
  throw new Error("the model file was accepted");
}

// What a model file may hold follows DESIGN.md "Block file format"; the refusals are the ngspice features that run
// commands (shell, .control) or read files (.include of a path, XSPICE file sources: ngspice manual, code models).
describe("sanitizeModelFile refuses a hostile model file on its own line", () => {
  it.each([
    ["* ok\n.subckt X a b\nR1 a b 1k\n.control\nshell cat /etc/passwd\n.endc\n.ends\n", 4, /control blocks/],
    ["* ok\nshell rm -rf /\n", 2, /shell/],
    ["* reads a file\n\n.model SRC filesource(file=\"/etc/passwd\")\n", 3, /filesource.*reads files/],
    [".model T1 table2d(file=\"x\")\n", 1, /table2d/],
    ["* ok\n.include /etc/passwd\n", 2, /only NAME\.lib/],
    [".inc ../../etc/passwd.lib\n", 1, /only NAME\.lib/],
    ["A1 in out src\n", 1, /A element/],
    [".tran 1u 1m\n", 1, /analysis card \.tran/],
    [".options filetype=ascii\n", 1, /\.options is not allowed/],
    [".subckt X a b\nR1 a b 1k\n.ends\n.end\n", 4, /runner ends the deck/],
  ])("%#", (text, line, message) => {
    const e = refusal(text);
    expect(e.message).toMatch(message);
    expect(e.line).toBe(line);
  });

  it("accepts definitions and lists them", () => {
    expect(sanitizeModelFile("good.lib", good, shared)).toBe(good.replace(/\n$/, "\n"));
    expect(modelDefinitions(`${good}.model DX D(IS=2n)\n.MODEL QN npn (BF=200)\n`)).toEqual([
      { kind: "subckt", name: "BUF" }, { kind: "model", name: "DX", type: "d" }, { kind: "model", name: "QN", type: "npn" },
    ]);
  });
});

describe("team model files in a circuit", () => {
  it("carries a team file after the circuit, so the deck is self-contained and keeps the circuit's line numbers", () => {
    const models = { "buf.lib": good, "bad.lib": "* x\n\n.control\n" };
    const deck = writeDeck({ title: "t", circuit: "V1 in 0 1\n.include buf.lib\nX1 in out BUF", params: {}, analysis: { kind: "op" }, models }, shared);
    expect(deck.split("\n")).toEqual([
      "t", "V1 in 0 1", "* .include buf.lib (carried after the circuit)", "X1 in out BUF",
      "* ---- model file buf.lib", "* buffer", ".subckt BUF in out", "E1 out 0 in 0 1", ".ends BUF", "* ---- end of buf.lib", ".op", ".end", "",
    ]);
    try {
      sanitizeNetlist("V1 in 0 1\n* two\n.include bad.lib", { modelsDir: shared, models });
      throw new Error("accepted");
    } catch (e) {
      expect((e as SpiceError).line).toBe(3);
      expect((e as Error).message).toMatch(/^bad\.lib line 3: ngspice control blocks/);
    }
  });

  it("falls back to the shared library, and names a missing file without listing any team's files", () => {
    expect(sanitizeNetlist(".include shared-one.lib", { modelsDir: shared, models: {} })).toBe(`.include "${path.join(shared, "shared-one.lib")}"`);
    expect(() => sanitizeNetlist("* a\n.include vendor-op.lib", { modelsDir: shared, models: { "other.lib": good } }))
      .toThrow(/^\.include vendor-op\.lib: no such file in the team's or the shared model library \(shared: shared-one\.lib\)$/);
  });

  it("refuses model files that include each other", () => {
    const models = { "a.lib": ".include b.lib\n", "b.lib": ".include a.lib\n" };
    expect(() => sanitizeNetlist(".include a.lib", { modelsDir: shared, models })).toThrow(/include each other \(a\.lib → b\.lib → a\.lib\)/);
  });

  it("inlines every include once, named with its sha256, for a deck other tools run", () => {
    const models = { "a.lib": { text: ".include c.lib\n.model DA D\n", sha256: "aa" }, "c.lib": { text: ".model DC D\n", sha256: "cc" } };
    expect(includedNames(".include a.lib\n.INC 'c.lib'\n.include a.lib")).toEqual(["a.lib", "c.lib"]);
    expect(inlineIncludes("R1 a 0 1\n.include a.lib\n.include c.lib", models).split("\n")).toEqual([
      "R1 a 0 1", "* ---- model file a.lib sha256 aa", "* ---- model file c.lib sha256 cc", ".model DC D", "* ---- end of c.lib",
      ".model DA D", "* ---- end of a.lib", "* c.lib is inlined above",
    ]);
  });
});
