import type { Page } from "playwright-core";

export class RetunePage {
  constructor(private readonly page: Page) {}

  async setParam(name: string, value: string): Promise<void> {
    const input = this.page.locator(`input[data-param="${name}"]`);
    await input.fill(value);
  }

  paramValue(name: string): Promise<string> {
    return this.page.locator(`input[data-param="${name}"]`).inputValue();
  }

  /** The refusal shown at one parameter's field after a save. */
  paramError(name: string) {
    return this.page.getByTestId(`param-error-${name}`);
  }

  /** Fills the fork's own fields and saves; the caller decides whether a refusal or the new block's page follows. */
  async fillFork(fields: { slug: string; title: string; message: string }): Promise<void> {
    await this.page.getByLabel(/a fork/).check();
    await this.page.getByLabel("Slug of the fork (optional)").fill(fields.slug);
    await this.page.getByLabel("Title (optional)").fill(fields.title);
    await this.page.getByLabel("Message").fill(fields.message);
  }

  async clickSaveFork(): Promise<void> {
    await this.page.getByRole("button", { name: "Save the fork" }).click();
  }

  forkFields(): Promise<{ slug: string; title: string; message: string }> {
    return Promise.all([
      this.page.getByLabel("Slug of the fork (optional)").inputValue(),
      this.page.getByLabel("Title (optional)").inputValue(),
      this.page.getByLabel("Message").inputValue(),
    ]).then(([slug, title, message]) => ({ slug, title, message }));
  }

  preview() {
    return this.page.getByTestId("live-preview");
  }

  async waitForPreviewCheck(status: "pass" | "fail", label: string): Promise<void> {
    await this.preview().locator(`li[data-status="${status}"]`, { hasText: label }).waitFor({ timeout: 30_000 });
  }

  /** The live preview's simulations on request. */
  simulation() {
    return this.page.getByTestId("draft-simulation");
  }

  async simulate(): Promise<void> {
    await this.simulation().getByRole("button", { name: /^Simulate (these values|again)$/ }).click();
  }

  async cancelSimulation(): Promise<void> {
    await this.simulation().getByRole("button", { name: "Cancel" }).click();
  }

  /** Waits for the simulation panel's state: starting, queued, running, done, error or cancelled. */
  async waitForSimulation(status: string, timeoutMs = 240_000): Promise<void> {
    await this.page.locator(`[data-testid="draft-simulation"][data-status="${status}"]`).waitFor({ timeout: timeoutMs });
  }

  async retune(param: string, quantity: string, target: string, series = "E24"): Promise<string> {
    const box = this.page.getByTestId("retune-assistant");
    await box.getByLabel("Parameter").selectOption(param);
    await box.getByLabel("Quantity").selectOption(quantity);
    await box.getByLabel("Series").selectOption(series);
    await box.getByLabel("Target").fill(target);
    await box.getByRole("button", { name: "Solve" }).click();
    const result = this.page.getByTestId("retune-result");
    await result.waitFor({ timeout: 30_000 });
    const use = result.getByRole("button", { name: /^Use / });
    const text = (await use.textContent()) ?? "";
    await use.click();
    return text;
  }

  async saveAsFork(slug: string): Promise<void> {
    await this.page.getByLabel(/a fork/).check();
    await this.page.getByLabel(/Slug of the fork/).fill(slug);
    await Promise.all([this.page.waitForURL(`**/blocks/${slug}`, { timeout: 60_000 }), this.page.getByRole("button", { name: "Save the fork" }).click()]);
  }

  async saveAsVersion(slug: string, message: string): Promise<void> {
    await this.page.getByLabel(/the next version of this block/).check();
    await this.page.getByLabel("Message").fill(message);
    await Promise.all([this.page.waitForURL(`**/blocks/${slug}`, { timeout: 60_000 }), this.page.getByRole("button", { name: "Save the version" }).click()]);
  }
}
