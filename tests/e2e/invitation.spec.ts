import { randomUUID } from "node:crypto";
import { expect, test } from "@playwright/test";
import { waitForMailTo } from "./support/outbox";
import { AppShell } from "./support/pages/app-shell";
import { SignInPage } from "./support/pages/sign-in";

test("an admin invites a person; the mail's link sets a password that signs them in", async ({ page }) => {
  const email = `new-${randomUUID().slice(0, 8)}@test.hangarleaf.test`;
  const signIn = new SignInPage(page);
  await signIn.open();
  await signIn.signIn("admin@hangarleaf.test");
  await page.getByRole("navigation", { name: "Main" }).getByRole("link", { name: "Accounts" }).click();

  const form = page.getByRole("form", { name: "Add a person" });
  await form.getByLabel("Name").fill("Quinn Harlow");
  await form.getByLabel("E-mail").fill(email);
  await form.getByLabel("Role").selectOption("student");
  await form.getByRole("button", { name: "Add account" }).click();
  await expect(form.getByRole("status")).toHaveText(`Invitation sent to ${email}.`);

  const table = page.getByRole("table");
  await page.getByLabel("Find").fill(email);
  await expect(table.getByRole("row").filter({ hasText: email })).toContainText("Invited");

  await new AppShell(page).signOut();

  // The mail arrives in the local fake SMTP server. Its outbox page is the admin's alone: signed
  // out, it sends you to sign in (a reset link there would open any account).
  const text = await waitForMailTo(email, /invited/i);
  const link = /https?:\/\/\S+\/set-password\/[\w-]+/.exec(text)?.[0];
  expect(link).toBeTruthy();
  await page.goto("/outbox");
  await expect(page).toHaveURL(/\/sign-in/);
  await page.goto(new URL(link!).pathname);

  await expect(page.getByRole("heading", { name: "Welcome, Quinn Harlow" })).toBeVisible();
  await page.getByLabel("New password").fill("safety-wire-pliers");
  await page.getByLabel("The same password again").fill("safety-wire-pliers-typo");
  await page.getByRole("button", { name: "Set password" }).click();
  await expect(page.getByText("The two passwords differ.")).toBeVisible();
  await page.getByLabel("The same password again").fill("safety-wire-pliers");
  await page.getByRole("button", { name: "Set password" }).click();

  await expect(page.getByText("Your password is set. Sign in with it now.")).toBeVisible();
  await signIn.signIn(email, "safety-wire-pliers");
  await expect(page.getByRole("heading", { name: "Hello, Quinn Harlow" })).toBeVisible();

  // The same link does not work twice.
  await page.goto(new URL(link!).pathname);
  await expect(page.getByRole("heading", { name: "This link does not work any more" })).toBeVisible();
});
