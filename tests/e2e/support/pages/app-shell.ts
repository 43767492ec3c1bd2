import { expect, type Page } from "@playwright/test";

export class AppShell {
  constructor(private readonly page: Page) {}

  nav() {
    return this.page.getByRole("navigation", { name: "Main" });
  }

  async navLabels(): Promise<string[]> {
    return (await this.nav().getByRole("link").allTextContents()).map((t) => t.trim());
  }

  async signOut() {
    await this.page.getByRole("button", { name: "Sign out" }).click();
    await expect(this.page.getByRole("heading", { name: "Sign in" })).toBeVisible();
  }
}
