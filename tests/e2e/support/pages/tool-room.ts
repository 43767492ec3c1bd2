import type { Page } from "@playwright/test";

/** The tool room's lending desk (/tools): scan or pick, lend, count back in. */
export class ToolRoomPage {
  constructor(private readonly page: Page) {}

  async open() {
    await this.page.goto("/tools");
  }

  /** Types a label's number and Enter, as a USB scanner does. */
  async scan(code: string) {
    await this.page.getByLabel("Scan the label, or type its number").fill(code);
    await this.page.keyboard.press("Enter");
  }

  scanSays() {
    return this.page.locator("#lend-code-said");
  }

  async lendTo(student: string, forRun: string | null) {
    await this.page.getByLabel("Student").selectOption({ label: student });
    if (forRun) await this.page.getByLabel("For").selectOption({ label: `The run of "${forRun}"` });
    await this.page.getByRole("button", { name: "Lend", exact: true }).click();
  }

  /** Opens the count-in of a loan, unticks the missing tools by number, and counts it in. */
  async countIn(what: string, missing: string[]) {
    await this.page.getByRole("button", { name: `Count in ${what}` }).click();
    const form = this.page.getByRole("form", { name: `Count in ${what}` });
    for (const number of missing) await form.getByRole("checkbox", { name: new RegExp(`^${number} `) }).uncheck();
    await form.getByRole("button", { name: /^Count in, / }).click();
  }
}
