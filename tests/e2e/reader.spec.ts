// Reading a manual at the aircraft: zoom and fit keep the page being read, the contents go to a
// subject by its ATA number, keys page without clicking into the page first, a superseded page
// links to where its content is now, and on a 1024×768 cart screen the page starts high up.
import { expect, request as apiRequest, test, type APIRequestContext, type Page } from "@playwright/test";
import { demoManuals, secondRevisionOfTrainer } from "@/db/demo/manual-content";
import { sectionPage } from "@/db/demo/manual-pdf";
import { ManualReaderPage } from "./support/pages/manual-reader";
import { demoPassword, SignInPage } from "./support/pages/sign-in";

const baseURL = process.env.HL_BASE_URL ?? "http://localhost:3000";
const trainer = demoManuals.find((m) => m.title === "HT-20 Trainer Maintenance Manual")!;
const rev4 = secondRevisionOfTrainer(trainer);

async function trainerRevisions(): Promise<{ manualId: string; rev3: string; rev4: string }> {
  const api: APIRequestContext = await apiRequest.newContext({ baseURL });
  expect((await api.post("/api/session", { data: { email: "student@hangarleaf.test", password: demoPassword } })).status()).toBe(200);
  const { manuals } = (await (await api.get("/api/manuals")).json()) as { manuals: { id: string; title: string }[] };
  const manualId = manuals.find((m) => m.title === trainer.title)!.id;
  const manual = (await (await api.get(`/api/manuals/${manualId}`)).json()) as { revisions: { id: string; label: string }[] };
  return {
    manualId,
    rev3: manual.revisions.find((r) => r.label === "Rev 3")!.id,
    rev4: manual.revisions.find((r) => r.label === "Rev 4")!.id,
  };
}

async function signedIn(page: Page, next: string) {
  const signIn = new SignInPage(page);
  await signIn.open(`/sign-in?next=${encodeURIComponent(next)}`);
  await signIn.signIn("student@hangarleaf.test");
}

test("zoom and fit keep the page being read; the contents and the keys move through the manual", async ({ page }) => {
  const { manualId, rev4: revisionId } = await trainerRevisions();
  const start = sectionPage(rev4, "32-10-00");
  await signedIn(page, `/library/${manualId}/${revisionId}/${start}`);
  const reader = new ManualReaderPage(page);
  await expect(reader.drawnPage(start).locator("canvas")).toBeVisible();
  await expect.poll(() => reader.pageInView()).toBe(start);

  for (let i = 0; i < 2; i++) await reader.zoomIn(); // 125 %, then 150 %
  await expect(page.getByRole("toolbar", { name: "Reader" })).toContainText("%");
  await expect(reader.pageField()).toHaveValue(String(start));
  await expect.poll(() => reader.pageInView()).toBe(start);
  await expect(reader.drawnPage(start).locator("canvas")).toBeVisible(); // drawn, not a grey gap
  await page.getByRole("button", { name: "Fit page" }).click();
  await expect.poll(() => reader.pageInView()).toBe(start);
  await page.getByRole("button", { name: "Fit width" }).click();
  await expect.poll(() => reader.pageInView()).toBe(start);

  // Keys page without a click into the page first.
  await page.keyboard.press("PageDown");
  await expect(reader.pageField()).toHaveValue(String(start + 1));
  await page.keyboard.press("ArrowLeft");
  await expect(reader.pageField()).toHaveValue(String(start));

  // The contents: chapter 32, then the subject by its number; the text below follows the page.
  const target = sectionPage(rev4, "32-40-00", "description"); // the contents go to a subject's first page
  await reader.goToSubject("32-40-00");
  await expect(reader.pageField()).toHaveValue(String(target));
  await expect(page.getByRole("navigation", { name: "Contents" }).getByRole("button", { name: /^32-40-00/ })).toHaveAttribute(
    "aria-current",
    "location",
  );
  // The text layer is laid out in a font with the PDF's letter widths, so marks sit on the glyphs:
  // pdf.js then barely stretches a line (a stand-in font needs 5–15 %).
  const drawn = reader.drawnPage(target);
  await expect(drawn.locator(".textLayer span").first()).toBeAttached();
  const layout = await drawn.evaluate((element) => {
    const spans = [...element.querySelectorAll<HTMLElement>(".textLayer span")].filter((s) => (s.textContent ?? "").length > 20);
    const scales = spans.map((s) => Number(/scaleX\(([\d.]+)\)/.exec(s.style.transform)?.[1] ?? 1)).sort((a, b) => a - b);
    return { font: spans[0]?.style.fontFamily ?? "", median: scales[Math.floor(scales.length / 2)] ?? 0 };
  });
  expect(layout.font).toContain("Hangarleaf Text Sans");
  expect(layout.median).toBeGreaterThan(0.97);
  expect(layout.median).toBeLessThan(1.03);
  await page.screenshot({ path: test.info().outputPath("reader-1366-contents.png") });
  await reader.showPageText();
  await expect(page.getByRole("article", { name: `Text of page ${target}` })).toContainText("32-40-00");
  await expect(page.getByRole("toolbar", { name: "Reader" })).toContainText("Rev 4 · current");
});

