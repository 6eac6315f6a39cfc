import { readFileSync } from "node:fs";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import type { Page } from "playwright-core";
import { BlockPage } from "./pages/block-page";
import { ImportPage } from "./pages/import-page";
import { RetunePage } from "./pages/retune-page";
import { SignInPage } from "./pages/sign-in-page";
import { assertNoFrameworkError, launch, shot, watchErrors } from "./support/browser";

// What the block page draws of tolerances, sweeps and Monte Carlo, and the live preview's simulations on request,
// against the demo blocks' own files and closed forms.
let close: () => Promise<void>;
let page: Page;
let errors: string[];

beforeAll(async () => {
  ({ page, close } = await launch(inject("appUrl")));
  errors = watchErrors(page);
  await new SignInPage(page).signIn("nadia.okafor@fenwick.test");
});

afterAll(async () => {
  await close?.();
});

const demo = (file: string) => readFileSync(path.resolve("content/blocks", file), "utf8");
/** Tolerances of a block file's parameters as written (`1%`, `0.05 V`), by name. */
const tolerances = (text: string) =>
  Object.fromEntries([...text.matchAll(/\{ name: (\w+), value: [^,}]+, tol: ([^,}]+)/g)].map((m) => [m[1], m[2].trim()]));
const legendItems = (figure: ReturnType<Page["getByTestId"]>) => figure.getByTestId("plot-legend").locator("li").allInnerTexts();

// A first-order RC low-pass: f3 = 1/(2 pi R C) = 2.192 kHz at 3.3 kohm and 22 nF (common practice). With R at 5 %
// and C at 10 % (3 sigma) the samples spread about 3.7 % (1 sigma), so limits at 2.1 and 2.3 kHz cut off a share of them.
const YIELD_BLOCK = `---
slug: rc-lowpass-yield-e2e
title: RC low-pass with a Monte Carlo yield
category: filter
summary: One pole whose corner frequency is checked over Monte Carlo samples.
params:
  - { name: R, value: 3.3 kohm, tol: 5% }
  - { name: C, value: 22 nF, tol: 10% }
---
A first-order RC low-pass: the -3 dB point sits at 1/(2 pi R C).

\`\`\`spice
V1 in 0 AC 1
R1 in out {R}
C1 out 0 {C}
\`\`\`

\`\`\`check
montecarlo(64)
res = ac(100 Hz, 100 kHz, 40)
f3 = f3db(res, "out")
check("corner frequency between 2.1 kHz and 2.3 kHz", f3 > 2.1 kHz and f3 < 2.3 kHz)
\`\`\`
`;

