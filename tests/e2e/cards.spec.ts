import { execFile } from "node:child_process";
import { mkdtemp, rm, writeFile } from "node:fs/promises";
import { tmpdir } from "node:os";
import path from "node:path";
import { promisify } from "node:util";
import { expect, test } from "@playwright/test";
import { CardEditorPage } from "./support/pages/card-editor";
import { ManualReaderPage } from "./support/pages/manual-reader";
import { SignInPage } from "./support/pages/sign-in";

const run = promisify(execFile);

test("an instructor builds a two-step card citing a page from the reader, publishes and prints it", async ({ page }) => {
  const title = `Magneto drop check ${Date.now()}`;
  const signIn = new SignInPage(page);
  await signIn.open("/sign-in?next=%2Fcards");
  await signIn.signIn("instructor@hangarleaf.test");
  await page.getByRole("link", { name: "New task card" }).click();
  await expect(page.getByRole("heading", { level: 1, name: "New task card" })).toBeVisible();
  const editor = new CardEditorPage(page);
  await editor.makeDraft(title, "Ignition systems");
  await expect(editor.heading()).toContainText("Editing draft version 1");

  await editor.setAtaChapter("74");
  await editor.writeInstruction(1, "Run the engine at 1800 rpm and check the **magneto drop** on each magneto.");
  await editor.addNotice(1, "CAUTION", "Do not run the engine on one magneto longer than the check needs: the plugs foul.");
  await editor.askForMeasurement(1, { label: "Magneto drop", unit: "rpm", max: "125" });
  await editor.addStep();
  await editor.writeInstruction(2, "Record both drops and the difference on the card.");
  await editor.waitSaved();

  // Cite while reading: from step 1 to the library, search, open the hit, put the page on the step.
  await editor.findInLibrary(1);
  await expect(page).toHaveURL(/\/library$/);
  await page.goto("/search?q=magneto%20drop%201800");
  // The demo trainer manual's current revision is its Rev 4.
  await page.getByRole("listbox", { name: "Search results" }).getByRole("option").filter({ hasText: "· Rev 4" }).first().click();
  await expect(page).toHaveURL(/\/library\/[0-9a-f-]+\/[0-9a-f-]+\/\d+/);
  const cited = Number(/\/(\d+)(\?|$)/.exec(page.url())?.[1]);
  const reader = new ManualReaderPage(page);
  await expect(reader.citePanel()).toContainText(title);
  await expect(reader.citeStep()).toHaveValue(/.+/);
  await reader.putPageOnStep();
  await expect(reader.citePanel().getByText(`Page ${cited} is on step 1 of draft version 1.`)).toBeVisible();
  await reader.backToCard();
  await expect(page).toHaveURL(/\/cards\/[0-9a-f-]+\/edit$/);

  await expect(editor.step(1)).toContainText(`HT-20 Trainer Maintenance Manual, Rev 4, page ${cited}`);
  await editor.previewAsStudent();
  const step1 = editor.previewStep(title, 1);
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

  await editor.publish();
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
