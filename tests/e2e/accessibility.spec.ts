import { createRequire } from "node:module";
import { expect, test, type Page } from "@playwright/test";
import { CardEditorPage } from "./support/pages/card-editor";
import { CartRunnerPage } from "./support/pages/cart-runner";
import { ReviewPage } from "./support/pages/review";
import { SignInPage } from "./support/pages/sign-in";

const axePath = createRequire(import.meta.url).resolve("axe-core/axe.min.js");

async function seriousViolations(page: Page) {
  await page.addScriptTag({ path: axePath });
  const results = await page.evaluate(async () => {
    const axe = (
      window as unknown as {
        axe: {
          run: (
            context: Document,
            options: object,
          ) => Promise<{ violations: { id: string; impact: string; nodes: { target: string[] }[] }[] }>;
        };
      }
    ).axe;
    return axe.run(document, { resultTypes: ["violations"] });
  });
  return results.violations
    .filter((v) => v.impact === "serious" || v.impact === "critical")
    .map((v) => `${v.id}: ${v.nodes.map((n) => n.target.join(" ")).join(", ")}`);
}

test("the sign-in page has no serious accessibility violation", async ({ page }) => {
  await new SignInPage(page).open();
  expect(await seriousViolations(page)).toEqual([]);
});

test("the admin pages have no serious accessibility violation", async ({ page }) => {
  const signIn = new SignInPage(page);
  await signIn.open();
  await signIn.signIn("admin@hangarleaf.test");
  await expect(page.getByRole("heading", { level: 1 })).toContainText("Hello");
  for (const path of ["/", "/accounts", "/classes", "/audit"]) {
    await page.goto(path);
    await expect(page.getByRole("heading", { level: 1 })).toBeVisible();
    expect(await seriousViolations(page), path).toEqual([]);
  }
  await page.goto("/classes");
  await page.getByRole("link", { name: "AMT Day Cohort 2027" }).click();
  await expect(page.getByRole("heading", { name: "AMT Day Cohort 2027" })).toBeVisible();
  expect(await seriousViolations(page), "class page").toEqual([]);
});

test("buttons and fields are large enough for gloved hands", async ({ page }) => {
  await new SignInPage(page).open();
  for (const target of [page.getByRole("button", { name: "Sign in" }), page.getByLabel("E-mail"), page.getByLabel("Password")]) {
    const box = await target.boundingBox();
    expect(box?.height ?? 0).toBeGreaterThanOrEqual(44); // WCAG 2.2 SC 2.5.5 target size (enhanced): 44 × 44 CSS px
  }
});

test("the task card and calculator pages have no serious accessibility violation", async ({ page }) => {
  const signIn = new SignInPage(page);
  await signIn.open("/sign-in?next=%2Fcards");
  await signIn.signIn("instructor@hangarleaf.test");
  await expect(page.getByRole("heading", { level: 1, name: "Task cards" })).toBeVisible();
  expect(await seriousViolations(page), "/cards").toEqual([]);
  await page.getByRole("link", { name: "Aileron control cable tension check" }).click();
  await expect(page.getByRole("heading", { level: 1, name: "Aileron control cable tension check" })).toBeVisible();
  expect(await seriousViolations(page), "card page").toEqual([]);
  await page.getByRole("link", { name: /^Edit/ }).click();
  await expect(new CardEditorPage(page).heading(/Editing/)).toBeVisible();
  expect(await seriousViolations(page), "card editor").toEqual([]);
  for (const path of [
    "/calculators",
    "/calculators/rivets",
    "/calculators/bend",
    "/calculators/torque",
    "/calculators/penetrant",
    "/calculators/coil-shot",
    "/calculators/units",
    "/cards/new",
  ]) {
    await page.goto(path);
    await expect(page.getByRole("heading", { level: 1 })).toBeVisible();
    expect(await seriousViolations(page), path).toEqual([]);
  }
});

test("the cart, review and records pages have no serious accessibility violation", async ({ page, browser }) => {
  const signIn = new SignInPage(page);
  await signIn.open("/sign-in?next=%2Fcart");
  await signIn.signIn("student@hangarleaf.test");
  await expect(page.getByRole("heading", { level: 1, name: "My work" })).toBeVisible();
  await expect(page.getByRole("link", { name: /Fluorescent penetrant/ })).toBeVisible();
  expect(await seriousViolations(page), "/cart").toEqual([]);
  await page.getByRole("link", { name: /Fluorescent penetrant/ }).click();
  await expect(new CartRunnerPage(page).heading(/Fluorescent penetrant/)).toBeVisible();
  expect(await seriousViolations(page), "/cart/run").toEqual([]);
  await page.goto("/records");
  await expect(page.getByRole("heading", { level: 1, name: "My training record" })).toBeVisible();
  expect(await seriousViolations(page), "own record").toEqual([]);

  const staff = await browser.newPage();
  const staffSignIn = new SignInPage(staff);
  await staffSignIn.open("/sign-in?next=%2Freview");
  await staffSignIn.signIn("instructor@hangarleaf.test");
  const review = new ReviewPage(staff);
  await expect(review.listHeading()).toBeVisible();
  expect(await seriousViolations(staff), "/review").toEqual([]);
  await review.openRunOf("Jordan Pike");
  await expect(review.decisionHeading()).toBeVisible();
  expect(await seriousViolations(staff), "review a run").toEqual([]);
  await staff.goto("/records");
  await staff.getByRole("link", { name: /AMT Day Cohort 2027/ }).click();
  await expect(staff.getByRole("img", { name: /^Task cards signed off of those assigned/ })).toBeVisible();
  expect(await seriousViolations(staff), "class record").toEqual([]);
  await staff.goto("/fleet");
  await staff.getByRole("link", { name: "HL-TR3" }).click();
  await expect(staff.getByRole("heading", { level: 1, name: "HL-TR3" })).toBeVisible();
  expect(await seriousViolations(staff), "an asset's page").toEqual([]);
  await staff.goto("/hangar");
  await expect(staff.getByRole("heading", { level: 1, name: /^Hangar plan/ })).toBeVisible();
  expect(await seriousViolations(staff), "the hangar plan").toEqual([]);
  await staff.close();
});
