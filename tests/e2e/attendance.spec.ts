// An instructor takes a session's register in Chromium with large choices, closes it, corrects one
// student with a reason (the first entry stays), and the student reads the session and their hours.
import { expect, test } from "@playwright/test";
import { apiAs as api } from "./support/api";
import { SignInPage } from "./support/pages/sign-in";

test("an instructor takes attendance, closes and corrects the register; the student reads their hours", async ({ browser }) => {
  const instructor = await api("instructor@hangarleaf.test");
  const classes = (await (await instructor.get("/api/classes")).json()) as { classes: { id: string; name: string }[] };
  const classId = classes.classes.find((c) => c.name === "AMT Day Cohort 2027")!.id;
  const subject = `Cable rigging ${Date.now()}`;
  const created = await instructor.post("/api/class-sessions", {
    data: { classId, startsAt: new Date(Date.now() - 2 * 3_600_000).toISOString(), minutes: 120, section: "Airframe", subject },
  });
  expect(created.status()).toBe(201);

  const context = await browser.newContext();
  const page = await context.newPage();
  await new SignInPage(page).open(`/sign-in?next=${encodeURIComponent(`/classes/${classId}`)}`);
  await new SignInPage(page).signIn("instructor@hangarleaf.test");
  await page.getByRole("link", { name: subject }).click();
  await expect(page.getByRole("heading", { level: 1, name: subject })).toBeVisible();
  const student = (name: string) => page.getByRole("group", { name });
  await student("Sam Whitlock").getByText("Present", { exact: true }).click();
  await expect(student("Sam Whitlock").getByLabel(/Minutes attended/)).toHaveValue("120");
  await student("Jordan Pike").getByText("Absent", { exact: true }).click();
  await student("Jordan Pike").getByLabel("Make-up work (optional)").fill("Rigging card on the trainer, Monday");
  await student("Riley Amsel").getByText("Late", { exact: true }).click();
  await student("Riley Amsel")
    .getByLabel(/Minutes attended/)
    .fill("95");
  await page.getByRole("button", { name: "Save attendance" }).click();
  await expect(page.getByText("Attendance saved.")).toBeVisible();
  await page.screenshot({ path: test.info().outputPath("register.png"), fullPage: true });
  // The message stays after the page refreshes behind it.
  await page.waitForTimeout(1500);
  await expect(page.getByText("Attendance saved.")).toBeVisible();

  await page.getByRole("button", { name: "Close the register…" }).click();
  await page.getByRole("alertdialog", { name: "Close the register" }).getByRole("button", { name: "Close it" }).click();
  await expect(page.getByText(/Register closed .*: changes are corrections with a reason/)).toBeVisible();
  await student("Sam Whitlock").getByText("Late", { exact: true }).click();
  await student("Sam Whitlock")
    .getByLabel(/Minutes attended/)
    .fill("100");
  await page.getByRole("button", { name: "Save the correction" }).click();
  await expect(page.getByText("The register is closed: say why it is corrected.")).toBeVisible();
  await page.getByLabel("Why the closed register is corrected").fill("Left at 11:40 for a dentist appointment");
  await page.getByRole("button", { name: "Save the correction" }).click();
  await expect(page.getByText("Correction saved; the earlier entries are kept.")).toBeVisible();
  await expect(student("Sam Whitlock")).toContainText(
    "Earlier: Present 120 min (Elena Brandt). Corrected: Left at 11:40 for a dentist appointment",
  );
  await context.close();

  const studentContext = await browser.newContext();
  const mine = await studentContext.newPage();
  await new SignInPage(mine).open("/sign-in?next=%2Frecords");
  await new SignInPage(mine).signIn("student@hangarleaf.test");
  const section = mine.getByRole("region", { name: "Attendance and hours" });
  await expect(section.getByRole("row").filter({ hasText: subject })).toContainText("Late, 100 of 120 min; corrected: Left at 11:40");
  await expect(section).toContainText("Airframe");
  await studentContext.close();
});
