import { describe, expect, it } from "vitest";
import { importNetlist, parseBlock } from "@/checks";
import { readSpiceNumber } from "@/checks/spice-number";
import { evaluateBlock } from "@/checks/engine/evaluate-block";

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
    // With the operating point first; parts already written as {NAME} are not lifted again.
    expect(block!.script.split("\n").filter((l) => !l.startsWith("#"))).toEqual(["dc = op()", "res = tran(5 ms, 1 us)", "ac_res = ac(10 Hz, 1 MHz, 50)"]);
  });

  it("makes each literal part and source value a parameter with its unit and a default tolerance, written as {NAME}", () => {
    const plain = "Divider and RC from the bench\nV1 in 0 DC 5 AC 1\nR1 in mid 4.7k\nR2 mid 0 10k\nC1 mid 0 100n\nL1 mid out 1m\nC2 out 0 1u\nRneg x 0 -5\n.end\n";
    const { blockText, params } = importNetlist(plain, "divider.cir");
    const { block, errors } = parseBlock(blockText);
    expect(errors).toEqual([]);
    const byName = Object.fromEntries(block!.params.map((p) => [p.name, [p.si, p.unit, p.tol]]));
    expect(byName.V1).toEqual([5, "V", undefined]);
    expect(byName.R1).toEqual([4700, "ohm", "1%"]);
    expect(byName.R2).toEqual([10000, "ohm", "1%"]);
    expect(byName.C1[1]).toBe("F");
    expect(byName.C1[0]).toBeCloseTo(100e-9, 20);
    expect(byName.C1[2]).toBe("5%");
    expect(byName.L1[2]).toBe("10%");
    // A negative part value is not a part to tune: it stays as written (and the engine will refuse it).
    expect(byName.Rneg).toBeUndefined();
    expect(block!.netlist).toContain("V1 in 0 DC {V1} AC 1");
    expect(block!.netlist).toContain("R1 in mid {R1}");
    expect(block!.netlist).toContain("Rneg x 0 -5");
    expect(params.map((p) => p.name)).toEqual(["V1", "R1", "R2", "C1", "L1", "C2"]);
    // The starter script: the operating point, an AC sweep for the AC source, and hand quantities to retune.
    expect(block!.script).toContain("dc = op()");
    expect(block!.script).toContain("ac_res = ac(10 Hz, 1 MHz, 20)");
    expect(block!.script).toContain("tau_R1_C1 = R1 * C1 to s");
    expect(block!.script).toContain("tau_R2_C1 = R2 * C1 to s");
    expect(block!.script).toContain("f_L1_C2 = 1 / (2 pi sqrt(L1 * C2)) to Hz");
    // τ = RC and f = 1/(2π√(LC)) (common practice): 4.7 kΩ · 100 nF = 470 µs; 1 mH with 1 µF resonates at 5.033 kHz.
    const q = evaluateBlock(blockText).report.quantities;
    expect(q.tau_R1_C1.value).toBeCloseTo(470e-6, 12);
    expect(q.tau_R1_C1.unit).toBe("s");
    expect(q.f_L1_C2.value).toBeCloseTo(1 / (2 * Math.PI * Math.sqrt(1e-3 * 1e-6)), 6);
  });

  it("reports parameters that differ only in case", () => {
    const { errors } = importNetlist("t\n.param R1=1k r1=2k\nR1 a 0 {R1}\n");
    expect(errors).toEqual([{ message: 'parameters "R1" and "r1" differ only in case', line: 2 }]);
  });
});
