import { describe, expect, it } from "vitest";
import { bindingMargin, engApart, marginSentence } from "@/components/limit-margin";

describe("numbers at the limit", () => {
  it("shows enough digits to tell a value from its limit", () => {
    // 2.5 V ± 3 % has its upper limit at 2.575 V (arithmetic); 2.5754 V is above it, which 3 digits would hide.
    expect(engApart(2.5754, 2.575, "V")).toBe("2.5754 V");
    expect(engApart(2.575, 2.5754, "V")).toBe("2.5750 V");
    expect(engApart(1.06, 1.1, "")).toBe("1.06");
  });

  it("names the binding limit and the miss in the check's unit and in percent", () => {
    const c = { quantity: "Vpk", unit: "V", value: 2.5754, limits: [2.425, 2.575], relations: ["≥", "≤"], target: 2.5 };
    const m = bindingMargin(c)!;
    expect(m.limit).toBe(2.575);
    expect(m.pass).toBe(false);
    expect(m.by).toBeCloseTo(-0.0004, 12);
    expect(marginSentence(c)).toBe("Vpk = 2.5754 V misses the upper limit 2.5750 V by 400 µV (0.016 %)");
  });

  it("says a passing value clears its nearest limit", () => {
    const c = { quantity: "fc", unit: "Hz", value: 3390, limits: [3000, 3800], relations: [">", "<"] };
    expect(marginSentence(c)).toBe("fc = 3.39 kHz clears the lower limit 3 kHz by 390 Hz (13.0 %)");
  });
});
