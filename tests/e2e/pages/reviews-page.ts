import type { Page } from "playwright-core";

export class ReviewsPage {
  constructor(private readonly page: Page) {}

  async open(): Promise<void> {
    await this.page.goto("/reviews");
  }

  async approve(slug: string, version: number, comment: string): Promise<void> {
    const form = this.page.getByRole("form", { name: `Review v${version} of ${slug}` });
    await form.getByLabel("Comment").fill(comment);
    await form.getByRole("button", { name: "Approve" }).click();
    await form.getByText(`Approved v${version}.`).waitFor({ timeout: 30_000 });
  }
}