describe("tolerances, sweeps and Monte Carlo on the block page", () => {
  it("overlays the loop-gain sweep's members on one plot, named by their values", async () => {
    const block = new BlockPage(page);
    await block.open("wien-bridge-loop-gain-family");
    await block.waitForBadge("verified", 900_000);
    const figure = page.getByTestId("transient-plot").filter({ hasText: "members of a sweep" });
    await figure.waitFor({ timeout: 30_000 });
    await figure.locator("canvas").first().waitFor({ timeout: 30_000 }); // the chart is drawn once its code has loaded
    const items = await legendItems(figure);
    // The file sweeps Rf1 = (3 loop - 1) Rg - Rf2 with Rg = 10 kohm, Rf2 = 4.7 kohm and loop gains 0.95, 1.03,
    // 1.1 and 1.4: 13.8, 16.2, 18.3 and 27.3 kohm (the block's own formula, worked by hand).
    const members = items.filter((t) => /Rf1 = /.test(t) && !/worst corner/.test(t));
    expect(members).toHaveLength(4);
    ["13.8", "16.2", "18.3", "27.3"].forEach((v, i) => expect(members[i]).toMatch(new RegExp(`^out, Rf1 = ${v.replace(".", "\\.")}\\d* kΩ$`)));
    // The same four members at the worst corner, dashed, each named by its value too.
    const worst = items.filter((t) => /worst corner/.test(t));
    expect(worst).toHaveLength(4);
    expect(new Set(worst).size).toBe(4);
    await expect(figure.locator("figcaption").innerText()).resolves.toMatch(/^4 members of a sweep over Rf1\. Dashed: the same members at the worst corner/);
    await assertNoFrameworkError(page);
    await shot(page, "simulations-01-sweep-overlay");
  }, 1_000_000);

  it("draws the worst corner's waveform dashed over the nominal one, the corner named in the legend", async () => {
    const block = new BlockPage(page);
    await block.open("wien-bridge-sine-1k");
    await block.waitForBadge("verified", 900_000);
    const figure = page.getByTestId("transient-plot").filter({ hasText: "Dashed: the worst corner" });
    await figure.waitFor({ timeout: 30_000 });
    const items = await legendItems(figure);
    expect(items).toContain("out");
    const worst = items.map((t) => /^out, worst corner \((.+)\)$/.exec(t)).find(Boolean);
    expect(worst, `legend: ${items.join(" | ")}`).toBeTruthy();
    // Every parameter the corner names sits at one end of the tolerance the block file gives it.
    const tol = tolerances(demo("wien-bridge-sine-1k.md"));
    const ends = worst![1].split(", ").map((e) => /^(\w+) ([+−])(.+)$/.exec(e)!);
    expect(ends.length).toBeGreaterThan(0);
    for (const [, name, , size] of ends) expect(size.replace("Ω", "ohm")).toBe(tol[name].replace(/^(\d+(?:\.\d+)?) ?%$/, "$1%"));
    // The dashed trace is drawn as such: its legend swatch carries a dash pattern, the nominal's does not.
    const dashes = await figure.getByTestId("plot-legend").locator("li svg line").evaluateAll((ls) => ls.map((l) => l.getAttribute("stroke-dasharray")));
    expect(dashes[0]).toBeNull();
    expect(dashes[1]).toBeTruthy();
    await shot(page, "simulations-02-worst-corner");
  }, 1_000_000);

  it("shows a Monte Carlo histogram with the check's limits dashed and the yield", async () => {
    const importer = new ImportPage(page);
    await importer.open();
    await importer.read({ name: "rc-lowpass-yield-e2e.md", mimeType: "text/markdown", buffer: Buffer.from(YIELD_BLOCK) });
    await importer.create("rc-lowpass-yield-e2e");
    const block = new BlockPage(page);
    await block.waitForBadge("failing", 600_000); // the 2^2 tolerance corners fall outside 2.1–2.3 kHz
    const hist = page.getByTestId("histogram").filter({ hasText: "f3 over 64 Monte Carlo samples" });
    await hist.waitFor({ timeout: 30_000 });
    const limits = await hist.locator("line[stroke-dasharray]").evaluateAll((ls) => ls.map((l) => Number(l.getAttribute("x1"))));
    expect(limits).toHaveLength(2);
    expect(limits[0]).toBeLessThan(limits[1]); // 2.1 kHz left of 2.3 kHz
    const labels = await hist.locator("svg text").allTextContents();
    expect(labels).toContain("> 2.1 kHz");
    expect(labels).toContain("< 2.3 kHz");
    // Some samples fall outside the limits and are drawn in the failing colour (brick).
    await expect(hist.locator('rect[fill="#a63d2f"]').count()).resolves.toBeGreaterThan(0);
    const caption = await hist.locator("figcaption").innerText();
    const y = /yield (\d+(?:\.\d)?) % \((\d+(?:\.\d)?)–(\d+(?:\.\d)?) %, Wilson score, 95 %\)/.exec(caption);
    expect(y, caption).toBeTruthy();
    const [value, lo, hi] = y!.slice(1).map(Number);
    expect(lo).toBeLessThanOrEqual(value);
    expect(value).toBeLessThanOrEqual(hi);
    expect(value).toBeLessThan(100);
    // The same yield as the check's own line says.
    await expect(page.getByTestId("check-over").filter({ hasText: "Monte Carlo" }).first().innerText()).resolves.toContain(`yield ${value.toFixed(1)} %`);
    await shot(page, "simulations-03-histogram");
  }, 700_000);
});

