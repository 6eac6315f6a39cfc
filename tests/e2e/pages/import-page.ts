import type { Page } from "playwright-core";

export class ImportPage {
  constructor(private readonly page: Page) {}

  async open(): Promise<void> {
    await this.page.goto("/import");
  }

  async read(file: { name: string; mimeType: string; buffer: Buffer }): Promise<void> {
    await this.page.getByLabel("Block file or SPICE netlist").setInputFiles(file);
    await this.page.getByRole("button", { name: "Read the file" }).click();
    await this.page.waitForFunction(() => (document.querySelector("#import-text") as HTMLTextAreaElement | null)?.value.includes("---"), null, { timeout: 30_000 });
  }

  /** The parameters the import found, by name, as the table before creating shows them. */
  async params(): Promise<string[]> {
    return this.page.getByTestId("import-params").locator("tbody tr td:first-child").evaluateAll((tds) => tds.map((td) => td.textContent!.trim().split(/\s+/)[0]));
  }

  async setTolerance(name: string, tol: string): Promise<void> {
    await this.page.getByLabel(`${name} tolerance`).fill(tol);
  }

  blockText(): Promise<string> {
    return this.page.locator("#import-text").inputValue();
  }

  droppedLines() {
    return this.page.getByTestId("dropped-lines");
  }

  /** Creates the block; if the server refuses, fail with its words rather than a bare timeout. */
  async create(slug: string): Promise<void> {
    await this.page.getByRole("button", { name: "Create the block" }).click();
    const refused = this.page.locator("#create-status [role=alert]");
    await Promise.race([this.page.waitForURL(`**/blocks/${slug}`, { timeout: 60_000 }), refused.waitFor({ timeout: 60_000 })]);
    if (!this.page.url().includes(`/blocks/${slug}`)) throw new Error(`import refused: ${await this.page.locator("#create-status").innerText()}`);
  }
}
