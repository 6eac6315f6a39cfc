import { describe, expect, it } from "vitest";
import { GrowingDelay } from "@/lib/auth/growing-delay";

// Exponential backoff after a few free failures, capped (common practice).
describe("growing delay", () => {
  it("is free for the first attempts, then doubles each wait up to 15 minutes, and a success forgives", () => {
    const d = new GrowingDelay(3);
    const t0 = 1_000_000;
    d.charge("a", t0);
    d.charge("a", t0);
    expect(d.waitMs("a", t0)).toBe(0);
    const waits: number[] = [];
    let now = t0;
    for (let i = 0; i < 14; i++) {
      d.charge("a", now);
      waits.push(d.waitMs("a", now));
      now += waits.at(-1)!;
    }
    expect(waits.slice(0, 5)).toEqual([1000, 2000, 4000, 8000, 16000]);
    expect(Math.max(...waits)).toBe(15 * 60_000);
    expect(d.waitMs("b", now)).toBe(0); // another key is not touched
    d.forgive("a");
    expect(d.waitMs("a", now)).toBe(0);
  });
});
