import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import type { Page } from "playwright-core";
import { BlockPage } from "./pages/block-page";
import { ImportPage } from "./pages/import-page";
import { PlotVerdict } from "./pages/plot-verdict";
import { RetunePage } from "./pages/retune-page";
import { SignInPage } from "./pages/sign-in-page";
import { assertNoFrameworkError, launch, shot } from "./support/browser";

// What the pages say about a verdict, checked against the circuit itself: plots, refusals at their field,
// import, and the mark.
let close: () => Promise<void>;
let page: Page;

beforeAll(async () => {
  ({ page, close } = await launch(inject("appUrl")));
  await new SignInPage(page).signIn("nadia.okafor@fenwick.test");
});

afterAll(async () => {
  await close?.();
});

// A 1 V step into R = 1 kΩ, C = 1 µF from rest: v(t) = 1 − e^(−t/RC) (first-order step response, common practice),
// so its mean over 4–5 ms is 1 − (e^−4 − e^−5) = 0.988 V. The check expects 0.8 V ± 5 %, so it must fail high.
const FAILING_STEP = `---
slug: rc-step-miss-e2e
title: RC step that misses its settled level
category: filter
summary: A first-order RC charged from 1 V whose check expects too little.
params:
  - { name: R, value: 1 kohm, tol: 1% }
  - { name: C, value: 1 uF, tol: 5% }
  - { name: Vs, value: 1 V }
---
The capacitor charges towards the source with time constant RC.

\`\`\`spice
V1 in 0 DC {Vs}
R1 in out {R}
C1 out 0 {C}
.ic v(out)=0
\`\`\`

\`\`\`check
tau = R * C
res = tran(5 ms, 10 us, "uic")
check("settles to the expected level", near(avg(res, "out", 4 ms, 5 ms), 0.8 V, 5%))
\`\`\`
`;