describe("the live preview's simulations on request", () => {
  it("simulates draft values without saving: a count while it runs, then the simulated verdicts", async () => {
    errors.length = 0;
    const block = new BlockPage(page);
    await block.open("wien-bridge-sine-1k");
    await block.waitForBadge("verified", 900_000);
    const stored = async () => {
      const res = await page.request.get("/api/v1/blocks/wien-bridge-sine-1k");
      const b = (await res.json()) as { version: number; badge: string; report: unknown };
      return { version: b.version, badge: b.badge, report: JSON.stringify(b.report) };
    };
    const before = await stored();
    await block.fork();
    const retune = new RetunePage(page);
    // A value nobody simulated before, so the machine's simulation cache cannot answer at once.
    const nF = 11.5 + Math.round(Math.random() * 5000) / 10_000;
    await retune.setParam("C", `${nF} nF`);
    await retune.waitForPreviewCheck("fail", "f0 within 1 kHz");
    await retune.simulate();
    const status = retune.simulation().getByTestId("draft-sim-status");
    await page.waitForFunction(() => /simulating: \d+ of \d+ simulations/.test(document.querySelector('[data-testid="draft-sim-status"]')?.textContent ?? ""), null, { timeout: 120_000 });
    await shot(page, "simulations-04-preview-simulating");
    await retune.waitForSimulation("done");
    await expect(status.innerText()).resolves.toMatch(/after \d+ simulations/);
    const osc = retune.simulation().locator("li", { hasText: "oscillates near f0" });
    await expect(osc.getAttribute("data-status")).resolves.toMatch(/^(pass|fail)$/);
    await expect(osc.getByTestId("check-over").innerText()).resolves.toMatch(/^evaluated at (every tolerance corner|nominal and the predicted worst corners) · \d+ simulations?/);
    // f0 = 1/(2 pi R C) with R = 15.8 kohm and the draft's C (Wien bridge, Sedra & Smith, Microelectronic Circuits,
    // 7th ed., from memory): the simulated frequency follows the draft, not the saved 10 nF.
    const f0 = 1 / (2 * Math.PI * 15.8e3 * nF * 1e-9);
    const said = /freq\(.*?\) = ([\d.]+) Hz/.exec(await osc.innerText());
    expect(said, await osc.innerText()).toBeTruthy();
    expect(Number(said![1]) / f0).toBeGreaterThan(0.97);
    expect(Number(said![1]) / f0).toBeLessThan(1.03);
    await assertNoFrameworkError(page);
    await shot(page, "simulations-05-preview-simulated");
    // Nothing was saved: the block's mark and version are as they were.
    await expect(stored()).resolves.toEqual(before);
    expect(errors.filter((e) => !/favicon/.test(e))).toEqual([]);
  }, 1_000_000);

  it("cancels a simulation of draft values: it stops and no verdict is shown", async () => {
    const block = new BlockPage(page);
    await block.open("wien-bridge-loop-gain-family");
    await block.fork();
    const retune = new RetunePage(page);
    // As above: a value nobody simulated before, far enough from 10 nF that the preview's f0 check fails once it has it.
    await retune.setParam("C", `${11.5 + Math.round(Math.random() * 5000) / 10_000} nF`);
    await retune.waitForPreviewCheck("fail", "f0 within 1 kHz");
    await retune.simulate();
    await retune.simulation().getByTestId("draft-sim-progress").waitFor({ timeout: 120_000 });
    await retune.cancelSimulation();
    await retune.waitForSimulation("cancelled", 30_000);
    await expect(retune.simulation().getByTestId("draft-sim-status").innerText()).resolves.toBe("cancelled; nothing was kept");
    await page.waitForTimeout(2_000);
    await expect(retune.simulation().getAttribute("data-status")).resolves.toBe("cancelled");
    await expect(retune.simulation().getByTestId("draft-sim-report").count()).resolves.toBe(0);
    await expect(retune.simulation().getByRole("button", { name: "Simulate again" }).isVisible()).resolves.toBe(true);
    await shot(page, "simulations-06-preview-cancelled");
  }, 300_000);
});
