import type { Locator, Page } from "playwright-core";

export class ReviewsPage {
  constructor(private readonly page: Page) {}

  async open(): Promise<void> {
    await this.page.goto("/reviews");
  }

  /** One waiting version's entry: its checks and its changes since the last approved version. */
  entry(slug: string, version: number): Locator {
    return this.page.locator(`[data-testid=review-entry][data-slug="${slug}"][data-version="${version}"]`);
  }

  async approve(slug: string, version: number, comment: string): Promise<void> {
    const form = this.page.getByRole("form", { name: `Review v${version} of ${slug}` });
    await form.getByLabel("Comment").fill(comment);
    await form.getByRole("button", { name: "Approve" }).click();
    const said = form.locator("p[aria-live]");
    await this.page.waitForFunction((el) => Boolean(el?.textContent?.trim()), await said.elementHandle(), { timeout: 30_000 });
    const text = (await said.textContent())?.trim();
    if (text !== `Approved v${version}.`) throw new Error(`approval refused: ${text}`);
  }
}
