// After a card changes, the instructor moves a student's open run to the new version from the
// card's page; the student's cart keeps the work on the unchanged step and asks for the changed one again.
import { expect, test } from "@playwright/test";
import { apiAs as api } from "./support/api";
import { CartRunnerPage } from "./support/pages/cart-runner";
import { SignInPage } from "./support/pages/sign-in";

test("an instructor moves a student's open run to the card's new version, keeping the unchanged work", async ({ browser }) => {
  test.setTimeout(120_000);
  const instructor = await api("instructor@hangarleaf.test");
  const subjects = (await (await instructor.get("/api/subjects")).json()) as { subjects: { id: string }[] };
  const title = `Brake wear check ${Date.now()}`;
  const ids = [crypto.randomUUID(), crypto.randomUUID()];
  const content = {
    title,
    ataChapter: "32",
    subjectId: subjects.subjects[0]!.id,
    estimatedMinutes: 15,
    steps: [
      { id: ids[0], text: "Set the parking brake." },
      { id: ids[1], text: "Measure the wear pin.", measurement: { label: "Wear pin", unit: "in", min: 0.05, max: 1 } },
    ],
  };
  const created = await instructor.post("/api/cards", { data: { content } });
  const cardId = ((await created.json()) as { card: { id: string } }).card.id;
  expect((await instructor.post(`/api/cards/${cardId}/publish`)).status()).toBe(200);
  const student = await api("student@hangarleaf.test");
  const me = ((await (await student.get("/api/session")).json()) as { user: { id: string } }).user.id;
  expect((await instructor.post("/api/assignments", { data: { cardId, studentIds: [me], note: "Hangar 1, bay 3" } })).status()).toBe(201);
  const work = ((await (await student.get("/api/my-work")).json()) as { work: { runId: string; title: string }[] }).work;
  const runId = work.find((w) => w.title === title)!.runId;
  const now = new Date().toISOString();
  expect(
    (
      await student.post(`/api/runs/${runId}/events`, {
        data: {
          events: [
            { id: crypto.randomUUID(), type: "step.checked", stepId: ids[0], clientTime: now },
            { id: crypto.randomUUID(), type: "value.recorded", stepId: ids[1], payload: { value: "0.2 in" }, clientTime: now },
            { id: crypto.randomUUID(), type: "step.checked", stepId: ids[1], clientTime: now },
          ],
        },
      })
    ).status(),
  ).toBe(200);
  // Version 2 tightens the wear limit.
  const v2 = {
    ...content,
    steps: [content.steps[0], { ...content.steps[1], measurement: { label: "Wear pin", unit: "in", min: 0.1, max: 1 } }],
  };
  expect((await instructor.put(`/api/cards/${cardId}/draft`, { data: { content: v2 } })).status()).toBe(200);
  expect((await instructor.post(`/api/cards/${cardId}/publish`)).status()).toBe(200);

  const context = await browser.newContext();
  const page = await context.newPage();
  await new SignInPage(page).open(`/sign-in?next=${encodeURIComponent(`/cards/${cardId}`)}`);
  await new SignInPage(page).signIn("instructor@hangarleaf.test");
  const section = page.getByRole("region", { name: "Open work on earlier versions" });
  const row = section.getByRole("listitem").filter({ hasText: "Sam Whitlock" });
  await expect(row).toContainText("version 1");
  await expect(row).toContainText("step 2 changed: done again");
  await row.getByRole("checkbox").check();
  await section.getByRole("button", { name: "Move 1 to version 2" }).click();
  await expect(page.getByText("1 run moved to version 2.")).toBeVisible();
  await expect(page.getByRole("region", { name: "Open work on earlier versions" })).toHaveCount(0);
  await context.close();

  const studentContext = await browser.newContext();
  const cart = await studentContext.newPage();
  await new SignInPage(cart).open(`/sign-in?next=${encodeURIComponent(`/cart/run?id=${runId}`)}`);
  await new SignInPage(cart).signIn("student@hangarleaf.test");
  const runner = new CartRunnerPage(cart);
  await expect(runner.heading(title)).toBeVisible();
  await runner.showAllSteps();
  await expect(runner.step(1).getByRole("button", { name: /Step 1 done/ })).toBeVisible();
  await expect(runner.step(2).getByText(/changed in the card's new version/)).toBeVisible();
  await expect(runner.step(2).getByRole("button", { name: "Mark step 2 done" })).toBeVisible();
  await studentContext.close();
});