describe("trust on screen", () => {
  it("draws a failing transient's measured value outside its dashed band, in the failing colour", async () => {
    const importer = new ImportPage(page);
    await importer.open();
    await importer.read({ name: "rc-step-miss-e2e.md", mimeType: "text/markdown", buffer: Buffer.from(FAILING_STEP) });
    await importer.create("rc-step-miss-e2e");
    const block = new BlockPage(page);
    await block.waitForBadge("failing");
    const plot = new PlotVerdict(page);
    await plot.waitFor();
    const check = "settles to the expected level";
    const band = await plot.guides(check, "band");
    const [target] = await plot.guides(check, "target");
    const mark = await plot.measured(check);
    expect(band).toHaveLength(2);
    expect(mark.status).toBe("fail");
    expect(mark.colour.toLowerCase()).toBe("#a63d2f"); // brick, the failing colour
    // Screen y grows downwards: the mark sits above the band's upper edge, as 0.988 V lies above 0.84 V.
    expect(mark.y).toBeLessThan(Math.min(...band));
    expect(target).toBeGreaterThan(Math.min(...band));
    expect(target).toBeLessThan(Math.max(...band));
    expect(await plot.legendText()).toMatch(/tolerance band/);
    expect(await plot.legendText()).toMatch(/measured, fails/);
    // The check says by how much it misses, in volts and in percent.
    await expect(page.getByTestId("check-margin").first().innerText()).resolves.toMatch(/misses the upper limit 840 mV by 14\d(\.\d)? mV \(1\d(\.\d)? %\)/);
    await assertNoFrameworkError(page);
    await shot(page, "trust-01-failing-transient");
  });

  it("refuses a negative resistance at its own field and keeps everything else as typed", async () => {
    await page.goto("/blocks/rc-lowpass-antialias/fork?from=1");
    const retune = new RetunePage(page);
    await retune.preview().waitFor();
    await retune.setParam("R", "-4.7 kohm");
    const typed = { slug: "rc-lowpass-negative-e2e", title: "Low-pass with a sign slip", message: "trying the other sign" };
    await retune.fillFork(typed);
    await retune.clickSaveFork();
    await retune.paramError("R").waitFor({ timeout: 30_000 });
    expect(await retune.paramError("R").innerText()).toMatch(/resistance must be positive/);
    expect(page.url()).toContain("/blocks/rc-lowpass-antialias/fork");
    expect(await retune.forkFields()).toEqual(typed);
    expect(await retune.paramValue("R")).toBe("-4.7 kohm");
    expect(await retune.paramValue("C")).not.toBe("");
    await shot(page, "trust-02-negative-resistance");
  });

  it("imports a plain netlist as parameters that the retune assistant can move", async () => {
    const netlist = "RC from the bench\nV1 in 0 DC 5\nR1 in out 4.7k\nC1 out 0 100n\n.tran 1u 2m\n.end\n";
    const importer = new ImportPage(page);
    await importer.open();
    await importer.read({ name: "rc-import-e2e.cir", mimeType: "text/plain", buffer: Buffer.from(netlist) });
    expect(await importer.params()).toEqual(["V1", "R1", "C1"]);
    await importer.setTolerance("C1", "10%");
    const text = await importer.blockText();
    expect(text).toMatch(/name: C1, value: 100 nF, tol: 10%/);
    expect(text).toContain("R1 in out {R1}");
    expect(text).toContain("tau_R1_C1 = R1 * C1 to s");
    await importer.create("rc-import-e2e");
    await page.goto("/blocks/rc-import-e2e/fork");
    const retune = new RetunePage(page);
    await retune.preview().waitFor();
    // τ = RC (common practice): 1 ms with 100 nF wants R = 10 kΩ, an E24 value.
    const used = await retune.retune("R1", "tau_R1_C1", "1 ms");
    expect(used).toMatch(/10\s?k/);
    await expect(retune.paramValue("R1")).resolves.toMatch(/^10(\.0+)?\s?k/);
    await shot(page, "trust-03-import-retune");
  });

  it("answers another team's block page and a missing one with HTTP 404 and the not-found page", async () => {
    // Maren is in Larkspur only; twin-t-notch-1k is a Fenwick team block (not on the seed's public list).
    const own = await page.goto("/blocks/twin-t-notch-1k");
    expect(own?.status()).toBe(200);
    const { page: partner, close: closePartner } = await launch(inject("appUrl"));
    try {
      await new SignInPage(partner).signIn("maren.holt@larkspur.test");
      for (const path of ["/blocks/twin-t-notch-1k", "/blocks/twin-t-notch-1k/fork", "/blocks/twin-t-notch-1k/runs", "/blocks/no-such-block-e2e"]) {
        const res = await partner.goto(path);
        expect(res?.status(), path).toBe(404);
        await partner.getByRole("heading", { level: 1, name: "Not in the library" }).waitFor();
        expect(await partner.getByText(/Twin-T/i).count(), path).toBe(0);
      }
      await shot(partner, "trust-05-other-team-404");
    } finally {
      await closePartner();
    }
  });

  it("serves the badge as a hexagon of one width whatever the state", async () => {
    const hexOf = async (slug: string) => {
      const res = await page.request.get(`/api/v1/blocks/${slug}/badge.svg`);
      expect(res.status()).toBe(200);
      const svg = await res.text();
      const d = /<path d="([^"]+)"/.exec(svg)![1];
      const xs = [...d.matchAll(/[MLQ]\s*(-?[\d.]+)/g)].map((m) => Number(m[1]));
      return { state: /data-badge="(\w+)"/.exec(svg)![1], sides: (d.match(/L/g) ?? []).length, width: Math.max(...xs) - Math.min(...xs) };
    };
    const failing = await hexOf("rc-step-miss-e2e");
    const verified = await hexOf("rc-lowpass-antialias");
    expect([failing.state, verified.state]).toEqual(["failing", "verified"]);
    expect(failing.sides).toBe(6);
    expect(verified.sides).toBe(6);
    expect(failing.width).toBeCloseTo(verified.width, 6);
  });
});
