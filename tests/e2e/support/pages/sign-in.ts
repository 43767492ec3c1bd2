import { expect, type Page } from "@playwright/test";

export const demoPassword = process.env.HL_DEMO_PASSWORD ?? "hangarleaf-demo";

export class SignInPage {
  constructor(private readonly page: Page) {}

  async open(path = "/sign-in") {
    await this.page.goto(path);
    await expect(this.page.getByRole("heading", { name: "Sign in" })).toBeVisible();
  }

  async signIn(email: string, password = demoPassword) {
    await this.page.getByLabel("E-mail").fill(email);
    await this.page.getByLabel("Password").fill(password);
    await this.page.getByRole("button", { name: "Sign in" }).click();
  }
}
