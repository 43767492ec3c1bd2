// The fleet in Chromium: a student picks the cart's aircraft once, names it on a run, and writes up
// a finding offline that reaches the server once when the network is back; an instructor books a
// bay already taken and reads the conflict, then books a free slot and sees it in the week.
import { expect, test } from "@playwright/test";
import { apiAs as api } from "./support/api";
import { CartRunnerPage } from "./support/pages/cart-runner";
import { SignInPage } from "./support/pages/sign-in";

test("a student picks the aircraft at the cart and files a finding offline, stored once", async ({ browser }) => {
  test.setTimeout(120_000);
  const instructor = await api("instructor@hangarleaf.test");
  const subjects = (await (await instructor.get("/api/subjects")).json()) as { subjects: { id: string }[] };
  const title = `Walk-around of the trainer ${Date.now()}`;
  const created = await instructor.post("/api/cards", {
    data: {
      content: {
        title,
        ataChapter: "05",
        subjectId: subjects.subjects[0]!.id,
        steps: [{ id: crypto.randomUUID(), text: "Walk around the aircraft." }],
      },
    },
  });
  const cardId = ((await created.json()) as { card: { id: string } }).card.id;
  expect((await instructor.post(`/api/cards/${cardId}/publish`)).status()).toBe(200);
  const student = await api("student@hangarleaf.test");
  const me = ((await (await student.get("/api/session")).json()) as { user: { id: string } }).user.id;
  expect((await instructor.post("/api/assignments", { data: { cardId, studentIds: [me] } })).status()).toBe(201);

  const context = await browser.newContext();
  const page = await context.newPage();
  await new SignInPage(page).open("/sign-in?next=%2Fcart");
  await new SignInPage(page).signIn("student@hangarleaf.test");
  const cartAircraft = page.getByRole("region", { name: "This cart's aircraft" });
  await cartAircraft.getByLabel("The aircraft this cart is at").selectOption({ label: "HL-TR2 · Aircraft HT-20" });
  await expect(cartAircraft).toContainText("Runs offer HL-TR2 first.");
  await page.getByRole("link", { name: new RegExp(title) }).click();
  const runner = new CartRunnerPage(page);
  await expect(runner.heading(title)).toBeVisible();
  const panel = page.getByRole("region", { name: "Aircraft worked on" });
  await expect(panel.getByLabel("Aircraft or part worked on")).toHaveValue(/.+/);
  await panel.getByRole("button", { name: "Work on this one" }).click();
  await expect(panel).toContainText("Working on HL-TR2 (HT-20)");
  await expect(runner.cartStatus()).toContainText("all changes sent", { timeout: 20_000 });

  await context.setOffline(true);
  await page.evaluate(() => window.dispatchEvent(new Event("offline")));
  await panel.getByRole("button", { name: /Write up a finding/ }).click();
  const finding = `Chafed brake line at the left main gear clamp ${Date.now()}`;
  await panel.getByLabel(/What did you find on HL-TR2/).fill(finding);
  await panel.getByRole("button", { name: "File the finding" }).click();
  await expect(panel.getByRole("status")).toContainText("Written up on HL-TR2 at step 1");
  await expect(runner.cartStatus()).toContainText("1 change waits");
  await page.screenshot({ path: test.info().outputPath("finding-offline.png"), fullPage: true });

  await context.setOffline(false);
  await page.evaluate(() => window.dispatchEvent(new Event("online")));
  await expect(runner.cartStatus()).toContainText("all changes sent", { timeout: 20_000 });
  const { assets } = (await (await student.get("/api/assets?q=HL-TR2")).json()) as { assets: { id: string }[] };
  const { findings } = (await (await instructor.get(`/api/findings?assetId=${assets[0]!.id}&open=true`)).json()) as {
    findings: { text: string; stepNumber: number | null; reportedByName: string }[];
  };
  const mine = findings.filter((f) => f.text === finding);
  expect(mine).toHaveLength(1);
  expect(mine[0]).toMatchObject({ stepNumber: 1, reportedByName: "Sam Whitlock" });

  // A part the run installs is named once here and written on the aircraft at sign-off.
  await panel.getByText(/This run removes or installs a part/).click();
  await panel.getByLabel("The run").selectOption("install");
  await panel.getByLabel("Part").selectOption({ label: "E-401 · Engine TF-400" });
  await panel.getByRole("button", { name: "Add to the run" }).click();
  await expect(panel.getByRole("status").last()).toContainText("written on the aircraft's record when your instructor signs the run off");
  await expect(panel).toContainText("Installs E-401 on HL-TR2 (recorded at sign-off)");
  const named = (await (await student.get(`/api/runs/${runner.runId()}/assets`)).json()) as { changes: { action: string }[] };
  expect(named.changes.map((c) => c.action)).toEqual(["install"]);
  await context.close();
});

test.describe("the hangar plan", () => {
  // The demo's bookings are on the school's clock (America/Chicago); the form reads this laptop's.
  test.use({ timezoneId: "America/Chicago" });

  test("an instructor books a bay already taken and reads why, then books a free slot and sees it in the week", async ({ page }) => {
    await new SignInPage(page).open("/sign-in?next=%2Fhangar");
    await new SignInPage(page).signIn("instructor@hangarleaf.test");
    await expect(page.getByRole("heading", { level: 1, name: /^Hangar plan: week of/ })).toBeVisible();
    const form = page.getByRole("form", { name: "Book an asset" });
    await form.getByLabel("Asset").selectOption({ label: "HL-TR1 · HT-20" });
    await form.getByLabel("Place").selectOption({ label: "Bay 1" });
    // Monday 09:00–10:00: inside the day cohort's seeded morning on HL-TR1 in Bay 1.
    await form.getByLabel("From").fill("09:00");
    await form.getByLabel("To").fill("10:00");
    await form.getByRole("button", { name: "Book it" }).click();
    await expect(form.getByRole("status")).toContainText(/HL-TR1 is already booked in Bay 1 for AMT Day Cohort 2027/);
    await page.screenshot({ path: test.info().outputPath("booking-conflict.png"), fullPage: true });

    // Sunday of the same week is free.
    const monday = await form.getByLabel("Day").inputValue();
    const sunday = new Date(Date.parse(`${monday}T12:00:00Z`) + 6 * 86_400_000).toISOString().slice(0, 10);
    await form.getByLabel("Day").fill(sunday);
    await form.getByLabel("From").fill("07:00");
    await form.getByLabel("To").fill("08:00");
    await form.getByLabel("Note").fill("Weekend rigging practice");
    await form.getByRole("button", { name: "Book it" }).click();
    await expect(form.getByRole("status")).toContainText("Booked: HL-TR1 in Bay 1.");
    const week = page.getByRole("region", { name: "The week by place" });
    await expect(week.getByRole("row", { name: /^Bay 1 Bay/ })).toContainText("07:00–08:00 HL-TR1");
    await expect(week).toContainText("Weekend rigging practice");
  });
});
