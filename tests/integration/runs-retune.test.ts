import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";

await vi.hoisted(async () => { await (await import("./blocks-db")).usePrivateDatabase(); });
import { unit } from "mathjs";
import { createBlock } from "@/lib/blocks/create";
import { contextFor } from "@/lib/context";
import { closeOrm } from "@/lib/db/orm";
import type { AppError } from "@/lib/errors";
import { evaluateBlock, previewDraft, retuneBlock } from "@/lib/runs/preview";
import { contentBlock, drain, makeTeam, wienFixture, type TestTeam } from "./blocks-helpers";

// IEC 60063:2015, E24 series (two significant figures), as printed in the standard's table.
const E24 = [1.0, 1.1, 1.2, 1.3, 1.5, 1.6, 1.8, 2.0, 2.2, 2.4, 2.7, 3.0, 3.3, 3.6, 3.9, 4.3, 4.7, 5.1, 5.6, 6.2, 6.8, 7.5, 8.2, 9.1];
/** Nearest E24 value on a logarithmic scale (the series is geometric, so that is what "nearest" means). */
function nearestE24(x: number): number {
  const decade = 10 ** Math.floor(Math.log10(x));
  const candidates = [...E24.map((m) => m * decade), 10 * decade, 0.91 * decade];
  return candidates.reduce((best, c) => (Math.abs(Math.log(c / x)) < Math.abs(Math.log(best / x)) ? c : best));
}
const ohms = (s: string) => unit(s).toNumber("ohm");

let team: TestTeam;
const amp = () => `gain-${team.tag}`;
const wien = () => `wien-rt-${team.tag}`;
beforeAll(async () => {
  team = await makeTeam();
  await createBlock(await contextFor(team.author), { team: team.slug, text: contentBlock("noninverting-gain-11.md", amp()) });
  await createBlock(await contextFor(team.author), { team: team.slug, text: wienFixture(wien()) });
});
afterAll(async () => {
  await drain(team);
  await closeOrm();
});

describe("retune assistant", () => {
  // Non-inverting amplifier: G = 1 + Rf/Rg, so Rf = (G - 1) Rg (Horowitz & Hill, The Art of Electronics, 3rd ed., 4.2.2, from memory).
  it.each([4.3, 4.9, 3.6, 7.8, 11.5])("finds Rf for G = %s against the closed form and snaps it to E24", async (G) => {
    const r = await retuneBlock(await contextFor(team.viewer), { slug: amp(), param: "Rf", target: { quantity: "G", value: String(G) }, series: "E24" });
    const exact = (G - 1) * 10_000;
    expect(ohms(r.value) / exact).toBeCloseTo(1, 2);
    expect(ohms(r.snapped)).toBeCloseTo(nearestE24(exact), 6);
    expect((r.report.quantities.G.value)).toBeCloseTo(1 + nearestE24(exact) / 10_000, 6);
  });

  it("solves from draft values of the other parameters when they are given", async () => {
    // Same closed form with a draft Rg of 4.7 kohm instead of the file's 10 kohm: Rf = (G - 1) * 4.7 kohm.
    const r = await retuneBlock(await contextFor(team.viewer), { slug: amp(), param: "Rf", target: { quantity: "G", value: "4.3" }, series: "E24", params: { Rg: "4.7 kohm" } });
    const exact = 3.3 * 4_700;
    expect(ohms(r.value) / exact).toBeCloseTo(1, 2);
    expect(ohms(r.snapped)).toBeCloseTo(nearestE24(exact), 6);
    expect(r.report.quantities.G.value).toBeCloseTo(1 + nearestE24(exact) / 4_700, 6);
  });

  it("picks the feedback resistor that puts the Wien bridge's loop gain at 1.03 with E24 parts", async () => {
    // Loop gain (1 + Rf/Rg)/3 = 1.03 gives Rf = 2.09 Rg = 20.9 kohm; the nearest E24 value is 20 kohm.
    const r = await retuneBlock(await contextFor(team.viewer), { slug: wien(), param: "Rf", target: { quantity: "loop_gain", value: "1.03" }, series: "E24" });
    expect(ohms(r.value)).toBeCloseTo(20_900, -1);
    expect(ohms(r.snapped)).toBe(nearestE24(20_900));
    expect(ohms(r.snapped)).toBe(20_000);
    expect(r.report.quantities.loop_gain.value).toBeCloseTo(3 / 3, 6);
  });

  it("refuses an unknown parameter with a validation problem", async () => {
    const err = await retuneBlock(await contextFor(team.viewer), { slug: amp(), param: "Rx", target: { quantity: "G", value: "5" }, series: "E24" }).catch((e: AppError) => e);
    expect((err as AppError).code).toBe("validation");
  });
});

describe("live preview and evaluation (nothing stored)", () => {
  it("previews draft values with tolerance corners and skips simulated checks", async () => {
    const r = await previewDraft(await contextFor(team.viewer), { slug: wien(), params: { Rf: "18 kohm" } });
    expect(r.quantities.loop_gain.value).toBeCloseTo((1 + 18 / 10) / 3, 6);
    const [gain, sim] = r.checks;
    expect(gain.status).toBe("fail");
    expect(gain.corners?.values.length).toBeGreaterThan(1);
    expect(sim.status).toBe("skipped");
    expect(r.status).not.toBe("verified");
  });

  it("evaluates with simulation on request", async () => {
    const r = await evaluateBlock(await contextFor(team.viewer), { slug: wien(), params: { Rf: "22 kohm" }, simulate: true });
    expect(r.status).toBe("verified");
    expect(r.simulations[0].analysis).toBe("tran");
  });
});
