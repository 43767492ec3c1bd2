import { type Page } from "@playwright/test";
import { escapeRegExp } from "@/lib/domain/escape";

/**
 * The manual reader (/library/[manualId]/[revisionId]/[page]): the drawn pages, the page field,
 * the strip of pages, the page as text, the search in this manual and, when a card is being
 * written, the panel that cites the page on one of its steps.
 */
export class ManualReaderPage {
  constructor(private readonly page: Page) {}

  async open(manualId: string, revisionId: string, pageNumber: number) {
    await this.page.goto(`/library/${manualId}/${revisionId}/${pageNumber}`);
  }

  heading() {
    return this.page.getByRole("heading", { level: 1 });
  }

  /** The page number the reader shows. */
  pageField() {
    return this.page.getByRole("textbox", { name: "Page" });
  }

  /** A page as pdf.js draws it, with its canvas and text layer. */
  drawnPage(pageNumber: number) {
    return this.page.locator(`[data-page="${pageNumber}"]`);
  }

  /** Focus on the pages, so that Page Down and Page Up move through them. */
  async focusPages() {
    await this.page.getByLabel(/^PDF pages, page/).focus();
  }

  /** Page Down, with the pages focused. */
  async pageDown() {
    await this.page.keyboard.press("PageDown");
  }

  /** Page Up, with the pages focused. */
  async pageUp() {
    await this.page.keyboard.press("PageUp");
  }

  /** Jumps to a page through the page pictures in the side panel. */
  async goToPage(pageNumber: number) {
    await this.openPanel("Page pictures");
    await this.page
      .getByRole("navigation", { name: "Pages" })
      .getByRole("button", { name: `Page ${pageNumber}`, exact: true })
      .click();
  }

  /** Opens the side panel on one of its tabs (it starts open on a wide screen, closed on a cart's or a phone's). */
  async openPanel(tab: "Contents" | "Page pictures") {
    const tabs = this.page.getByRole("tablist", { name: "Ways in" });
    if (!(await tabs.isVisible())) await this.page.getByRole("button", { name: "☰ Contents" }).click();
    await tabs.getByRole("tab", { name: tab }).click();
  }

  /** Goes to a subject through the contents (chapter, then subject by its code). */
  async goToSubject(code: string) {
    await this.openPanel("Contents");
    const contents = this.page.getByRole("navigation", { name: "Contents" });
    const chapter = contents.getByText(code.slice(0, 2), { exact: true });
    const button = contents.getByRole("button", { name: new RegExp(`^${escapeRegExp(code)}\\b`) });
    if (!(await button.isVisible())) await chapter.click();
    await button.click();
  }

  async zoomIn() {
    await this.page.getByRole("button", { name: "Zoom in" }).click();
  }

  /** Which page fills the middle of the reader's view: the one being read. */
  async pageInView(): Promise<number | null> {
    return this.page.evaluate(() => {
      const box = document.querySelector('[aria-label^="PDF pages, page"]')!.getBoundingClientRect();
      const y = box.top + box.height / 3;
      const x = box.left + box.width / 2;
      const hit = document.elementsFromPoint(x, y).find((e) => e instanceof HTMLElement && e.dataset.page);
      return hit instanceof HTMLElement ? Number(hit.dataset.page) : null;
    });
  }

  /** Opens the same page as text, for reading aloud or a slow connection. */
  async showPageText() {
    await this.page.getByText(/^Text of page/).click();
  }

  pageText() {
    return this.page.getByRole("article");
  }

  async searchInManual(query: string) {
    const inManual = this.page.getByRole("search", { name: "Search in this manual" });
    await inManual.getByRole("textbox").fill(query);
    await inManual.getByRole("button", { name: "Search" }).click();
  }

  supersededAlert() {
    return this.page.getByRole("alert").filter({ hasText: "superseded" });
  }

  /** From a superseded page to the same page of the current revision, named by its label ("Rev 4"). */
  async openCurrentRevision(label: string) {
    await this.page.getByRole("link", { name: new RegExp(`of the current revision, ${escapeRegExp(label)}`) }).click();
  }

  citePanel() {
    return this.page.getByRole("region", { name: "Cite this page on a task card" });
  }

  /** The step of the card being written that the page goes on. */
  citeStep() {
    return this.citePanel().getByLabel("Step");
  }

  async putPageOnStep() {
    await this.citePanel().getByRole("button", { name: "Put this page on the step" }).click();
  }

  async backToCard() {
    await this.citePanel().getByRole("link", { name: "Back to the card" }).click();
  }
}
