import { describe, expect, it } from "vitest";
import { eseries } from "@/checks";
import { E_SERIES } from "@/checks/eseries";

// IEC 60063:2015 "Preferred number series for resistors and capacitors", tables 1 and 2.
describe("IEC 60063 E-series", () => {
  it("E6, E12 and E24 are the published lists", () => {
    // IEC 60063 table 1 (E6, E12, E24 columns).
    expect(E_SERIES.E6).toEqual([1.0, 1.5, 2.2, 3.3, 4.7, 6.8]);
    expect(E_SERIES.E12).toEqual([1.0, 1.2, 1.5, 1.8, 2.2, 2.7, 3.3, 3.9, 4.7, 5.6, 6.8, 8.2]);
    expect(E_SERIES.E24).toEqual([
      1.0, 1.1, 1.2, 1.3, 1.5, 1.6, 1.8, 2.0, 2.2, 2.4, 2.7, 3.0, 3.3, 3.6, 3.9, 4.3, 4.7, 5.1, 5.6, 6.2, 6.8, 7.5, 8.2, 9.1,
    ]);
  });

  it("E24 keeps the historical values that differ from the rounded geometric series", () => {
    // IEC 60063 table 1; the rounded 10^(k/24) would give 2.6, 2.9, 3.2, 3.5, 3.8, 4.2, 4.6 and 8.3.
    const rounded = Array.from({ length: 24 }, (_, k) => Number((10 ** (k / 24)).toFixed(1)));
    const differ = E_SERIES.E24.filter((v, k) => v !== rounded[k]);
    expect(differ).toEqual([2.7, 3.0, 3.3, 3.6, 3.9, 4.3, 4.7, 8.2]);
  });

  it("E48, E96 and E192 hold the published three-digit values", () => {
    // IEC 60063 table 2, spot values.
    expect(E_SERIES.E48).toHaveLength(48);
    expect(E_SERIES.E96).toHaveLength(96);
    expect(E_SERIES.E192).toHaveLength(192);
    expect(E_SERIES.E48.slice(0, 6)).toEqual([1.0, 1.05, 1.1, 1.15, 1.21, 1.27]);
    expect(E_SERIES.E48).toContain(4.64);
    expect(E_SERIES.E96.slice(0, 6)).toEqual([1.0, 1.02, 1.05, 1.07, 1.1, 1.13]);
    expect(E_SERIES.E96).toContain(4.99);
    expect(E_SERIES.E96.at(-1)).toBe(9.76);
    expect(E_SERIES.E192.slice(0, 6)).toEqual([1.0, 1.01, 1.02, 1.04, 1.05, 1.06]);
    // IEC 60063 table 2 keeps 9.20 in E192 where the rounded geometric term 10^(185/192) gives 9.19.
    const rounded = E_SERIES.E192.map((_, k) => Math.round(100 * 10 ** (k / 192)) / 100);
    expect(E_SERIES.E192.filter((v, k) => v !== rounded[k])).toEqual([9.2]);
    expect(E_SERIES.E192.at(-1)).toBe(9.88);
  });

  it("each series is every other value of the next finer one", () => {
    // IEC 60063 clause 3: E(n) is formed from E(2n) by taking every second term.
    const chain = ["E3", "E6", "E12", "E24"] as const;
    for (let k = 0; k < chain.length - 1; k++)
      expect(E_SERIES[chain[k]]).toEqual(E_SERIES[chain[k + 1]].filter((_, i) => i % 2 === 0));
    expect(E_SERIES.E48).toEqual(E_SERIES.E96.filter((_, i) => i % 2 === 0));
    expect(E_SERIES.E96).toEqual(E_SERIES.E192.filter((_, i) => i % 2 === 0));
  });

  it("snaps to the nearest preferred value across decades, on a ratio scale", () => {
    // Nearest by ratio is common practice for preferred values (tolerance bands are relative).
    expect(eseries(10.3e3, "E24")).toBe(10e3);
    expect(eseries(9.7, "E24")).toBe(10);
    expect(eseries(4.6e-9, "E12")).toBeCloseTo(4.7e-9, 20);
    expect(eseries(1.035, "E96")).toBe(1.05); // 1.05/1.035 = 1.0145 is a smaller step than 1.035/1.02 = 1.0147
    expect(eseries(-3.4, "E6")).toBe(-3.3);
    expect(eseries(0.0515, "E192")).toBeCloseTo(0.0517, 12);
    expect(() => eseries(1, "E7")).toThrow(/unknown series/);
  });
});
