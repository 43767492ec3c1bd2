// An instructor gives a card to a student who already has it open (warned, then assigned anyway),
// then withdraws the second assignment after reading what that does to its runs.
import { expect, test } from "@playwright/test";
import { apiAs as api } from "./support/api";
import { SignInPage } from "./support/pages/sign-in";

test("assigning a card twice is warned about by name, and withdrawing says first what happens to the runs", async ({ page }) => {
  const instructor = await api("instructor@hangarleaf.test");
  const subjects = (await (await instructor.get("/api/subjects")).json()) as { subjects: { id: string }[] };
  const title = `Tire pressure check ${Date.now()}`;
  const created = await instructor.post("/api/cards", {
    data: {
      content: {
        title,
        ataChapter: "32",
        subjectId: subjects.subjects[0]!.id,
        steps: [{ id: crypto.randomUUID(), text: "Check the pressure cold." }],
      },
    },
  });
  const cardId = ((await created.json()) as { card: { id: string } }).card.id;
  expect((await instructor.post(`/api/cards/${cardId}/publish`)).status()).toBe(200);
  const student = await api("student@hangarleaf.test");
  const me = ((await (await student.get("/api/session")).json()) as { user: { id: string } }).user.id;
  expect((await instructor.post("/api/assignments", { data: { cardId, studentIds: [me], note: "Ramp, stand 1" } })).status()).toBe(201);

  const signIn = new SignInPage(page);
  await signIn.open(`/sign-in?next=${encodeURIComponent(`/cards/${cardId}/assign`)}`);
  await signIn.signIn("instructor@hangarleaf.test");
  await page.getByRole("radio", { name: "Chosen students" }).check();
  await expect(page.getByRole("button", { name: "Assign", exact: true })).toBeDisabled();
  await expect(page.getByText("Tick the students to give it to.")).toBeVisible();
  await page.getByRole("checkbox", { name: /Sam Whitlock/ }).check();
  await expect(page.getByText("Giving it to Sam Whitlock.")).toBeVisible();
  await page.getByLabel("Aircraft or station (optional)").fill("Ramp, stand 2");
  await page.getByRole("button", { name: "Assign", exact: true }).click();
  const warning = page.getByRole("alertdialog");
  await expect(warning).toContainText("This student already has this card open: Sam Whitlock (ready to start, version 1).");
  await page.screenshot({ path: test.info().outputPath("assign-duplicate.png") });
  await warning.getByRole("button", { name: "Assign anyway" }).click();
  await expect(page.getByRole("status").filter({ hasText: "Assigned" })).toContainText("1 student has it in their work");

  const row = page.getByRole("row").filter({ hasText: "Ramp, stand 2" });
  await row.getByRole("button", { name: /^Withdraw:/ }).click();
  const withdraw = page.getByRole("alertdialog", { name: /Withdraw the assignment/ });
  await expect(withdraw).toContainText("1 run not started leaves the students' work.");
  await withdraw.getByLabel("Why (the students see it)").fill("Given twice by mistake.");
  await page.screenshot({ path: test.info().outputPath("assign-withdraw.png") });
  await withdraw.getByRole("button", { name: "Withdraw now" }).click();
  await expect(page.getByRole("row").filter({ hasText: "Ramp, stand 2" })).toContainText("Withdrawn");
  await expect(page.getByRole("row").filter({ hasText: "Ramp, stand 2" })).toContainText("Given twice by mistake.");
  // The student keeps the first one only.
  const work = ((await (await student.get("/api/my-work")).json()) as { work: { title: string; note: string }[] }).work;
  expect(work.filter((w) => w.title === title).map((w) => w.note)).toEqual(["Ramp, stand 1"]);
});
