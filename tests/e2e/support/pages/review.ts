import { type Page } from "@playwright/test";

/**
 * The review screen: the list of handed-in runs (/review) and one run with the reviewer's
 * decision (/review/[runId]): return it with a comment, or sign it off.
 */
export class ReviewPage {
  constructor(private readonly page: Page) {}

  async open(runId?: string) {
    await this.page.goto(runId === undefined ? "/review" : `/review/${runId}`);
  }

  listHeading() {
    return this.page.getByRole("heading", { level: 1, name: "Review" });
  }

  /** Opens the first run in the list by this student. */
  async openRunOf(student: string) {
    await this.page.getByRole("link", { name: student }).first().click();
  }

  decisionHeading() {
    return this.page.getByRole("heading", { level: 2, name: "Your decision" });
  }

  async writeComment(comment: string) {
    await this.page.getByLabel(/Comment for the student/).fill(comment);
  }

  async returnWithComment(comment: string) {
    await this.writeComment(comment);
    await this.page.getByRole("button", { name: "Send back for rework" }).click();
  }

  /** Ticks the steps to do again before sending the run back. */
  async reopenSteps(...numbers: number[]) {
    for (const n of numbers) await this.page.getByRole("checkbox", { name: new RegExp(`^Step ${n}\\b`) }).check();
  }

  /** Signs the run off, with a comment for the student if one is given, confirming with the password. */
  async signOff(comment?: string, password = "hangarleaf-demo") {
    if (comment !== undefined) await this.writeComment(comment);
    await this.page.getByRole("button", { name: "Sign off…" }).click();
    await this.page.getByLabel("Your password, to confirm it is you").fill(password);
    await this.page.getByRole("button", { name: "Sign off now" }).click();
  }

  /** The queue of inspection points waiting for buy-off. */
  async openBuyOffQueue() {
    await this.page.goto("/review?tab=buy-offs");
  }
}
