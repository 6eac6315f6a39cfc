import type { Page } from "playwright-core";

/** A team model file's page: its text, versions, the blocks that include it and the upload form. */
export class ModelPage {
  constructor(private readonly page: Page) {}

  async open(team: string, name: string): Promise<void> {
    await this.page.goto(`/models/${team}/${name}`);
  }

  /** What the upload form says it will verify again, before anything is sent. */
  async willReverify(): Promise<string> {
    return ((await this.page.getByTestId("will-reverify").textContent()) ?? "").trim();
  }

  async upload(text: string, message: string): Promise<string> {
    const form = this.page.getByRole("form", { name: "Upload a new version" });
    await form.getByLabel("or its text").fill(text);
    await form.getByLabel("What changed").fill(message);
    await form.getByRole("button", { name: "Upload" }).click();
    const said = form.locator("div[aria-live] p").first();
    await said.waitFor({ timeout: 30_000 });
    return ((await said.textContent()) ?? "").trim();
  }

  async openDiff(from: number, to: number): Promise<string> {
    await this.page.getByRole("link", { name: `diff with v${from}` }).first().click();
    await this.page.waitForURL(new RegExp(`from=${from}&to=${to}`));
    return (await this.page.getByRole("region", { name: `v${from} → v${to} changes` }).textContent()) ?? "";
  }
}
