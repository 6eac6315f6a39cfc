import type { Page } from "playwright-core";

export class BlockPage {
  constructor(private readonly page: Page) {}

  async open(slug: string): Promise<void> {
    await this.page.goto(`/blocks/${slug}`);
  }

  /** The badge the page shows once it holds the finished run's report (not only the polled state). */
  async badge(): Promise<string | null> {
    const mark = this.page.getByTestId("block-badge");
    return (await mark.getAttribute("data-run-open")) === "true" ? "pending" : mark.getAttribute("data-badge");
  }

  /** The page polls a pending run and reloads itself; a fresh load every few seconds covers runs queued behind others. */
  async waitForBadge(want: string, timeoutMs = 240_000): Promise<void> {
    const until = Date.now() + timeoutMs;
    let seen: string | null = null;
    while (Date.now() < until) {
      seen = await this.badge();
      if (seen === want) return;
      await this.page.waitForTimeout(3_000);
      if ((await this.badge()) !== want) await this.page.reload();
    }
    throw new Error(`badge stayed ${seen}, wanted ${want}`);
  }

  checks() {
    return this.page.getByTestId("check-list").first().locator("li");
  }

  async fork(): Promise<void> {
    await this.page.getByRole("link", { name: "Derive a variant" }).click();
    await this.page.getByTestId("live-preview").waitFor();
  }
}
