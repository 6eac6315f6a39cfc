import type { Page } from "playwright-core";

export class EditPage {
  constructor(private readonly page: Page) {}

  async open(slug: string): Promise<void> {
    await this.page.goto(`/blocks/${slug}/edit`);
    await this.page.getByLabel("Block file").waitFor();
  }

  /** Changes the summary line, so each tab saves a different file from the same base. */
  async changeSummary(to: string): Promise<void> {
    const editor = this.page.getByLabel("Block file");
    const text = await editor.inputValue();
    await editor.fill(text.replace(/^summary: .*$/m, `summary: ${to}`));
    await this.page.getByLabel("Message").fill(`summary: ${to}`);
  }

  async save(): Promise<void> {
    await this.page.getByRole("button", { name: /^Save as v\d+$/ }).click();
  }

  status() {
    return this.page.locator("#editor-status");
  }
}
