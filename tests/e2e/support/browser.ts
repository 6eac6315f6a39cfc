import { mkdirSync, mkdtempSync, rmSync } from "node:fs";
import os from "node:os";
import path from "node:path";
import { chromium, type BrowserContext, type Page } from "playwright-core";

export const SHOTS = path.resolve("test-results/e2e");

/**
 * Debian's Chromium, headless, with nothing reaching for the network, and a fresh profile of its own.
 * Each signed-in person gets a browser of their own, so cookies never mix.
 */
export async function launch(baseURL: string, width = 1366): Promise<{ context: BrowserContext; page: Page; close: () => Promise<void> }> {
  const profile = mkdtempSync(path.join(os.tmpdir(), "assay-chromium-"));
  const context = await chromium.launchPersistentContext(profile, {
    executablePath: "/usr/bin/chromium",
    headless: true,
    args: ["--headless", "--no-sandbox", "--disable-gpu", "--disable-background-networking", "--disable-component-update", "--disable-sync", "--no-first-run"],
    baseURL,
    viewport: { width, height: 900 },
  });
  mkdirSync(SHOTS, { recursive: true });
  const page = context.pages()[0] ?? (await context.newPage());
  return {
    context,
    page,
    close: async () => {
      await context.close();
      rmSync(profile, { recursive: true, force: true });
    },
  };
}

/** Every console error and uncaught page error, so a test can assert there were none. */
export function watchErrors(page: Page): string[] {
  const errors: string[] = [];
  page.on("console", (m) => {
    if (m.type() === "error") errors.push(`console: ${m.text()}`);
  });
  page.on("pageerror", (e) => errors.push(`page: ${e.message}`));
  // The console names a failed load without its address; record the address too.
  page.on("response", (r) => {
    if (r.status() >= 400) errors.push(`http ${r.status()}: ${r.url()}`);
  });
  return errors;
}

/** Next's error overlay or its default error page means the framework, not our page, is showing. */
export async function assertNoFrameworkError(page: Page): Promise<void> {
  const overlay = await page.locator("nextjs-portal, [data-nextjs-dialog], #__next-build-watcher").count();
  const text = await page.locator("body").innerText();
  if (overlay > 0 || /Application error: a (client|server)-side exception|Unhandled Runtime Error/.test(text)) {
    throw new Error(`framework error shown on ${page.url()}: ${text.slice(0, 400)}`);
  }
}

export async function shot(page: Page, name: string): Promise<void> {
  await page.screenshot({ path: path.join(SHOTS, `${name}.png`), fullPage: true });
}
