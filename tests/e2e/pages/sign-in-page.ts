import type { Page } from "playwright-core";

export class SignInPage {
  constructor(private readonly page: Page) {}

  async signIn(email: string, password = "assay-demo"): Promise<void> {
    await this.page.goto("/sign-in");
    const form = this.page.locator("form", { has: this.page.getByLabel("Password") });
    await form.getByLabel("E-mail").fill(email);
    await form.getByLabel("Password").fill(password);
    await Promise.all([
      this.page.waitForURL((u) => !u.pathname.startsWith("/sign-in"), { timeout: 30_000 }),
      form.getByRole("button", { name: "Sign in" }).click(),
    ]);
    await this.page.getByTestId("signed-in-as").waitFor({ timeout: 30_000 });
  }
}
