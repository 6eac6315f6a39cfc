import { afterAll, beforeAll, describe, inject, it } from "vitest";
import { BlockPage } from "./pages/block-page";
import { SignInPage } from "./pages/sign-in-page";
import { launch } from "./support/browser";

const OUT = "/tmp/scr";
const pages = (process.env.LOOK_PAGES ?? "/blocks/rc-step-family-look,/blocks/wien-bridge-sine-1k,/blocks/rc-lowpass-antialias,/import,/blocks/wien-bridge-sine-1k/fork?from=1,/blocks/wien-bridge-sine-1k/runs,/reviews,/blocks/rc-lowpass-antialias/compare?a=1&b=1").split(",");
let sessions: { width: number; s: Awaited<ReturnType<typeof launch>> }[] = [];

beforeAll(async () => {
  const s = await launch(inject("appUrl"), 1366);
  await new SignInPage(s.page).signIn(process.env.LOOK_USER ?? "tomas.reyes@fenwick.test");
  sessions = [{ width: 1366, s }, { width: 390, s }];
});
afterAll(async () => { await sessions[0]?.s.close(); });

describe("look", () => {
  it("shoots", async () => {
    const first = sessions[0].s.page;
    const md = `---
slug: rc-step-family-look
title: RC step, a family over C
category: filter
summary: Look at sweeps and Monte Carlo.
params:
  - { name: R, value: 1 kohm, tol: 1% }
  - { name: C, value: 1 uF, tol: 5% }
  - { name: Vs, value: 1 V }
---
Family.

\`\`\`spice
V1 in 0 DC {Vs}
R1 in out {R}
C1 out 0 {C}
.ic v(out)=0
\`\`\`

\`\`\`check
montecarlo(40)
fam = tran(5 ms, 10 us, "uic", sweep("C", [0.5 uF, 1 uF, 2 uF]))
res = tran(5 ms, 10 us, "uic")
V4 = avg(res, "out", 4 ms, 5 ms)
check("settled", near(V4, 0.98 V, 1%))
check("family settles", avg(fam, "out", 4 ms, 5 ms) > 0.8 V)
\`\`\`
`;
    await first.goto("/import");
    await first.getByLabel("Block file or SPICE netlist").setInputFiles({ name: "f.md", mimeType: "text/markdown", buffer: Buffer.from(md) });
    await first.getByRole("button", { name: "Read the file" }).click();
    await first.waitForTimeout(1500);
    await first.getByRole("button", { name: "Create the block" }).click();
    await first.waitForTimeout(3000);
    for (const slug of ["rc-step-family-look", "wien-bridge-sine-1k", "wien-bridge-under-gain", "rc-lowpass-antialias"]) {
      await new BlockPage(first).open(slug);
      for (let i = 0; i < 60 && (await new BlockPage(first).badge()) === "pending"; i++) { await first.waitForTimeout(3000); await first.reload(); }
    }
    for (const { width, s } of sessions) {
      await s.page.setViewportSize({ width, height: 900 });
      for (const p of pages) {
        await s.page.goto(p);
        await s.page.waitForLoadState("networkidle").catch(() => undefined);
        await s.page.waitForTimeout(800);
        const name = p.replace(/[^a-z0-9]+/gi, "_").replace(/^_/, "");
        await s.page.screenshot({ path: `${OUT}/${name}-${width}.png`, fullPage: true });
        if (width === 1366) await s.page.screenshot({ path: `${OUT}/${name}-${width}-fold.png` });
      }
    }
  });
});
