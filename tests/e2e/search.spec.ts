import { expect, test } from "@playwright/test";
import { SignInPage } from "./support/pages";

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
  await expect(page.getByRole("heading", { level: 1 })).toContainText("HT-20 Trainer Maintenance Manual · Rev 4");
  const page76 = Number(/\/(\d+)\?q=/.exec(page.url())?.[1]);
  // The reader draws that page and marks the word in its text layer.
  const drawn = page.locator(`[data-page="${page76}"]`);
  await expect(drawn.locator("canvas")).toBeVisible();
  await expect(drawn.locator(".textLayer mark").first()).toHaveText(/magneto/i);
  await expect(page.getByRole("textbox", { name: "Page" })).toHaveValue(String(page76));
  // Keyboard: Page Down moves to the next page, and the address follows.
  await page.getByLabel(/^PDF pages, page/).focus();
  await page.keyboard.press("PageDown");
  await expect(page.getByRole("textbox", { name: "Page" })).toHaveValue(String(page76 + 1));
  await expect(page).toHaveURL(new RegExp(`/${page76 + 1}\\?q=`));
  await page.keyboard.press("PageUp");
  await expect(page.getByRole("textbox", { name: "Page" })).toHaveValue(String(page76));

  // The same page as text, for reading aloud or a slow connection.
  await page.getByText(/^Text of page/).click();
  await expect(page.getByRole("article").locator("mark").first()).toHaveText(/magneto/i);

  // The strip of pages beside the reader jumps to a page.
  await page.getByRole("navigation", { name: "Pages" }).getByRole("button", { name: "Page 3", exact: true }).click();
  await expect(page.getByRole("textbox", { name: "Page" })).toHaveValue("3");

  // Search inside this manual only.
  const inManual = page.getByRole("search", { name: "Search in this manual" });
  await inManual.getByRole("textbox").fill("spark plug");
  await inManual.getByRole("button", { name: "Search" }).click();
  await expect(page).toHaveURL(/\/search\?manual=[0-9a-f-]+&q=spark\+plug/);
  await expect(page.getByLabel("Manual")).toHaveValue(/[0-9a-f-]{36}/);
  await expect(page.getByRole("listbox", { name: "Search results" }).getByRole("heading")).toHaveText(["HT-20 Trainer Maintenance Manual"]);
  await expect(page.getByRole("complementary", { name: "Training use notice" })).toBeVisible();
});

test("a superseded page says so and links to the current revision", async ({ page }) => {
  const signIn = new SignInPage(page);
  await signIn.open("/sign-in?next=%2Flibrary");
  await signIn.signIn("student@hangarleaf.test");
  await page.getByRole("link", { name: "HT-20 Trainer Maintenance Manual" }).click();
  const old = page.getByRole("row").filter({ hasText: "Rev 3" });
  const href = await old.getByRole("link", { name: "Open PDF" }).getAttribute("href");
  const revisionId = /revisions\/([0-9a-f-]+)\/file/.exec(href ?? "")?.[1];
  const manualId = /library\/([0-9a-f-]+)/.exec(page.url())?.[1];
  await page.goto(`/library/${manualId}/${revisionId}/5`);
  await expect(page.getByRole("alert").filter({ hasText: "superseded" })).toContainText("This is Rev 3, a superseded revision.");
  await page.getByRole("link", { name: /of the current revision, Rev 4/ }).click();
  await expect(page.getByRole("heading", { level: 1 })).toContainText("Rev 4");
  await expect(page).toHaveURL(new RegExp(`/library/${manualId}/[0-9a-f-]+/5`));
});
