// The cart end to end in Chromium: a student opens an assigned card, the network goes, the page
// reloads and still works, readings out of and within limits, a note; back online the events are
// sent exactly once; the instructor returns the run, the student fixes it, the instructor signs
// off; the student's record shows it. Then a second student signs in on the same browser profile
// and finds none of the first one's data.
import { expect, request as apiRequest, test, type APIRequestContext } from "@playwright/test";
import { demoPassword, SignInPage } from "./support/pages";

const baseURL = process.env.HL_BASE_URL ?? "http://localhost:3000";

async function api(email: string): Promise<APIRequestContext> {
  const context = await apiRequest.newContext({ baseURL });
  const answer = await context.post("/api/session", { data: { email, password: demoPassword } });
  expect(answer.status()).toBe(200);
  return context;
}

test("a run on the cart survives going offline, syncs once, is returned, fixed and signed off", async ({ browser }) => {
  test.setTimeout(180_000);
  const instructor = await api("instructor@hangarleaf.test");
  const subjects = (await (await instructor.get("/api/subjects")).json()) as { subjects: { id: string; name: string }[] };
  const subject = subjects.subjects.find((s) => s.name === "Flight controls") ?? subjects.subjects[0]!;
  // The demo's own manual: the integration tests leave manuals of their own in the same database.
  const manuals = (await (await instructor.get("/api/manuals")).json()) as { manuals: { id: string; title: string; currentRevisionId: string | null }[] };
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
  await expect(page.getByRole("heading", { level: 1, name: title })).toBeVisible();
  // The service worker controls the page and the cited page is stored before the network goes.
  await page.evaluate(async () => {
    await navigator.serviceWorker.ready;
    if (!navigator.serviceWorker.controller) await new Promise((r) => navigator.serviceWorker.addEventListener("controllerchange", r, { once: true }));
  });
  await expect(page.getByRole("button", { name: /Show page 2/ })).toBeVisible();
  const runId = new URL(page.url()).searchParams.get("id")!;

  await context.setOffline(true);
  await page.reload();
  await expect(page.getByRole("heading", { level: 1, name: title })).toBeVisible();
  await expect(page.getByTestId("cart-status")).toContainText("Offline");
  await page.getByRole("button", { name: "All steps" }).click();
  const step1 = page.getByRole("listitem", { name: "Step 1" });
  await expect(step1.getByRole("note", { name: /CAUTION/ })).toBeVisible();
  await step1.getByLabel(/Cable tension/).fill("44");
  await step1.getByRole("button", { name: "Record this reading" }).click();
  await expect(step1.getByTestId("recorded-1")).toContainText("OUT OF LIMITS");
  await step1.getByLabel(/Cable tension/).fill("36 lb");
  await step1.getByRole("button", { name: "Record this reading" }).click();
  await expect(step1.getByTestId("recorded-1")).toContainText("within limits");
  await step1.getByLabel("Note on this step").fill("Turnbuckle at the aft pulley re-tensioned");
  await step1.getByRole("button", { name: "Add note" }).click();
  await step1.getByRole("button", { name: "Mark step 1 done" }).click();
  await page.getByRole("listitem", { name: "Step 2" }).getByRole("button", { name: "Mark step 2 done" }).click();
  await expect(page.getByTestId("cart-status")).toContainText("5 changes wait");
  // The cited page opens from the offline packet.
  await step1.getByRole("button", { name: /Show page 2/ }).click();
  await expect(step1.locator("canvas")).toBeVisible({ timeout: 15_000 });
  // "My work" opens offline too, and the search finds the card among what is stored.
  await page.goto("/cart");
  await expect(page.getByRole("link", { name: new RegExp(title) })).toBeVisible();
  await page.getByRole("searchbox", { name: /Search my cards/ }).fill("turnbuckles");
  await expect(page.getByRole("list", { name: "Search results" }).getByRole("link", { name: new RegExp(title) })).toBeVisible();
  await page.goto(`/cart/run?id=${runId}`);
  await expect(page.getByTestId("cart-status")).toContainText("5 changes wait");

  await context.setOffline(false);
  await page.evaluate(() => window.dispatchEvent(new Event("online")));
  await expect(page.getByTestId("cart-status")).toContainText("all changes sent", { timeout: 20_000 });
  const events = async () => ((await (await instructor.get(`/api/runs/${runId}`)).json()) as { events: { id: string; type: string }[] }).events;
  let stored = await events();
  expect(stored.map((e) => e.type).sort()).toEqual(["note.added", "step.checked", "step.checked", "value.recorded", "value.recorded"]);
  expect(new Set(stored.map((e) => e.id)).size).toBe(5);

  await page.getByRole("button", { name: "Hand in for sign-off" }).click();
  await expect(page.getByTestId("run-status")).toContainText("Handed in");
  await expect.poll(async () => ((await (await instructor.get(`/api/runs/${runId}`)).json()) as { run: { status: string } }).run.status, { timeout: 20_000 }).toBe("submitted");

  // The instructor returns it from the review screen.
  const review = await browser.newContext();
  const reviewer = await review.newPage();
  const reviewerSignIn = new SignInPage(reviewer);
  await reviewerSignIn.open(`/sign-in?next=${encodeURIComponent(`/review/${runId}`)}`);
  await reviewerSignIn.signIn("instructor@hangarleaf.test");
  await expect(reviewer.getByText(/36 lb, within limits/)).toBeVisible();
  await expect(reviewer.getByText("Note: Turnbuckle at the aft pulley re-tensioned")).toBeVisible();
  await reviewer.getByLabel(/Comment for the student/).fill("Show the safety wire on both turnbuckles in a photo next time; measure once more.");
  await reviewer.getByRole("button", { name: "Return with comment" }).click();
  await expect(reviewer.getByText("Returned to the student.")).toBeVisible();

  await page.reload();
  await expect(page.getByRole("note", { name: "Instructor's comment" })).toContainText("measure once more");
  await page.getByRole("button", { name: "All steps" }).click();
  await step1.getByLabel(/Cable tension/).fill("35");
  await step1.getByRole("button", { name: "Record this reading" }).click();
  await expect(step1.getByTestId("recorded-1")).toContainText("Recorded 35");
  await page.getByRole("button", { name: "Hand in for sign-off" }).click();
  await expect(page.getByTestId("run-status")).toContainText("Handed in");
  // The badge can still say "all changes sent" from before the click: ask the server instead.
  await expect.poll(async () => ((await (await instructor.get(`/api/runs/${runId}`)).json()) as { run: { status: string } }).run.status, { timeout: 20_000 }).toBe("submitted");

  await reviewer.reload();
  await reviewer.getByRole("button", { name: "Sign off" }).click();
  await expect(reviewer.getByText(/Signed off by Elena Brandt/)).toBeVisible();
  stored = await events();
  expect(stored.filter((e) => e.type === "run.signed_off")).toHaveLength(1);

  await page.goto("/records");
  await expect(page.getByRole("heading", { level: 1, name: "My training record" })).toBeVisible();
  await expect(page.getByRole("cell", { name: new RegExp(title) })).toBeVisible();
  await review.close();

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
  await page.goto(`/cart/run?id=${runId}`);
  await expect(page.getByText("This run is not stored on this laptop.")).toBeVisible();
  await expect(page.getByText("Turnbuckle at the aft pulley")).toHaveCount(0);
  await context.close();
});
