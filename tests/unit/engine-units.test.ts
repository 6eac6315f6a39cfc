import { describe, expect, it } from "vitest";
import { formatQuantity, readQuantity } from "@/checks";
import { toQuantity } from "@/checks/units";
import { evaluateExpression } from "@/checks/script/math";

// SI prefixes per the SI Brochure (BIPM, 9th edition, 2019, table 7); report units per DESIGN.md.
describe("quantities", () => {
  it("reads frontmatter values into SI numbers and a report unit", () => {
    expect(readQuantity("3.3 kohm")).toEqual({ si: 3300, unit: "ohm" });
    expect(readQuantity("22 nF").si).toBeCloseTo(22e-9, 20);
    expect(readQuantity("22 nF").unit).toBe("F");
    expect(readQuantity("0.9")).toEqual({ si: 0.9, unit: "" });
    expect(readQuantity("50%")).toEqual({ si: 0.5, unit: "" });
    expect(readQuantity("5 V/us")).toEqual({ si: 5e6, unit: "V/s" });
    expect(readQuantity("10 mH").unit).toBe("H");
    expect(readQuantity("2 mS").unit).toBe("S");
    expect(readQuantity("300 K")).toEqual({ si: 300, unit: "K" });
    expect(() => readQuantity("10k")).toThrow(/not a quantity mathjs can read/);
  });

  it("names results of script arithmetic by their dimension", () => {
    // f = 1/(2πRC) has the dimension of 1/s, reported as Hz; RC is a time (common practice).
    expect(toQuantity(evaluateExpression("1 / (2 pi 1 kohm 1 uF)"))!.unit).toBe("Hz");
    expect(toQuantity(evaluateExpression("1 / (2 pi 1 kohm 1 uF)"))!.si).toBeCloseTo(159.1549, 3);
    expect(toQuantity(evaluateExpression("1 kohm * 1 uF"))).toEqual({ si: expect.closeTo(1e-3, 15), unit: "s" });
    expect(toQuantity(evaluateExpression("5 V * 2 mA"))!.unit).toBe("W");
    expect(toQuantity(evaluateExpression("10 kohm / 1 kohm"))).toEqual({ si: 10, unit: "" });
    expect(toQuantity(evaluateExpression("-90 deg"))).toEqual({ si: expect.closeTo(-90, 12), unit: "deg" });
    expect(toQuantity(evaluateExpression("-3 dB"))).toEqual({ si: -3, unit: "dB" });
  });

  it("formats with SI prefixes and four significant digits", () => {
    expect(formatQuantity(2192.2168, "Hz")).toBe("2.192 kHz");
    expect(formatQuantity(3300, "ohm")).toBe("3.3 kohm");
    expect(formatQuantity(22e-9, "F")).toBe("22 nF");
    expect(formatQuantity(4.7e-6, "F")).toBe("4.7 uF");
    expect(formatQuantity(1.5e6, "Hz")).toBe("1.5 MHz");
    expect(formatQuantity(0.0123, "A")).toBe("12.3 mA");
    expect(formatQuantity(999.96, "Hz")).toBe("1 kHz");
    expect(formatQuantity(5e6, "V/s")).toBe("5 MV/s");
    expect(formatQuantity(-3.0103, "dB")).toBe("-3.01 dB");
    expect(formatQuantity(45.004, "deg")).toBe("45 deg");
    expect(formatQuantity(0.05, "")).toBe("0.05");
    expect(formatQuantity(0, "V")).toBe("0 V");
  });

  it("writes text that reads back to the same value", () => {
    for (const [si, unit] of [[2192.2168, "Hz"], [4.7e-6, "F"], [1.2e-12, "F"], [3.3e6, "ohm"], [0.05, ""]] as const) {
      const back = readQuantity(formatQuantity(si, unit));
      expect(back.unit).toBe(unit);
      expect(back.si / si).toBeCloseTo(1, 3);
    }
  });
});
