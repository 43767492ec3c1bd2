import { expect, test } from "@playwright/test";
import { SignInPage } from "./support/pages/sign-in";
import { CardEditorPage } from "./support/pages/card-editor";

// The editor never drops typing: an unfinished draft is saved as typed with its gaps listed,
// leaving in the moment before a save asks first, and publishing asks once more.
test("an unfinished draft is kept as typed, leaving with unsaved typing asks, and publishing asks before it freezes", async ({ page }) => {
  const title = `Spark plug gap check ${Date.now()}`;
  const signIn = new SignInPage(page);
  await signIn.open("/sign-in?next=%2Fcards%2Fnew");
  await signIn.signIn("instructor@hangarleaf.test");
  const editor = new CardEditorPage(page);
  await editor.makeDraft(title, "Ignition systems");
  await expect(editor.heading()).toContainText("Editing draft version 1");

  // Limits the wrong way round and no chapter yet: saved all the same, and listed.
  await editor.askForMeasurement(1, { label: "Electrode gap", unit: "in", min: "0.022", max: "0.016" });
  await editor.waitSaved();
  const toFinish = await editor.toFinish();
  await expect(toFinish).toContainText("Give the ATA chapter.");
  await expect(toFinish).toContainText("Step 1: write the instruction.");
  await expect(toFinish).toContainText("Step 1: The minimum is above the maximum.");
  await expect(editor.step(1).getByRole("list", { name: "To finish on step 1 before publishing" })).toContainText(
    "The minimum is above the maximum.",
  );
  await expect(editor.publishButton()).toBeDisabled();

  // Typing, then a link at once: the page asks; staying keeps the typing, which is then saved.
  await editor.writeInstruction(1, "Measure the gap of each plug with a wire gauge.");
  let asked = "";
  page.once("dialog", (dialog) => {
    asked = dialog.message();
    void dialog.dismiss();
  });
  await editor.cardsLink().click();
  await expect.poll(() => asked).toMatch(/not saved yet/);
  await expect(page).toHaveURL(/\/edit$/);
  await editor.waitSaved();
  await page.reload();
  await expect(editor.step(1).getByLabel("Instruction")).toHaveValue("Measure the gap of each plug with a wire gauge.");
  await expect(editor.step(1).getByRole("textbox", { name: "Minimum" })).toHaveValue("0.022");

  // Finished: one digit is chapter 07 on the server; the list goes, and publishing asks first.
  await editor.step(1).getByRole("textbox", { name: "Maximum" }).fill("0.028");
  await editor.setAtaChapter("7");
  await editor.waitSaved();
  await expect(page.getByText(/to finish before publishing/)).toHaveCount(0);
  await editor.publishButton().click();
  await expect(editor.publishQuestion()).toContainText("cannot be changed afterwards");
  await page.screenshot({ path: test.info().outputPath("card-publish-question.png") });
  await editor.publishQuestion().getByRole("button", { name: "Not yet" }).click();
  await expect(editor.publishQuestion()).toHaveCount(0);
  await editor.publish();
  await expect(page).toHaveURL(/\/cards\/[0-9a-f-]+$/);
  await expect(page.getByRole("link", { name: /v1 · published/ })).toBeVisible();
  await expect(
    page
      .getByText("ATA 07")
      .or(page.getByText(/ATA chapter 07/))
      .first(),
  ).toBeVisible();
});
