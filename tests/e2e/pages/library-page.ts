import type { Page } from "playwright-core";

export class LibraryPage {
  constructor(private readonly page: Page) {}

  async open(): Promise<void> {
    await this.page.goto("/");
    await this.page.getByLabel("Search blocks").waitFor();
  }

  /** Types like a person (one key at a time) so the debounced search-as-you-type is what answers. */
  async search(text: string): Promise<void> {
    const box = this.page.getByLabel("Search blocks");
    await box.fill("");
    await box.pressSequentially(text, { delay: 40 });
  }

  resultLink(title: RegExp) {
    return this.page.getByRole("table", { name: "Search results" }).getByRole("link", { name: title });
  }
}
