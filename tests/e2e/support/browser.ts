import { mkdirSync, mkdtempSync, rmSync } from "node:fs";
import os from "node:os";
import path from "node:path";
import { chromium, type Browser, type BrowserContext, type Page } from "playwright-core";

export const SHOTS = path.resolve("test-results/e2e");

/** Debian's Chromium, headless, with nothing reaching for the network, and a profile of its own. */
export async function launch(): Promise<{ browser: Browser; close: () => Promise<void> }> {
  const profile = mkdtempSync(path.join(os.tmpdir(), "assay-chromium-"));
  const browser = await chromium.launch({
    executablePath: "/usr/bin/chromium",
    args: [
      "--headless", "--no-sandbox", "--disable-gpu", "--disable-background-networking", "--disable-component-update",
      "--disable-sync", "--no-first-run", `--user-data-dir=${profile}`,
    ],
  });
  mkdirSync(SHOTS, { recursive: true });
  return {
    browser,
    close: async () => {
      await browser.close();
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
  return errors;
}

export async function newContext(browser: Browser, baseURL: string, width = 1366): Promise<BrowserContext> {
  return browser.newContext({ baseURL, viewport: { width, height: 900 } });
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
