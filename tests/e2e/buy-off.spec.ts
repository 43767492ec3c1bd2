// At the aircraft, offline: the student works a step's calculator inside the run and puts its
// result into the reading, finishes an inspection point and calls the instructor. Back online the
// call reaches the instructor's home and the buy-off queue; the buy-off from there reaches the cart.
import { expect, test } from "@playwright/test";
import { apiAs as api } from "./support/api";
import { CartRunnerPage } from "./support/pages/cart-runner";
import { ReviewPage } from "./support/pages/review";
import { SignInPage } from "./support/pages/sign-in";

test("the calculator works inside an offline run, and a call for a buy-off reaches the instructor's queue", async ({ browser }) => {
  test.setTimeout(180_000);
  const instructor = await api("instructor@hangarleaf.test");
  const subjects = (await (await instructor.get("/api/subjects")).json()) as { subjects: { id: string }[] };
  const title = `Mount bolt torque ${Date.now()}`;
  const stepIds = [crypto.randomUUID(), crypto.randomUUID()];
  const created = await instructor.post("/api/cards", {
    data: {
      content: {
        title,
        ataChapter: "71",
        subjectId: subjects.subjects[0]!.id,
        estimatedMinutes: 20,
        steps: [
          {
            id: stepIds[0],
            text: "Work out the wrench setting for 300 in-lb with the 4 in adapter, then torque the bolts.",
            // 300 × 10 ÷ (10 + 4) = 214.3 in-lb: the calculator's default inputs.
            measurement: { label: "Wrench setting", unit: "in-lb", min: 210, max: 220 },
            calculator: "torque",
          },
          { id: stepIds[1], text: "Instructor checks the torque stripe on every bolt.", inspectionPoint: true },
        ],
      },
    },
  });
  expect(created.status()).toBe(201);
  const cardId = ((await created.json()) as { card: { id: string } }).card.id;
  expect((await instructor.post(`/api/cards/${cardId}/publish`)).status()).toBe(200);
  const student = await api("student@hangarleaf.test");
  const me = ((await (await student.get("/api/session")).json()) as { user: { id: string } }).user.id;
  expect((await instructor.post("/api/assignments", { data: { cardId, studentIds: [me], note: "Engine shop, stand 2" } })).status()).toBe(
    201,
  );

  const context = await browser.newContext();
  const page = await context.newPage();
  await new SignInPage(page).open("/sign-in?next=%2Fcart");
  await new SignInPage(page).signIn("student@hangarleaf.test");
  await page.getByRole("link", { name: new RegExp(title) }).click();
  const runner = new CartRunnerPage(page);
  await expect(runner.heading(title)).toBeVisible();
  await runner.waitForServiceWorker();
  const runId = runner.runId()!;

  await context.setOffline(true);
  await page.reload();
  await expect(runner.cartStatus()).toContainText("Offline");
  await runner.showAllSteps();
  await runner.openCalculator(1);
  await expect(runner.step(1).getByText("Set the wrench to", { exact: true })).toBeVisible();
  await runner.step(1).getByRole("button", { name: "Put into the reading" }).first().click();
  await expect(runner.step(1).getByLabel(/Wrench setting/)).toHaveValue(/214\.3/);
  await runner.step(1).getByRole("button", { name: "Record this reading" }).click();
  await expect(runner.recordedReading(1)).toContainText("within limits");
  await runner.completeStep(1);
  await runner.completeStep(2);
  // Later steps wait; the student calls the instructor from the cart.
  await runner.callInstructor(2);
  await expect(runner.step(2).getByText(/told as soon as this cart is back online/)).toBeVisible();
  await page.screenshot({ path: test.info().outputPath("cart-offline-call.png"), fullPage: true });

  await context.setOffline(false);
  await page.evaluate(() => window.dispatchEvent(new Event("online")));
  await expect(runner.cartStatus()).toContainText("all changes sent", { timeout: 20_000 });

  const reviewerContext = await browser.newContext();
  const reviewer = await reviewerContext.newPage();
  await new SignInPage(reviewer).open("/sign-in?next=%2F");
  await new SignInPage(reviewer).signIn("instructor@hangarleaf.test");
  await expect(reviewer.getByRole("heading", { name: /called you to the aircraft/ })).toBeVisible();
  const review = new ReviewPage(reviewer);
  await review.openBuyOffQueue();
  const row = reviewer.getByRole("row", { name: new RegExp(title) });
  await expect(row).toContainText("Step 2");
  await expect(row).toContainText("Called");
  await expect(row).toContainText("Engine shop, stand 2");
  await reviewer.screenshot({ path: test.info().outputPath("buy-off-queue.png") });
  await row.getByRole("link").first().click();
  await reviewer.waitForURL(new RegExp(`/review/${runId}`));
  await reviewer.getByRole("button", { name: "Buy off step 2" }).click();
  await expect(reviewer.getByText("Step 2 bought off.")).toBeVisible();
  await reviewer.screenshot({ path: test.info().outputPath("review-run.png"), fullPage: true });
  await review.openBuyOffQueue();
  await expect(reviewer.getByRole("row", { name: new RegExp(title) })).toHaveCount(0);

  await page.reload();
  await runner.showAllSteps();
  await expect(runner.step(2).getByText(/^Bought off \d{4}-/)).toBeVisible();
  await reviewerContext.close();
  await context.close();
});