test("a bookmark made on a superseded page follows its content to the current revision", async ({ page }) => {
  const { manualId, rev3, rev4: current } = await trainerRevisions();
  // 32-40-00 moved further on in Rev 4 (see the test below).
  const old = sectionPage(trainer, "32-40-00");
  const now = sectionPage(rev4, "32-40-00");
  expect(now).not.toBe(old);
  await signedIn(page, `/library/${manualId}/${rev3}/${old}`);
  const marks = page.getByRole("button", { name: /Marks$|NOTE on this page/ });
  await marks.click();
  // The integration tests may have bookmarked this page for the same student already.
  const bookmark = page.getByRole("button", { name: new RegExp(`Bookmark page ${old}$|Page ${old} bookmarked$`) });
  if ((await bookmark.textContent())?.startsWith("☆")) await bookmark.click();
  await expect(page.getByRole("button", { name: `★ Page ${old} bookmarked` })).toBeVisible();
  await page.goto(`/library/${manualId}/${current}/1`);
  await marks.click();
  const list = page.getByRole("region", { name: "Bookmarks and notes in this manual" });
  await expect(list).toContainText(`moved here from Rev 3, page ${old}`);
  await list
    .getByRole("link", { name: `★ page ${now}` })
    .first()
    .click();
  await expect(page).toHaveURL(new RegExp(`/library/${manualId}/${current}/${now}$`));
  await expect(marks).toHaveText("★ Marks");
  await marks.click();
  await expect(page.getByRole("button", { name: `★ Page ${now} bookmarked` })).toBeVisible();
  await page.screenshot({ path: test.info().outputPath("reader-bookmarks.png") });
});

test("a superseded page links to where its content moved in the current revision", async ({ page }) => {
  const { manualId, rev3 } = await trainerRevisions();
  // Rev 4 added a section in chapter 12: the wheels-and-brakes pages of Rev 3 moved further on.
  const old = sectionPage(trainer, "32-40-00");
  const now = sectionPage(rev4, "32-40-00");
  expect(now).toBeGreaterThan(old);
  await signedIn(page, `/library/${manualId}/${rev3}/${old}`);
  const reader = new ManualReaderPage(page);
  await expect(reader.supersededAlert()).toContainText("This is Rev 3, a superseded revision.");
  await expect(page.getByRole("toolbar", { name: "Reader" })).toContainText("Rev 3 · superseded");
  const link = page.getByRole("link", {
    name: new RegExp(`Open page ${now} of the current revision, Rev 4 \\(the same content, moved there\\)`),
  });
  await link.click();
  await expect(page).toHaveURL(new RegExp(`/library/${manualId}/[0-9a-f-]+/${now}$`));
  await expect(reader.heading()).toContainText("Rev 4");
});

test("on a 1024×768 cart screen the manual page starts in the top third, and on a phone the controls fit", async ({ browser }) => {
  const { manualId, rev4: revisionId } = await trainerRevisions();
  const start = sectionPage(rev4, "32-10-00");
  const cart = await browser.newContext({ viewport: { width: 1024, height: 768 } });
  const page = await cart.newPage();
  await signedIn(page, `/library/${manualId}/${revisionId}/${start}`);
  const reader = new ManualReaderPage(page);
  await expect(reader.drawnPage(start).locator("canvas")).toBeVisible();
  const top = await page.getByLabel(/^PDF pages, page/).evaluate((e) => e.getBoundingClientRect().top);
  expect(top).toBeLessThan(768 / 3);
  await page.screenshot({ path: test.info().outputPath("reader-1024x768.png") });
  await cart.close();

  const phone = await browser.newContext({ viewport: { width: 390, height: 844 }, isMobile: true, hasTouch: true });
  const small = await phone.newPage();
  await signedIn(small, `/library/${manualId}/${revisionId}/${start}`);
  await expect(new ManualReaderPage(small).drawnPage(start).locator("canvas")).toBeVisible();
  // Nothing sticks out sideways: the page scrolls inside the reader, not the whole screen.
  const overflow = await small.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);
  expect(overflow).toBeLessThanOrEqual(1);
  // Every control of the reader's bar is inside the screen.
  const outside = await small
    .getByRole("toolbar", { name: "Reader" })
    .evaluate(
      (bar) => [...bar.querySelectorAll("button, input")].filter((e) => e.getBoundingClientRect().right > window.innerWidth + 1).length,
    );
  expect(outside).toBe(0);
  await small.screenshot({ path: test.info().outputPath("reader-390x844.png") });
  await phone.close();
});
