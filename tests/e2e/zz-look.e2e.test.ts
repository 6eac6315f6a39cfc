import { afterAll, beforeAll, describe, inject, it } from "vitest";
import { BlockPage } from "./pages/block-page";
import { SignInPage } from "./pages/sign-in-page";
import { launch } from "./support/browser";

const OUT = "/tmp/scr";
const pages = (process.env.LOOK_PAGES ?? "/blocks/wien-bridge-sine-1k,/blocks/wien-bridge-under-gain,/blocks/rc-lowpass-antialias,/blocks/wien-bridge-sine-1k/fork?from=1,/blocks/wien-bridge-sine-1k/runs,/reviews,/blocks/rc-lowpass-antialias/compare?a=1&b=1").split(",");
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
    for (const slug of ["wien-bridge-sine-1k", "wien-bridge-under-gain", "rc-lowpass-antialias"]) {
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
