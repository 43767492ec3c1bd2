import { execFile } from "node:child_process";
import { mkdtemp, rm, writeFile } from "node:fs/promises";
import { tmpdir } from "node:os";
import path from "node:path";
import { promisify } from "node:util";
import { expect, test, type Page } from "@playwright/test";
import { SignInPage } from "./support/pages";

const run = promisify(execFile);

/** The card editor: one group per step, a status line that says when the draft is saved. */
class CardEditorPage {
  constructor(private readonly page: Page) {}

  step(n: number) {
    return this.page.getByRole("group", { name: `Step ${n}`, exact: true });
  }

  async waitSaved() {
    await expect(this.page.getByText(/saved at \d\d:\d\d/)).toBeVisible({ timeout: 15_000 });
  }
}

test("an instructor builds a two-step card citing a page from the reader, publishes and prints it", async ({ page }) => {
  const title = `Magneto drop check ${Date.now()}`;
  const signIn = new SignInPage(page);
  await signIn.open("/sign-in?next=%2Fcards");
  await signIn.signIn("instructor@hangarleaf.test");
  await page.getByRole("link", { name: "New task card" }).click();
  await expect(page.getByRole("heading", { level: 1, name: "New task card" })).toBeVisible();
  await page.getByLabel("Title").fill(title);
  await page.getByLabel("Curriculum subject").selectOption({ label: "Ignition systems" });
  await page.getByRole("button", { name: /Make the draft/ }).click();
  await expect(page.getByRole("heading", { level: 1 })).toContainText("Editing draft version 1");

  const editor = new CardEditorPage(page);
  await page.getByLabel("ATA chapter").fill("74");
  const first = editor.step(1);
  await first.getByLabel("Instruction").fill("Run the engine at 1800 rpm and check the **magneto drop** on each magneto.");
  await first.getByRole("button", { name: "+ CAUTION" }).click();
  await first.getByLabel("Notice text").fill("Do not run the engine on one magneto longer than the check needs: the plugs foul.");
  await first.getByLabel("The student records a measured value").check();
  await first.getByLabel("What is measured").fill("Magneto drop");
  await first.getByRole("combobox", { name: /^Unit/ }).selectOption("rpm");
  await first.getByRole("textbox", { name: "Maximum" }).fill("125");
  await page.getByRole("button", { name: "+ Add a step" }).click();
  await editor.step(2).getByLabel("Instruction").fill("Record both drops and the difference on the card.");
  await editor.waitSaved();

  // Cite while reading: from step 1 to the library, search, open the hit, put the page on the step.
  await first.getByRole("button", { name: "Find it in the library…" }).click();
  await expect(page).toHaveURL(/\/library$/);
  await page.goto("/search?q=magneto%20drop%201800");
  // The demo trainer manual's current revision is its Rev 4.
  await page.getByRole("listbox", { name: "Search results" }).getByRole("option").filter({ hasText: "· Rev 4" }).first().click();
  await expect(page).toHaveURL(/\/library\/[0-9a-f-]+\/[0-9a-f-]+\/\d+/);
  const cited = Number(/\/(\d+)(\?|$)/.exec(page.url())?.[1]);
  const panel = page.getByRole("region", { name: "Cite this page on a task card" });
  await expect(panel).toContainText(title);
  await expect(panel.getByLabel("Step")).toHaveValue(/.+/);
  await panel.getByRole("button", { name: "Put this page on the step" }).click();
  await expect(panel.getByText(`Page ${cited} is on step 1 of draft version 1.`)).toBeVisible();
  await panel.getByRole("link", { name: "Back to the card" }).click();
  await expect(page).toHaveURL(/\/cards\/[0-9a-f-]+\/edit$/);

  await expect(editor.step(1)).toContainText(`HT-20 Trainer Maintenance Manual, Rev 4, page ${cited}`);
  await page.getByRole("tab", { name: "Preview as a student" }).click();
  const preview = page.getByRole("article", { name: `Task card ${title}` });
  const step1 = preview.getByRole("listitem", { name: "Step 1" });
  await expect(step1.getByRole("note", { name: /CAUTION/ })).toBeVisible();
  // The caution comes before the instruction it guards.
  const box = await step1.getByRole("note", { name: /CAUTION/ }).boundingBox();
  const instruction = await step1.getByText(/check the magneto drop/).boundingBox();
  expect(box!.y).toBeLessThan(instruction!.y);
  const reading = step1.getByLabel(/Magneto drop \(limits at most 125 rpm\)/);
  await reading.fill("140");
  await expect(step1.getByText(/OUT OF LIMITS/)).toBeVisible();
  await reading.fill("90");
  await expect(step1.getByText(/within limits/)).toBeVisible();

  await page.getByRole("button", { name: "Publish" }).click();
  await expect(page).toHaveURL(/\/cards\/[0-9a-f-]+$/);
  await expect(page.getByRole("link", { name: /v1 · published/ })).toBeVisible();
  await expect(page.getByRole("link", { name: `HT-20 Trainer Maintenance Manual, Rev 4, page ${cited}` })).toBeVisible();

  // Print: the PDF carries the caution, the value blank with its limits, and the reference.
  const href = await page.getByRole("link", { name: "Print (PDF)" }).getAttribute("href");
  const response = await page.request.get(href!);
  expect(response.status()).toBe(200);
  expect(response.headers()["content-type"]).toBe("application/pdf");
  const dir = await mkdtemp(path.join(tmpdir(), "hl-e2e-card-"));
  try {
    await writeFile(path.join(dir, "card.pdf"), await response.body());
    const { stdout } = await run("pdftotext", [path.join(dir, "card.pdf"), "-"]);
    const text = stdout.replace(/\s+/g, " ");
    expect(text).toContain(title);
    expect(text).toContain("CAUTION");
    expect(text).toMatch(/Magneto drop: measured _+ rpm/);
    expect(text).toContain(`HT-20 Trainer Maintenance Manual, Rev 4, page ${cited}`);
  } finally {
    await rm(dir, { recursive: true, force: true });
  }
});

test("a student reads a published card but finds no way to write one", async ({ page }) => {
  const signIn = new SignInPage(page);
  await signIn.open("/sign-in?next=%2Fcards");
  await signIn.signIn("student@hangarleaf.test");
  await expect(page.getByRole("link", { name: "New task card" })).toHaveCount(0);
  // Filtered by title: the list pages at 25 cards, and other tests add cards.
  await page.getByRole("search", { name: "Filter task cards" }).getByLabel("Title").fill("Fluorescent penetrant");
  await page.getByRole("link", { name: "Fluorescent penetrant inspection of a landing gear fitting" }).click();
  const step1 = page.getByRole("listitem", { name: "Step 1" });
  await expect(step1.getByRole("note", { name: /WARNING/ })).toBeVisible();
  await expect(page.getByRole("button", { name: /Edit|Publish|Archive/ })).toHaveCount(0);
  expect((await page.goto("/cards/new"))?.status()).toBe(403);
});
