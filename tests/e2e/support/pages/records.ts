import { readFile } from "node:fs/promises";
import { type Page } from "@playwright/test";

/**
 * The records: the list of classes (/records), a class's progress (/records/classes/[id]) and one
 * student's training record (/records/students/[id]) with its CSV and PDF exports.
 */
export class RecordsPage {
  constructor(private readonly page: Page) {}

  async open() {
    await this.page.goto("/records");
  }

  async openClass(name: string) {
    await this.page.getByRole("link", { name: new RegExp(name) }).click();
  }

  /** From the class's table of students (the standard's grid names them too). */
  async openStudent(name: string) {
    await this.page.getByRole("region", { name: "Students" }).getByRole("link", { name }).click();
  }

  recordHeading(student: string) {
    return this.page.getByRole("heading", { level: 1, name: `Training record: ${student}` });
  }

  /** The row of a signed-off task card in the "signed off, by curriculum subject" tables. */
  signedOffRow(title: string) {
    return this.page.getByRole("region", { name: "Signed off by subject" }).getByRole("row").filter({ hasText: title });
  }

  /** Clicks "Export CSV" and gives the downloaded file's name and text. */
  async downloadCsv(): Promise<{ name: string; text: string }> {
    const [download] = await Promise.all([this.page.waitForEvent("download"), this.page.getByRole("link", { name: "Export CSV" }).click()]);
    return { name: download.suggestedFilename(), text: await readFile((await download.path())!, "utf8") };
  }
}
