import { expect, type Page } from "@playwright/test";

export const demoPassword = process.env.HL_DEMO_PASSWORD ?? "hangarleaf-demo";
export const outboxUrl = process.env.HL_OUTBOX_URL ?? "http://127.0.0.1:2526";

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

export async function waitForMailTo(to: string, subject: RegExp): Promise<string> {
  const deadline = Date.now() + 20_000;
  while (Date.now() < deadline) {
    const response = await fetch(`${outboxUrl}/messages`);
    const { messages } = (await response.json()) as { messages: { to: string[]; subject: string; text: string }[] };
    const found = messages.find((m) => m.to.includes(to) && subject.exec(m.subject) !== null);
    if (found) return found.text;
    await new Promise((r) => setTimeout(r, 300));
  }
  throw new Error(`no mail to ${to}`);
}
