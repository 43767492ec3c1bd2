import { expect, type Page } from "@playwright/test";

type NoticeKind = "WARNING" | "CAUTION" | "NOTE";

/**
 * The card editor (/cards/[id]/edit), reached from the "New task card" form: one group per step,
 * a status line that says when the draft is saved, a student preview tab and the publish button.
 */
export class CardEditorPage {
  constructor(private readonly page: Page) {}

  heading(name?: string | RegExp) {
    return this.page.getByRole("heading", name === undefined ? { level: 1 } : { level: 1, name });
  }

  step(n: number) {
    return this.page.getByRole("group", { name: `Step ${n}`, exact: true });
  }

  /** On the "New task card" form: the title and subject a draft needs before the editor opens. */
  async makeDraft(title: string, subject: string) {
    await this.page.getByLabel("Title").fill(title);
    await this.page.getByLabel("Curriculum subject").selectOption({ label: subject });
    await this.page.getByRole("button", { name: /Make the draft/ }).click();
  }

  async setAtaChapter(chapter: string) {
    await this.page.getByLabel("ATA chapter").fill(chapter);
  }

  async writeInstruction(step: number, text: string) {
    await this.step(step).getByLabel("Instruction").fill(text);
  }

  async addNotice(step: number, kind: NoticeKind, text: string) {
    await this.step(step)
      .getByRole("button", { name: `+ ${kind}` })
      .click();
    await this.step(step).getByLabel("Notice text").fill(text);
  }

  /** The step asks the student for a measured value, limited as minimum and maximum. */
  async askForMeasurement(step: number, value: { label: string; unit: string; min?: string; max?: string }) {
    const group = this.step(step);
    await group.getByLabel("The student records a measured value").check();
    await group.getByLabel("What is measured").fill(value.label);
    await group.getByRole("combobox", { name: /^Unit/ }).selectOption(value.unit);
    if (value.min !== undefined) await group.getByRole("textbox", { name: "Minimum" }).fill(value.min);
    if (value.max !== undefined) await group.getByRole("textbox", { name: "Maximum" }).fill(value.max);
  }

  async addStep() {
    await this.page.getByRole("button", { name: "+ Add a step" }).click();
  }

  async waitSaved() {
    await expect(this.page.getByText(/saved at \d\d:\d\d/)).toBeVisible({ timeout: 15_000 });
  }

  /** Leaves for the library to pick a page to cite on this step. */
  async findInLibrary(step: number) {
    await this.step(step).getByRole("button", { name: "Find it in the library…" }).click();
  }

  async previewAsStudent() {
    await this.page.getByRole("tab", { name: "Preview as a student" }).click();
  }

  /** A step of the card as the student preview shows it. */
  previewStep(title: string, n: number) {
    return this.page.getByRole("article", { name: `Task card ${title}` }).getByRole("listitem", { name: `Step ${n}` });
  }

  /** The publish button, which asks once more before a version is frozen. */
  publishButton() {
    return this.page.getByRole("button", { name: "Publish…" });
  }

  /** Publishes: the button, then "Publish now" in the question it asks. */
  async publish() {
    await this.publishButton().click();
    await this.publishQuestion().getByRole("button", { name: "Publish now" }).click();
  }

  publishQuestion() {
    return this.page.getByRole("alertdialog");
  }

  /** What the saved draft still needs before publishing (opened, so the items can be read). */
  async toFinish() {
    const summary = this.page.getByText(/to finish before publishing/);
    await summary.click();
    return this.page.getByRole("list", { name: "To finish before publishing" });
  }

  /** The link back to the list of cards, in the breadcrumb above the editor. */
  cardsLink() {
    return this.page.getByRole("navigation", { name: "Breadcrumb" }).getByRole("link", { name: "Task cards" });
  }
}
