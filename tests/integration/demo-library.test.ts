import { mkdtempSync, readdirSync, readFileSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { afterAll, describe, expect, it } from "vitest";
import { parseBlock, verifyBlock } from "@/checks";

// The demo library must verify end to end: each block's design equations, tolerance corners
// and ngspice simulations (real ngspice, no cache from earlier runs). The expected results
// come from the closed-form sources each block's note names; ngspice is the outside reference.
const DIR = path.resolve(__dirname, "../../content/blocks");
const BLOCKS = [
  "diode-clamp-adc-input.md",
  "diode-vf-reference-tempco.md",
  "lc-chebyshev-lowpass-10k.md",
  "mains-bias-rail-5v1.md",
  "noninverting-gain-11-loop.md",
  "noninverting-gain-11.md",
  "npn-current-sink-2ma.md",
  "npn-current-sink-temp-compensated.md",
  "opamp-astable-100hz.md",
  "opamp-soft-limiter.md",
  "push-pull-buffer-class-ab.md",
  "rc-highpass-ac-coupling.md",
  "rc-lowpass-antialias.md",
  "rc-phase-shift-oscillator.md",
  "sallen-key-lowpass-unity.md",
  "twin-t-notch-1k.md",
  "wien-bridge-loop-gain-family.md",
  "wien-bridge-sine-1k.md",
  "wien-bridge-under-gain.md",
  "zener-clamp-5v1.md",
  "zener-shunt-reference-5v1.md",
];
const CATEGORIES = ["oscillator", "limiter", "filter", "amplifier", "reference", "power", "interface", "other"];

const cacheDir = mkdtempSync(path.join(tmpdir(), "assay-demo-cache-"));
afterAll(() => rmSync(cacheDir, { recursive: true, force: true }));

describe("demo library", () => {
  it("holds exactly the listed blocks, with unique slugs matching their file names", () => {
    expect(readdirSync(DIR).filter((f) => f.endsWith(".md")).sort()).toEqual(BLOCKS);
    const slugs = BLOCKS.map((f) => {
      const { block, errors } = parseBlock(readFileSync(path.join(DIR, f), "utf8"));
      expect(errors, f).toEqual([]);
      expect(CATEGORIES, f).toContain(block!.category);
      return block!.slug;
    });
    expect(slugs).toEqual(BLOCKS.map((f) => f.replace(/\.md$/, "")));
    expect(new Set(slugs).size).toBe(slugs.length);
  });

  it("carries cautions on every block marked with a hazard", () => {
    const hazardous = BLOCKS.map((f) => parseBlock(readFileSync(path.join(DIR, f), "utf8")).block!).filter((b) => b.hazard.length > 0);
    expect(hazardous.length).toBeGreaterThan(0);
    for (const b of hazardous) {
      expect(b.note, b.slug).toMatch(/Caution/);
      expect(b.note, b.slug).toMatch(/codes/);
    }
  });

  for (const file of BLOCKS) {
    it(`${file} verifies`, async () => {
      const text = readFileSync(path.join(DIR, file), "utf8");
      const { report } = await verifyBlock(text, { simulate: true, cacheDir, timeoutMs: 60_000 });
      const failing = report.checks.filter((c) => c.status !== "pass").map((c) => `${c.label}: ${c.status} ${c.detail}`);
      expect({ status: report.status, failing, errors: report.errors }, file).toEqual({ status: "verified", failing: [], errors: [] });
      // Each block both states a design equation and exercises ngspice.
      expect(report.checks.some((c) => c.simulated), file).toBe(true);
      expect(report.checks.some((c) => !c.simulated), file).toBe(true);
      expect(report.simulations.length, file).toBeGreaterThan(0);
    }, 120_000);
  }

  // The demos of the newer analyses: what each one simulated, and its measures reported beside the hand values.
  for (const [file, analyses, measured] of [
    ["lc-chebyshev-lowpass-10k.md", ["ac"], ["ripple_sim", "stop_att"]],
    ["noninverting-gain-11-loop.md", ["ac", "noise"], ["pm", "fu_sim", "en", "vn"]],
    ["diode-vf-reference-tempco.md", ["dc"], ["V27", "tc", "T_sim"]],
  ] as [string, string[], string[]][]) {
    it(`${file} runs ${analyses.join(" and ")} and reports its measures`, async () => {
      const text = readFileSync(path.join(DIR, file), "utf8");
      const { report, waveforms } = await verifyBlock(text, { simulate: true, cacheDir, timeoutMs: 60_000 });
      expect([...new Set(report.simulations.map((s) => s.analysis))].sort()).toEqual(analyses);
      for (const q of measured) expect(report.quantities[q], `${file} ${q}`).toMatchObject({ simulated: true });
      expect(waveforms.map((w) => w.analysis)).toEqual(expect.arrayContaining(analyses));
    }, 120_000);
  }

  // A fork damped so hard that the kick dies to the solver's residue (loop gain (1 + 1.1/40)/3 ≈ 0.34):
  // freq, thd and startup on its last 10 ms have nothing to measure, so they give no number and
  // every check on them fails with the reason (DESIGN.md "Check scripts").
  it("wien-bridge-sine-1k damped to nothing: freq, thd and startup refuse to give a number", async () => {
    const text = readFileSync(path.join(DIR, "wien-bridge-sine-1k.md"), "utf8");
    const params = { Rf1: "1 kohm", Rf2: "100 ohm", Rg: "40 kohm" };
    const { report } = await verifyBlock(text, { simulate: true, cacheDir, timeoutMs: 60_000, params });
    const check = (label: string) => report.checks.find((c) => c.label === label)!;
    expect(check("oscillates near f0")).toMatchObject({ status: "fail", detail: expect.stringMatching(/= NaN Hz .*freq\(\): "out" does not oscillate between 0.03 s and 0.04 s/) });
    expect(check("distortion below 4%")).toMatchObject({ status: "fail", detail: expect.stringMatching(/thd\(\): "out" does not oscillate/) });
    expect(check("start-up no faster than the linear growth")).toMatchObject({ status: "fail", detail: expect.stringMatching(/startup\(\): "out" never reaches/) });
    expect(report.status).toBe("failing");
  }, 120_000);

  // A fork of the Wien bridge that breaks the design must fail clearly, not stop with an error:
  // below a loop gain of one there is no oscillation (Barkhausen criterion, Sedra & Smith,
  // Microelectronic Circuits, 7th ed., op amp–RC oscillators, from memory); with A_on >= 3 the
  // diodes cannot settle the amplitude (the block's own hand analysis).
  for (const params of [{ Rf2: "1 kohm" }, { Rf1: "10 kohm" }, { Rg: "5 kohm" }] as Record<string, string>[]) {
    it(`wien-bridge-sine-1k with ${JSON.stringify(params)} is failing, every check evaluated`, async () => {
      const text = readFileSync(path.join(DIR, "wien-bridge-sine-1k.md"), "utf8");
      const { report } = await verifyBlock(text, { simulate: true, cacheDir, timeoutMs: 60_000, params });
      expect(report.errors).toEqual([]);
      expect(report.status).toBe("failing");
      expect(report.checks.filter((c) => c.status === "error")).toEqual([]);
      const gainCheck = Object.keys(params)[0] === "Rg" ? "gain with diodes on below 3 at every corner" : "small-signal loop gain above 1 at every corner";
      expect(report.checks.find((c) => c.label === gainCheck)?.status).toBe("fail");
    }, 120_000);
  }
});
