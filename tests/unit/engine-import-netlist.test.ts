import { describe, expect, it } from "vitest";
import { importNetlist, parseBlock } from "@/checks";
import { readSpiceNumber } from "@/checks/spice-number";

// SPICE number suffixes as in the ngspice User's Manual (version 39), §2.3.4 "Values":
// T G MEG K M(illi) U N P F and MIL; letters following a suffix are ignored.
describe("SPICE numbers", () => {
  it("reads the scale factors as SPICE does, M being milli", () => {
    expect(readSpiceNumber("1M")).toBe(1e-3);
    expect(readSpiceNumber("1m")).toBe(1e-3);
    expect(readSpiceNumber("1MEG")).toBe(1e6);
    expect(readSpiceNumber("2.2Meg")).toBeCloseTo(2.2e6, 6);
    expect(readSpiceNumber("4.7k")).toBe(4700);
    expect(readSpiceNumber("10uF")).toBeCloseTo(10e-6, 18);
    expect(readSpiceNumber("100n")).toBeCloseTo(100e-9, 20);
    expect(readSpiceNumber("3p")).toBeCloseTo(3e-12, 24);
    expect(readSpiceNumber("1F")).toBeCloseTo(1e-15, 28);
    expect(readSpiceNumber("2G")).toBe(2e9);
    expect(readSpiceNumber("1T")).toBe(1e12);
    expect(readSpiceNumber("1mil")).toBeCloseTo(25.4e-6, 18);
    expect(readSpiceNumber("2.5e-3")).toBe(2.5e-3);
    expect(readSpiceNumber("5V")).toBe(5);
    expect(readSpiceNumber("abc")).toBeNull();
  });
});

const netlist = `RC low-pass from the bench
* a first-order filter
.param Rload=1MEG Cf=100n Rs=4.7k gain={2*Rs}
.param Vin=1 Ibias=1M
V1 in 0 AC {Vin}
I1 0 in {Ibias}
R1 in out {Rs}
C1 out 0 {Cf}
R2 out 0
+ {Rload}
.tran 1u 5m
.ac dec 50 10 1meg
.control
run
plot v(out)
.endc
.options reltol=1e-4
.end
`;

describe("importNetlist", () => {
  it("turns .param values into typed parameters and drops analysis and control lines", () => {
    const { blockText, dropped, errors } = importNetlist(netlist, "bench/rc_lowpass.cir");
    expect(errors).toEqual([]);
    expect(dropped).toEqual([".tran 1u 5m", ".ac dec 50 10 1meg", ".control", "run", "plot v(out)", ".endc", ".end"]);
    const { block, errors: parseErrors } = parseBlock(blockText);
    expect(parseErrors).toEqual([]);
    expect(block!.slug).toBe("rc-lowpass");
    expect(block!.title).toBe("RC low-pass from the bench");
    const byName = Object.fromEntries(block!.params.map((p) => [p.name, [p.si, p.unit]]));
    expect(byName.Rload).toEqual([1e6, "ohm"]); // 1MEG is mega
    expect(byName.Ibias[1]).toBe("A");
    expect(byName.Ibias[0]).toBeCloseTo(1e-3, 15); // 1M is milli
    expect(byName.Rs).toEqual([4700, "ohm"]);
    expect(byName.Cf[1]).toBe("F");
    expect(byName.Cf[0]).toBeCloseTo(100e-9, 20);
    expect(byName.Vin).toEqual([1, "V"]);
    expect(byName.gain).toBeUndefined();
    expect(block!.netlist).toContain(".param gain={2*Rs}");
    expect(block!.netlist).toContain("R2 out 0 {Rload}");
    expect(block!.netlist).toContain(".options reltol=1e-4");
    expect(block!.netlist).not.toMatch(/^\.(tran|ac|end)\b/m);
    // The dropped analyses come back as script calls, so the imported block still runs them.
    expect(block!.script).toBe("res = tran(5 ms, 1 us)\nac_res = ac(10 Hz, 1 MHz, 50)");
  });

  it("reports parameters that differ only in case", () => {
    const { errors } = importNetlist("t\n.param R1=1k r1=2k\nR1 a 0 {R1}\n");
    expect(errors).toEqual([{ message: 'parameters "R1" and "r1" differ only in case', line: 2 }]);
  });
});
