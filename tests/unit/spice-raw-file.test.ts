import { describe, expect, it } from "vitest";
import { parseRawFile } from "@/checks/spice";

// Hand-built files in the layout ngspice writes (header, "Binary:", float64 LE per value;
// re/im pairs for complex plots). tests/integration/ngspice-raw-file.test.ts checks the
// reader against ngspice's own ASCII output; this covers layouts a single run rarely shows.
function rawPlot(plotname: string, names: string[], rows: number[][], complex = false): Buffer {
  const header = [
    "Title: hand built", "Date: Wed Dec  2 00:00:00  2026", `Plotname: ${plotname}`, `Flags: ${complex ? "complex" : "real"}`,
    `No. Variables: ${names.length}`, `No. Points: ${rows.length}    `, "Variables:",
    ...names.map((n, i) => `\t${i}\t${n}\t${i === 0 ? "time" : "voltage"}`), "Binary:", "",
  ].join("\n");
  const data = Buffer.alloc(rows.length * rows[0].length * 8);
  rows.flat().forEach((x, k) => data.writeDoubleLE(x, k * 8));
  return Buffer.concat([Buffer.from(header, "latin1"), data]);
}

describe("parseRawFile", () => {
  it("reads several plots in one file, real and complex", () => {
    const op = rawPlot("Operating Point", ["v(a)", "i(v1)"], [[1.5, -2e-3]]);
    const ac = rawPlot("AC Analysis", ["frequency", "v(a)"], [[10, 0, 0.5, -0.25], [100, 0, 0.1, -0.3]], true);
    const [p1, p2] = parseRawFile(Buffer.concat([op, ac]));
    expect(p1.plotname).toBe("Operating Point");
    expect(p1.points).toBe(1);
    expect(Array.from(p1.real[1])).toEqual([-2e-3]);
    expect(p2.complex).toBe(true);
    expect(Array.from(p2.real[0])).toEqual([10, 100]);
    expect(Array.from(p2.real[1])).toEqual([0.5, 0.1]);
    expect(Array.from(p2.imag![1])).toEqual([-0.25, -0.3]);
  });
  it("refuses an ASCII file, an inconsistent header and an empty buffer", () => {
    const ascii = Buffer.from("Title: t\nPlotname: x\nFlags: real\nNo. Variables: 1\nNo. Points: 1\nVariables:\n\t0\ttime\ttime\nValues:\n0\t0\n");
    expect(() => parseRawFile(ascii)).toThrow(/ASCII raw files/);
    const bad = Buffer.from(rawPlot("Transient Analysis", ["time", "v(a)"], [[0, 1]]).toString("latin1").replace("No. Variables: 2", "No. Variables: 3"), "latin1");
    expect(() => parseRawFile(bad)).toThrow(/inconsistent/);
    expect(() => parseRawFile(Buffer.alloc(0))).toThrow(/no plot/);
  });
});
