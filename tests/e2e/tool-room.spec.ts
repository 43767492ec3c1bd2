// The tool room from the desk to the record: the librarian scans a kit out to a student for a run;
// at the cart the card's tools say what the student has, the torque step asks which wrench and will
// not take one past its calibration (nor will the server); the kit comes back a tool short, the
// hand-in is held until the instructor clears it from Home, and then the run goes in.
import { expect, test } from "@playwright/test";
import { apiAs as api } from "./support/api";
import { CartRunnerPage } from "./support/pages/cart-runner";
import { SignInPage } from "./support/pages/sign-in";
import { ToolRoomPage } from "./support/pages/tool-room";

test("a kit lent for a run, a wrench past calibration refused, a tool missing holds the hand-in until cleared", async ({ browser }) => {
  test.setTimeout(180_000);
  const instructor = await api("instructor@hangarleaf.test");
  const desk = await api("librarian@hangarleaf.test");
  const subjects = (await (await instructor.get("/api/subjects")).json()) as { subjects: { id: string }[] };
  const title = `Wheel bolt torque ${Date.now()}`;
  const stepIds = [crypto.randomUUID(), crypto.randomUUID()];
  const created = await instructor.post("/api/cards", {
    data: {
      content: {
        title,
        ataChapter: "32",
        subjectId: subjects.subjects[0]!.id,
        tools: ["K-01 Sheet-metal toolbox 1", "TW-1 Torque wrench, 0-250 in-lb", "Shop rags"],
        steps: [
          { id: stepIds[0], text: "Clean the bolt threads." },
          {
            id: stepIds[1],
            text: "Torque the wheel bolts in a cross pattern.",
            measurement: { label: "Bolt torque", unit: "in-lb", min: 150, max: 180 },
            calibratedTool: true,
          },
        ],
      },
    },
  });
  expect(created.status()).toBe(201);
  const cardId = ((await created.json()) as { card: { id: string } }).card.id;
  expect((await instructor.post(`/api/cards/${cardId}/publish`)).status()).toBe(200);
  const student = await api("student@hangarleaf.test");
  const me = ((await (await student.get("/api/session")).json()) as { user: { id: string } }).user.id;
  expect((await instructor.post("/api/assignments", { data: { cardId, studentIds: [me], note: "Hangar 1, bay 1" } })).status()).toBe(201);
  const work = (await (await student.get("/api/my-work")).json()) as { work: { runId: string; cardId: string }[] };
  const runId = work.work.find((w) => w.cardId === cardId)!.runId;
  // Both demo torque wrenches go out with the run (TW-2 is past its calibration: the desk would not offer it).
  const tools = (await (await desk.get("/api/tools")).json()) as { tools: { id: string; number: string }[] };
  const wrench = (n: string) => tools.tools.find((t) => t.number === n)!.id;
  for (const n of ["TW-1", "TW-2"])
    expect((await desk.post("/api/checkouts", { data: { toolId: wrench(n), userId: me, runId } })).status()).toBe(201);

  // The desk: a scan of a past-due wrench is refused in words; the kit is scanned out for the run.
  const deskContext = await browser.newContext();
  const deskPage = await deskContext.newPage();
  await new SignInPage(deskPage).open("/sign-in?next=%2Ftools");
  await new SignInPage(deskPage).signIn("librarian@hangarleaf.test");
  const room = new ToolRoomPage(deskPage);
  await deskPage.waitForURL(/\/tools$/);
  await room.scan("tw-9999");
  await expect(room.scanSays()).toHaveText("No kit or tool is numbered TW-9999.");
  await room.scan("k-01");
  await expect(room.scanSays()).toContainText("Kit K-01, Sheet-metal toolbox 1");
  await room.lendTo("Sam Whitlock", title);
  await expect(deskPage.getByText(`lent to Sam Whitlock for "${title}"`)).toBeVisible();

  // The cart: the card's tools against what Sam has out; the torque step takes TW-1 only.
  const context = await browser.newContext();
  const page = await context.newPage();
  await new SignInPage(page).open(`/sign-in?next=${encodeURIComponent(`/cart/run?id=${runId}`)}`);
  await new SignInPage(page).signIn("student@hangarleaf.test");
  const runner = new CartRunnerPage(page);
  await expect(runner.heading(title)).toBeVisible();
  const toolsPanel = page.getByRole("region", { name: "Tools" });
  await expect(toolsPanel).toContainText("K-01 Sheet-metal toolbox 1 (you have it out)");
  await expect(toolsPanel).toContainText("TW-1 Torque wrench, 0-250 in-lb (you have it out)");
  await runner.showAllSteps();
  const withTool = runner.step(2).getByLabel("Taken with (calibrated tool)");
  await expect(withTool.locator("option", { hasText: "TW-2" })).toBeDisabled();
  await expect(withTool.locator("option", { hasText: "TW-2" })).toContainText("PAST CALIBRATION");
  await runner
    .step(2)
    .getByLabel(/Bolt torque/)
    .fill("165 in-lb");
  await expect(runner.step(2).getByRole("button", { name: "Record this reading" })).toBeDisabled();
  await withTool.selectOption(wrench("TW-1"));
  await runner.step(2).getByRole("button", { name: "Record this reading" }).click();
  await expect(runner.recordedReading(2)).toContainText("Taken with TW-1");
  // The server refuses the past-due wrench too, naming it.
  const refused = await page.request.post(`/api/runs/${runId}/events`, {
    data: {
      events: [
        {
          id: crypto.randomUUID(),
          type: "value.recorded",
          stepId: stepIds[1],
          clientTime: new Date().toISOString(),
          payload: { value: "165 in-lb", toolId: wrench("TW-2") },
        },
      ],
    },
  });
  expect(refused.status()).toBe(422);
  expect(((await refused.json()) as { error: { message: string } }).error.message).toMatch(/TW-2 was due for calibration on/);
  await runner.completeStep(1);
  await runner.completeStep(2);
  await expect(page.getByText(/all changes sent/)).toBeVisible({ timeout: 20_000 });

  // Back at the desk, a tool short: the hold shows there, on the cart and on the instructor's Home.
  await deskPage.reload();
  await room.countIn("kit K-01", ["T-104"]);
  await expect(deskPage.getByText(/T-104 missing: a hold is open/)).toBeVisible();
  await page.reload();
  await expect(page.getByTestId("tool-hold")).toContainText("T-104 Rivet gauge, diameter and height was not counted back in");
  await expect(page.getByRole("button", { name: "Hand in for inspection" })).toBeDisabled();
  await page.screenshot({ path: test.info().outputPath("cart-hand-in-held.png"), fullPage: true });

  const teacherContext = await browser.newContext();
  const teacher = await teacherContext.newPage();
  await new SignInPage(teacher).open("/sign-in?next=%2F");
  await new SignInPage(teacher).signIn("instructor@hangarleaf.test");
  const hold = teacher.getByRole("listitem").filter({ hasText: "T-104 Rivet gauge" });
  await expect(hold).toContainText(`for "${title}"`);
  await teacher.screenshot({ path: test.info().outputPath("home-hold.png"), fullPage: true });
  await hold.getByLabel("Found, back in the tool room").check();
  await hold.getByRole("button", { name: "Clear the hold" }).click();
  await expect(teacher.getByText("T-104: cleared, the tool was found. Sam Whitlock can hand the run in.")).toBeVisible();

  await page.reload();
  await expect(page.getByTestId("tool-hold")).toHaveCount(0);
  await runner.handIn();
  await expect(runner.runStatus()).toContainText("Waiting for your instructor's inspection");

  // Put the wrenches back for the tests after this one.
  const loans = (await (await desk.get("/api/checkouts")).json()) as { checkouts: { id: string; runId: string | null }[] };
  for (const loan of loans.checkouts.filter((c) => c.runId === runId))
    expect((await desk.post(`/api/checkouts/${loan.id}/return`, { data: { missingToolIds: [] } })).status()).toBe(200);
  await teacherContext.close();
  await context.close();
  await deskContext.close();
});
