import { type Page } from "@playwright/test";

/**
 * The cart's run screen (/cart/run?id=…), which works offline: the steps with their notices,
 * readings, notes and cited pages, the badge that counts changes waiting to be sent, and the hand-in.
 */
export class CartRunnerPage {
  constructor(private readonly page: Page) {}

  async open(runId: string) {
    await this.page.goto(`/cart/run?id=${runId}`);
  }

  /** The run's id, from the address. */
  runId() {
    return new URL(this.page.url()).searchParams.get("id");
  }

  /** Resolves once the service worker controls the page, so that it answers when the network goes. */
  async waitForServiceWorker() {
    const controlled = () =>
      this.page
        .waitForFunction(() => navigator.serviceWorker.controller !== null, undefined, { timeout: 45_000 })
        .then(() => true)
        .catch(() => false);
    if (await controlled()) return;
    // A student would reload a cart page that does not say it is ready offline; so does the test,
    // once, before it says what the registration was doing.
    await this.page.reload();
    if (await controlled()) return;
    const states = await this.page.evaluate(async () => {
      const r = await navigator.serviceWorker.getRegistration();
      return r ? { installing: r.installing?.state, waiting: r.waiting?.state, active: r.active?.state } : "no registration";
    });
    throw new Error(`the service worker does not control the cart page after a reload: ${JSON.stringify(states)}`);
  }

  heading(name: string | RegExp) {
    return this.page.getByRole("heading", { level: 1, name });
  }

  /** Online or offline, and how many changes wait to be sent. */
  cartStatus() {
    return this.page.getByTestId("cart-status");
  }

  /** Where the run stands: in progress, handed in, returned, signed off. */
  runStatus() {
    return this.page.getByTestId("run-status");
  }

  instructorComment() {
    return this.page.getByRole("note", { name: "Instructor's comment" });
  }

  notStoredMessage() {
    return this.page.getByText("This run is not stored on this laptop.");
  }

  async showAllSteps() {
    await this.page.getByRole("button", { name: "All steps" }).click();
  }

  step(n: number) {
    return this.page.getByRole("listitem", { name: `Step ${n}` });
  }

  /** Fills the step's measured value (its field is named by what is measured) and records it. */
  async recordReading(step: number, measured: string | RegExp, value: string) {
    await this.step(step).getByLabel(measured).fill(value);
    await this.step(step).getByRole("button", { name: "Record this reading" }).click();
  }

  /** The last reading recorded on the step, with its judgement against the limits. */
  recordedReading(step: number) {
    return this.step(step).getByTestId(`recorded-${step}`);
  }

  async addNote(step: number, text: string) {
    await this.step(step).getByLabel("Note on this step").fill(text);
    await this.step(step).getByRole("button", { name: "Add note" }).click();
  }

  async completeStep(n: number) {
    await this.step(n)
      .getByRole("button", { name: `Mark step ${n} done` })
      .click();
  }

  /** The button that shows a cited manual page, anywhere on the run. */
  citedPageButton(pageNumber: number) {
    return this.page.getByRole("button", { name: new RegExp(`Show page ${pageNumber}`) });
  }

  async showCitedPage(step: number, pageNumber: number) {
    await this.step(step)
      .getByRole("button", { name: new RegExp(`Show page ${pageNumber}`) })
      .click();
  }

  /** Opens the calculator inside the step (it is part of the cart's code, so it works offline). */
  async openCalculator(step: number) {
    await this.step(step)
      .getByText(/^Calculator for this step/)
      .click();
  }

  async callInstructor(step: number) {
    await this.step(step)
      .getByRole("button", { name: `Call my instructor to buy off step ${step}` })
      .click();
  }

  async handIn() {
    await this.page.getByRole("button", { name: "Hand in for inspection" }).click();
  }
}
