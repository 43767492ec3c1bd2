// The cart end to end in Chromium: a student opens an assigned card, the network goes, the page
// reloads and still works, readings out of and within limits, a note; back online the events are
// sent exactly once; the instructor returns the run, the student fixes it, the instructor signs
// off; the student's record shows it. Then a second student signs in on the same browser profile
// and finds none of the first one's data.
import { expect, test } from "@playwright/test";
import { apiAs as api } from "./support/api";
import { CartRunnerPage } from "./support/pages/cart-runner";
import { ReviewPage } from "./support/pages/review";
import { SignInPage } from "./support/pages/sign-in";

test("a run on the cart survives going offline, syncs once, is returned, fixed and signed off", async ({ browser }) => {
  test.setTimeout(180_000);
  const instructor = await api("instructor@hangarleaf.test");
  const subjects = (await (await instructor.get("/api/subjects")).json()) as { subjects: { id: string; name: string }[] };
  const subject = subjects.subjects.find((s) => s.name === "Flight controls") ?? subjects.subjects[0]!;
  // The demo's own manual: the integration tests leave manuals of their own in the same database.
  const manuals = (await (await instructor.get("/api/manuals")).json()) as {
    manuals: { id: string; title: string; currentRevisionId: string | null }[];
  };
  const revisionId = manuals.manuals.find((m) => m.title === "HT-20 Trainer Maintenance Manual" && m.currentRevisionId)!.currentRevisionId!;
  const title = `Rudder cable tension ${Date.now()}`;
  const stepIds = [crypto.randomUUID(), crypto.randomUUID()];
  const created = await instructor.post("/api/cards", {
    data: {
      content: {
        title,
        ataChapter: "27",
        subjectId: subject.id,
        estimatedMinutes: 30,
        protectiveEquipment: ["Safety glasses"],
        steps: [
          {
            id: stepIds[0],
            text: "Measure the rudder cable tension with the tensiometer.",
            notices: [{ kind: "caution", text: "Do not step on the cables." }],
            references: [{ revisionId, page: 2 }],
            measurement: { label: "Cable tension", unit: "lb", min: 30, max: 40 },
          },
          { id: stepIds[1], text: "Safety the turnbuckles." },
        ],
      },
    },
  });
  expect(created.status()).toBe(201);
  const cardId = ((await created.json()) as { card: { id: string } }).card.id;
  expect((await instructor.post(`/api/cards/${cardId}/publish`)).status()).toBe(200);
  const student = await api("student@hangarleaf.test");
  const me = ((await (await student.get("/api/session")).json()) as { user: { id: string } }).user.id;
  expect((await instructor.post("/api/assignments", { data: { cardId, studentIds: [me], note: "Hangar 2, bay 1" } })).status()).toBe(201);

  const context = await browser.newContext();
  const page = await context.newPage();
  const signIn = new SignInPage(page);
  await signIn.open("/sign-in?next=%2Fcart");
  await signIn.signIn("student@hangarleaf.test");
  await page.getByRole("link", { name: new RegExp(title) }).click();
  const runner = new CartRunnerPage(page);
  await expect(runner.heading(title)).toBeVisible();
  // The service worker controls the page and the cited page is stored before the network goes.
  await runner.waitForServiceWorker();
  await expect(runner.citedPageButton(2)).toBeVisible();
  const runId = runner.runId()!;

  await context.setOffline(true);
  await page.reload();
  await expect(runner.heading(title)).toBeVisible();
  await expect(runner.cartStatus()).toContainText("Offline");
  await runner.showAllSteps();
  const step1 = runner.step(1);
  await expect(step1.getByRole("note", { name: /CAUTION/ })).toBeVisible();
  await runner.recordReading(1, /Cable tension/, "44");
  await expect(runner.recordedReading(1)).toContainText("OUT OF LIMITS");
  await runner.recordReading(1, /Cable tension/, "36 lb");
  await expect(runner.recordedReading(1)).toContainText("within limits");
  await runner.addNote(1, "Turnbuckle at the aft pulley re-tensioned");
  await runner.completeStep(1);
  await runner.completeStep(2);
  await expect(runner.cartStatus()).toContainText("5 changes wait");
  // The cited page opens from the offline packet.
  await runner.showCitedPage(1, 2);
  await expect(step1.locator("canvas")).toBeVisible({ timeout: 15_000 });
  // "My work" opens offline too, and the search finds the card among what is stored.
  await page.goto("/cart");
  await expect(page.getByRole("link", { name: new RegExp(title) })).toBeVisible();
  await page.getByRole("searchbox", { name: /Search my cards/ }).fill("turnbuckles");
  await expect(page.getByRole("list", { name: "Search results" }).getByRole("link", { name: new RegExp(title) })).toBeVisible();
  await runner.open(runId);
  await expect(runner.cartStatus()).toContainText("5 changes wait");

  await context.setOffline(false);
  await page.evaluate(() => window.dispatchEvent(new Event("online")));
  await expect(runner.cartStatus()).toContainText("all changes sent", { timeout: 20_000 });
  const events = async () =>
    ((await (await instructor.get(`/api/runs/${runId}`)).json()) as { events: { id: string; type: string }[] }).events;
  let stored = await events();
  expect(stored.map((e) => e.type).sort()).toEqual(["note.added", "step.checked", "step.checked", "value.recorded", "value.recorded"]);
  expect(new Set(stored.map((e) => e.id)).size).toBe(5);

  await runner.handIn();
  await expect(runner.runStatus()).toContainText("Waiting for your instructor's inspection");
  await expect
    .poll(async () => ((await (await instructor.get(`/api/runs/${runId}`)).json()) as { run: { status: string } }).run.status, {
      timeout: 20_000,
    })
    .toBe("submitted");

  // The instructor returns it from the review screen.
  const reviewerContext = await browser.newContext();
  const reviewer = await reviewerContext.newPage();
  const review = new ReviewPage(reviewer);
  const reviewerSignIn = new SignInPage(reviewer);
  await reviewerSignIn.open(`/sign-in?next=${encodeURIComponent(`/review/${runId}`)}`);
  await reviewerSignIn.signIn("instructor@hangarleaf.test");
  await expect(reviewer.getByText(/36 lb, within limits/)).toBeVisible();
  await expect(reviewer.getByText("Note: Turnbuckle at the aft pulley re-tensioned")).toBeVisible();
  await review.returnWithComment("Show the safety wire on both turnbuckles in a photo next time; measure once more.");
  await expect(reviewer.getByText("Sent back for rework.")).toBeVisible();

  await page.reload();
  await expect(runner.instructorComment()).toContainText("measure once more");
  await runner.showAllSteps();
  await runner.recordReading(1, /Cable tension/, "35");
  await expect(runner.recordedReading(1)).toContainText("Recorded 35");
  await runner.handIn();
  await expect(runner.runStatus()).toContainText("Waiting for your instructor's inspection");
  // The badge can still say "all changes sent" from before the click: ask the server instead.
  await expect
    .poll(async () => ((await (await instructor.get(`/api/runs/${runId}`)).json()) as { run: { status: string } }).run.status, {
      timeout: 20_000,
    })
    .toBe("submitted");

  await reviewer.reload();
  await review.signOff();
  await expect(reviewer.getByText(/Signed off by Elena Brandt/)).toBeVisible();
  stored = await events();
  expect(stored.filter((e) => e.type === "run.signed_off")).toHaveLength(1);

  await page.goto("/records");
  await expect(page.getByRole("heading", { level: 1, name: "My training record" })).toBeVisible();
  await expect(page.getByRole("cell", { name: new RegExp(title) })).toBeVisible();
  await reviewerContext.close();

  // A second student on the same profile after sign-out sees nothing of the first one's.
  await page.goto("/cart");
  await page.getByRole("button", { name: "Sign out" }).click();
  await expect(page.getByRole("heading", { name: "Sign in" })).toBeVisible();
  const databases = await page.evaluate(async () => (await indexedDB.databases()).map((d) => d.name));
  expect(databases).not.toContain(`hangarleaf-user-${me}`);
  await signIn.signIn("student2@hangarleaf.test");
  await page.waitForURL((url) => !url.pathname.startsWith("/sign-in"));
  await page.goto("/cart");
  await expect(page.getByRole("heading", { level: 1, name: "My work" })).toBeVisible();
  await expect(page.getByText("Jordan Pike")).toBeVisible();
  await expect(page.getByText(title)).toHaveCount(0);
  await runner.open(runId);
  await expect(runner.notStoredMessage()).toBeVisible();
  await expect(page.getByText("Turnbuckle at the aft pulley")).toHaveCount(0);
  await context.close();
});
