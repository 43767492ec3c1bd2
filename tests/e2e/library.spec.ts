import { expect, test } from "@playwright/test";
import { makePdf } from "../support/pdf";
import { SignInPage } from "./support/pages/sign-in";

test("a librarian uploads a manual and watches it become ready", async ({ page }) => {
  const title = `Wheel Bearing Practice ${Date.now()}`;
  const signIn = new SignInPage(page);
  await signIn.open();
  await signIn.signIn("librarian@hangarleaf.test");
  await page.getByRole("navigation", { name: "Main" }).getByRole("link", { name: "Library" }).click();
  await page.getByRole("link", { name: "Upload a manual" }).click();

  const form = page.getByRole("form", { name: "Upload a manual" });
  await form.getByRole("button", { name: "Upload manual" }).click();
  // Checked before anything is sent: beside each field, and all of them in a summary at the top.
  await expect(form.getByRole("alert")).toContainText(/\d fields need a change:/);
  await expect(form.getByRole("alert")).toContainText("Title: Give the title.");
  await expect(form.locator("#title-error")).toHaveText("Give the title.");

  await form.getByLabel("Title").fill(title);
  await form.getByLabel("Document type").selectOption("school_procedure");
  await form.getByLabel("Applies to (optional)").fill("HT-20");
  await form.getByLabel("ATA chapters (optional)").fill("32, 5");
  await form.getByLabel("Revision label").fill("Rev 1");
  await form.getByLabel("Revision date").fill("2026-11-20");
  const pdf = Buffer.from(await makePdf(["32-40-00 WHEEL BEARINGS\nClean and repack", "Inspect the cups", "Install and torque"]));
  await form.getByLabel("PDF file").setInputFiles({ name: "bearings.pdf", mimeType: "application/pdf", buffer: pdf });
  await form.getByRole("button", { name: "Upload manual" }).click();

  await expect(form.getByText(/Uploaded: .* of /)).toBeVisible();
  await expect(form.getByRole("status").filter({ hasText: "is ready" })).toContainText(
    "Rev 1 is ready: 3 pages, now the current revision",
    { timeout: 30_000 },
  );
  // Emptied for the next upload once the revision is read.
  await expect(form.getByLabel("Title")).toHaveValue("");
  await form.getByRole("link", { name: "Open the manual" }).click();
  await expect(page.getByRole("heading", { level: 1, name: title })).toBeVisible();
  await expect(page.getByText("ATA 32, 05")).toBeVisible();
  await expect(page.getByRole("row").filter({ hasText: "Rev 1" })).toContainText("Current");
});

test("an upload that is not a PDF is refused in plain words", async ({ page }) => {
  const signIn = new SignInPage(page);
  await signIn.open("/sign-in?next=%2Flibrary%2Fupload");
  await signIn.signIn("librarian@hangarleaf.test");
  const form = page.getByRole("form", { name: "Upload a manual" });
  await form.getByLabel("Title").fill(`Not a manual ${Date.now()}`);
  await form.getByLabel("Revision label").fill("Rev 1");
  await form.getByLabel("Revision date").fill("2026-11-20");
  await form
    .getByLabel("PDF file")
    .setInputFiles({ name: "notes.pdf", mimeType: "application/pdf", buffer: Buffer.from("shopping list\n".repeat(200)) });
  await form.getByRole("button", { name: "Upload manual" }).click();
  const alert = form.getByRole("alert").filter({ hasText: /./ });
  await expect(alert).toContainText("That file is not a PDF. Upload the manual as a PDF file.");
  // The field the server refused is named at the top and beside it.
  await expect(alert).toContainText("PDF file: Not a PDF.");
  await expect(form.locator("#file-error")).toHaveText("Not a PDF.");
});

test("a student browses the library but cannot upload", async ({ page }) => {
  const signIn = new SignInPage(page);
  await signIn.open("/sign-in?next=%2Flibrary");
  await signIn.signIn("student@hangarleaf.test");
  await expect(page.getByRole("heading", { level: 1, name: "Library" })).toBeVisible();
  await expect(page.getByRole("link", { name: "HT-20 Trainer Maintenance Manual", exact: true })).toBeVisible();
  await expect(page.getByRole("link", { name: "Upload a manual" })).toHaveCount(0);
  // The manual opens in the reader; its revisions are one link away.
  await page.getByRole("link", { name: "HT-20 Trainer Maintenance Manual", exact: true }).click();
  await expect(page).toHaveURL(/\/library\/[0-9a-f-]+\/[0-9a-f-]+\/1$/);
  await page.goBack();
  await page.getByRole("link", { name: "Revisions and details of HT-20 Trainer Maintenance Manual" }).click();
  await expect(page.getByRole("row").filter({ hasText: "Rev 4" })).toContainText("Current");
  await expect(page.getByRole("row").filter({ hasText: "Rev 3" })).toContainText("Superseded");
  expect((await page.goto("/library/upload"))?.status()).toBe(403);
});
