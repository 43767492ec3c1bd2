import { expect, test } from "@playwright/test";
import { demoManuals, secondRevisionOfTrainer } from "@/db/demo/manual-content";
import { sectionPage } from "@/db/demo/manual-pdf";
import { ManualReaderPage } from "./support/pages/manual-reader";
import { SignInPage } from "./support/pages/sign-in";

test("a student searches with a typo, opens the hit and sees the word marked on the page", async ({ page }) => {
  const signIn = new SignInPage(page);
  await signIn.open("/sign-in?next=%2Fsearch");
  await signIn.signIn("student@hangarleaf.test");
  const box = page.getByRole("combobox", { name: "What are you looking for?" });
  await expect(box).toBeFocused();
  await box.fill("magento timing");
  const results = page.getByRole("listbox", { name: "Search results" });
  const first = results.getByRole("option").first();
  await expect(first).toContainText("MAGNETO TIMING");
  await expect(page).toHaveURL(/\?q=magento\+timing/); // the query can be shared

  // Keyboard: down to the first hit, Enter opens it.
  await box.press("ArrowDown");
  await expect(first).toHaveAttribute("aria-selected", "true");
  await box.press("Enter");

  await expect(page).toHaveURL(/\/library\/[0-9a-f-]+\/[0-9a-f-]+\/\d+\?q=magento/);
  const reader = new ManualReaderPage(page);
  await expect(reader.heading()).toContainText("HT-20 Trainer Maintenance Manual · Rev 4");
  const page76 = Number(/\/(\d+)\?q=/.exec(page.url())?.[1]);
  // The reader draws that page and marks the word in its text layer.
  const drawn = reader.drawnPage(page76);
  await expect(drawn.locator("canvas")).toBeVisible();
  await expect(drawn.locator(".textLayer mark").first()).toHaveText(/magneto/i);
  await expect(reader.pageField()).toHaveValue(String(page76));
  // Keyboard: Page Down moves to the next page, and the address follows.
  await reader.focusPages();
  await reader.pageDown();
  await expect(reader.pageField()).toHaveValue(String(page76 + 1));
  await expect(page).toHaveURL(new RegExp(`/${page76 + 1}\\?q=`));
  await reader.pageUp();
  await expect(reader.pageField()).toHaveValue(String(page76));

  // The same page as text, for reading aloud or a slow connection.
  await reader.showPageText();
  await expect(reader.pageText().locator("mark").first()).toHaveText(/magneto/i);

  // The strip of pages beside the reader jumps to a page.
  await reader.goToPage(3);
  await expect(reader.pageField()).toHaveValue("3");

  // Search inside this manual only.
  await reader.searchInManual("spark plug");
  await expect(page).toHaveURL(/\/search\?manual=[0-9a-f-]+&q=spark\+plug/);
  await expect(page.getByLabel("Manual")).toHaveValue(/[0-9a-f-]{36}/);
  await expect(page.getByRole("listbox", { name: "Search results" }).getByRole("heading")).toHaveText(["HT-20 Trainer Maintenance Manual"]);
  await expect(page.getByRole("complementary", { name: "Training use notice" })).toBeVisible();
});

test("a superseded page says so and links to the current revision", async ({ page }) => {
  const signIn = new SignInPage(page);
  await signIn.open("/sign-in?next=%2Flibrary");
  await signIn.signIn("student@hangarleaf.test");
  await page.getByRole("link", { name: "Revisions and details of HT-20 Trainer Maintenance Manual" }).click();
  const old = page.getByRole("row").filter({ hasText: "Rev 3" });
  const href = await old.getByRole("link", { name: "Read Rev 3" }).getAttribute("href");
  const [, manualId, revisionId] = /library\/([0-9a-f-]+)\/([0-9a-f-]+)\/1$/.exec(href ?? "") ?? [];
  const reader = new ManualReaderPage(page);
  await reader.open(manualId!, revisionId!, 5);
  await expect(reader.supersededAlert()).toContainText("This is Rev 3, a superseded revision.");
  await reader.openCurrentRevision("Rev 4");
  await expect(reader.heading()).toContainText("Rev 4");
  await expect(page).toHaveURL(new RegExp(`/library/${manualId}/[0-9a-f-]+/5`));
});

test("a search with a word no page has shows the pages with the other words and names it; an ATA code goes to its section", async ({
  page,
}) => {
  const signIn = new SignInPage(page);
  await signIn.open("/sign-in?next=%2Fsearch");
  await signIn.signIn("student@hangarleaf.test");
  const box = page.getByRole("combobox", { name: "What are you looking for?" });
  // A made-up word, far from every word of the library, so no typo correction reaches it.
  await box.fill("magneto timing xqjvzzw ");
  await expect(page.getByText("No page has 'xqjvzzw'; showing pages with the other words")).toBeVisible();
  const first = page.getByRole("listbox", { name: "Search results" }).getByRole("option").first();
  await expect(first).toContainText("MAGNETO TIMING");
  await expect(first).toContainText("Does not have: xqjvzzw");

  await box.fill("32-10-00");
  const jump = page.getByRole("navigation", { name: "Manual sections" }).getByRole("link", { name: /Go to 32-10-00: MAIN LANDING GEAR/ });
  await expect(jump).toContainText("HT-20 Trainer Maintenance Manual · Rev 4");
  await jump.click();
  // The section's first page in the current revision, as the demo manual lays it out.
  const firstPage = sectionPage(secondRevisionOfTrainer(demoManuals.find((m) => m.title.startsWith("HT-20"))!), "32-10-00", "description");
  await expect(page).toHaveURL(new RegExp(`/library/[0-9a-f-]+/[0-9a-f-]+/${firstPage}\\?q=32-10-00`));
  await expect(new ManualReaderPage(page).heading()).toContainText("HT-20 Trainer Maintenance Manual · Rev 4");
});
