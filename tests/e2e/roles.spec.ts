import { expect, test } from "@playwright/test";
import { AppShell } from "./support/pages/app-shell";
import { SignInPage } from "./support/pages/sign-in";

const roles = [
  {
    email: "student@hangarleaf.test",
    role: "Student",
    nav: ["Home", "Search", "Library", "Task cards", "My work", "Calculators", "Fleet", "Records"],
  },
  {
    email: "librarian@hangarleaf.test",
    role: "Librarian",
    nav: ["Home", "Search", "Library", "Task cards", "Calculators", "Fleet", "Tool room"],
  },
  {
    email: "instructor@hangarleaf.test",
    role: "Instructor",
    nav: ["Home", "Search", "Library", "Task cards", "Review", "Calculators", "Fleet", "Classes", "Records"],
  },
  {
    email: "admin@hangarleaf.test",
    role: "Admin",
    nav: [
      "Home",
      "Search",
      "Library",
      "Task cards",
      "Review",
      "Calculators",
      "Fleet",
      "Classes",
      "Records",
      "Tool room",
      "Accounts",
      "Standard",
      "Audit log",
      "School settings",
      "Outbox",
    ],
  },
];

for (const { email, role, nav } of roles) {
  test(`${role.toLowerCase()} signs in, sees their own navigation, and signs out`, async ({ page }) => {
    const signIn = new SignInPage(page);
    const shell = new AppShell(page);
    await signIn.open();
    await signIn.signIn(email);
    await expect(page.getByRole("heading", { level: 1 })).toContainText("Hello");
    await expect(page.getByRole("banner")).toContainText(role);
    expect(await shell.navLabels()).toEqual(nav);
    await expect(page.getByRole("complementary", { name: "Training use notice" })).toBeVisible();
    await expect(page.getByRole("status").filter({ hasText: /Online|Offline/ })).toHaveText("Online");

    await shell.signOut();
    await page.goto("/");
    await expect(page).toHaveURL(/\/sign-in/);
  });
}

test("a wrong password is refused in plain words and the form keeps the address", async ({ page }) => {
  const signIn = new SignInPage(page);
  await signIn.open();
  await signIn.signIn("student@hangarleaf.test", "not-the-right-one");
  await expect(page.getByRole("alert").filter({ hasText: /./ })).toHaveText("That e-mail and password do not match an active account.");
  await expect(page.getByLabel("E-mail")).toHaveValue("student@hangarleaf.test");
});

test("a page asked for before sign-in opens after it", async ({ page }) => {
  await page.goto("/classes");
  await expect(page).toHaveURL(/\/sign-in\?next=%2Fclasses/);
  await new SignInPage(page).signIn("instructor@hangarleaf.test");
  await expect(page).toHaveURL(/\/classes$/);
  await expect(page.getByRole("link", { name: "AMT Day Cohort 2027" })).toBeVisible();
  // Not the evening class: this instructor is not in it.
  await expect(page.getByRole("link", { name: "AMT Evening Cohort 2027" })).toHaveCount(0);
});

test("a student who opens an admin page gets the 403 page", async ({ page }) => {
  await new SignInPage(page).open();
  await new SignInPage(page).signIn("student@hangarleaf.test");
  await expect(page.getByRole("heading", { level: 1 })).toContainText("Hello");
  const response = await page.goto("/accounts");
  expect(response?.status()).toBe(403);
  await expect(page.getByRole("heading", { name: "Your role does not open this page" })).toBeVisible();
});

test("the sign-in form works from the keyboard alone", async ({ page }) => {
  await new SignInPage(page).open();
  await page.getByLabel("E-mail").focus();
  await page.keyboard.type("librarian@hangarleaf.test");
  await page.keyboard.press("Tab");
  await page.keyboard.type("hangarleaf-demo");
  await page.keyboard.press("Enter");
  await expect(page.getByRole("heading", { level: 1 })).toContainText("Hello, Ines Okoro");
});
