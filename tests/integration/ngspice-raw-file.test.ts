import { describe, expect, it } from "vitest";
import { parseRawFile, writeDeck, type Analysis } from "@/checks/spice";
import { runNgspice } from "@/checks/spice/run-ngspice";

// The outside reference is ngspice itself: the same run written as an ASCII raw file
// (`set filetype=ascii`, ngspice manual ch. "Raw file format", from memory) must give the
// numbers our binary reader reads. ASCII holds 16 significant digits, hence the 1e-15 tolerance.

type AsciiPlot = { plotname: string; names: string[]; re: number[][]; im: number[][] };

// Deliberately independent of parseRawFile: text tokens, "re,im" for complex values.
function parseAscii(text: string): AsciiPlot {
  const lines = text.split("\n");
  const get = (key: string) => lines.find((l) => l.startsWith(`${key}:`))!.slice(key.length + 1).trim();
  const nVars = Number(get("No. Variables"));
  const points = Number(get("No. Points"));
  const vi = lines.findIndex((l) => l.startsWith("Variables:"));
  const names = lines.slice(vi + 1, vi + 1 + nVars).map((l) => l.trim().split(/\s+/)[1]);
  const values = lines.slice(lines.findIndex((l) => l.startsWith("Values:")) + 1).join(" ").trim().split(/\s+/);
  const re = names.map(() => [] as number[]);
  const im = names.map(() => [] as number[]);
  let p = 0;
  for (let k = 0; k < points; k++) {
    expect(Number(values[p++])).toBe(k);
    for (let v = 0; v < nVars; v++) {
      const [a, b] = values[p++].split(",");
      re[v].push(Number(a));
      im[v].push(b === undefined ? 0 : Number(b));
    }
  }
  return { plotname: get("Plotname"), names, re, im };
}

const circuit = [
  "* RLC with a diode: uneven time steps, complex AC values, a branch current",
  "V1 in 0 DC 0.2 AC 1 SIN(0.2 1.5 2k)", "R1 in a {R}", "L1 a b 10m", "C1 b 0 {C}", "D1 b 0 dmod", ".model dmod D(IS=1e-14)",
].join("\n");

function bothForms(analysis: Analysis) {
  const deck = writeDeck({ title: "raw reader reference", circuit, params: { R: 220, C: 47e-9 }, analysis });
  const binary = parseRawFile(runNgspice(deck).raw);
  const ascii = parseAscii(runNgspice(deck, { spinit: "set filetype=ascii\n" }).raw.toString("latin1"));
  return { binary: binary[0], ascii };
}

function expectSame(a: number[], b: Float64Array) {
  expect(b.length).toBe(a.length);
  for (let k = 0; k < a.length; k++) expect(Math.abs(b[k] - a[k])).toBeLessThanOrEqual(1e-15 * Math.abs(a[k]) + 1e-300);
}

describe("parseRawFile against ngspice's ASCII raw output", () => {
  it.each([
    ["tran", { kind: "tran", stop: 2e-3, step: 2e-6 }],
    ["ac", { kind: "ac", f1: 10, f2: 1e6, perDecade: 20 }],
    ["op", { kind: "op" }],
  ] as [string, Analysis][])("%s", (_, analysis) => {
    const { binary, ascii } = bothForms(analysis);
    expect(binary.plotname).toBe(ascii.plotname);
    expect(binary.variables.map((v) => v.name)).toEqual(ascii.names);
    expect(binary.points).toBe(ascii.re[0].length);
    expect(binary.complex).toBe(analysis.kind === "ac");
    binary.real.forEach((v, i) => expectSame(ascii.re[i], v));
    // The frequency scale's imaginary part is left unset by ngspice (garbage in both forms): skip it.
    if (binary.imag) binary.imag.forEach((v, i) => i > 0 && expectSame(ascii.im[i], v));
  });
});

describe("parseRawFile on damaged input", () => {
  it("refuses a truncated file", () => {
    const deck = writeDeck({ title: "t", circuit, params: { R: 220, C: 47e-9 }, analysis: { kind: "tran", stop: 1e-4, step: 1e-6 } });
    const raw = runNgspice(deck).raw;
    expect(() => parseRawFile(raw.subarray(0, raw.length - 8))).toThrow(/truncated/);
  });
});
