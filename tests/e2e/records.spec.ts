// Records export in Chromium: the demo instructor opens a student's training record from the class's
// progress, sees the signed-off card's version, the manual revision it cited, each measured value with
// its limit and verdict and who signed it off, then downloads the CSV and finds the same in its
// columns. The demo seed signs off Riley Amsel's riveted splice patch (db/demo/seed-runs.ts), with a
// reading inside the limits on each measured step.
import { readFile } from "node:fs/promises";
import { expect, test } from "@playwright/test";
import { RecordsPage } from "./support/pages/records";
import { SignInPage } from "./support/pages/sign-in";

const card = "Riveted splice patch on a practice skin panel";
const student = "Riley Amsel";

test("an instructor opens a student's record, sees what was measured and signed, and exports it as CSV", async ({ page }) => {
  const signIn = new SignInPage(page);
  await signIn.open("/sign-in?next=%2Frecords");
  await signIn.signIn("instructor@hangarleaf.test");
  const records = new RecordsPage(page);
  await expect(page.getByRole("heading", { level: 1, name: "Records" })).toBeVisible();
  await records.openClass("AMT Day Cohort 2027");
  // The class's progress is a chart (labelled with its figures) and the standard's grid with its gaps.
  await expect(page.getByRole("img", { name: /^Task cards signed off of those assigned, per subject/ })).toBeVisible();
  const grid = page.getByRole("region", { name: "Certification standard: skill elements" });
  await expect(grid).toContainText("Not yet demonstrated by anyone in the class");
  await expect(grid.getByRole("table", { name: "Airframe" }).getByRole("row").filter({ hasText: student })).toContainText("Shown");
  await page.screenshot({ path: test.info().outputPath("class-progress.png"), fullPage: true });
  await records.openStudent(student);
  await expect(records.recordHeading(student)).toBeVisible();

  const row = records.signedOffRow(card);
  await expect(row).toHaveCount(1);
  await expect(row).toContainText("v1");
  await expect(row).toContainText(/Fernhollow Sheet-Metal Standard Practices Rev 1, pages? \d/);
  await expect(row).toContainText("Step 1, Thickest sheet (doubler): 0.04 in (limits 0.04 ± 0.002 in), within limits");
  await expect(row).toContainText("Step 3, Edge distance, first rivet (1/8 in rivet): 0.375 in (limits 0.25 to 0.5 in), within limits");
  await expect(row).toContainText("Elena Brandt");

  const csv = await records.downloadCsv();
  expect(csv.name).toMatch(/\.csv$/);
  const [header, ...lines] = csv.text.trim().split("\r\n");
  const columns = header!.split(",");
  expect(columns).toEqual(
    expect.arrayContaining(["Task card", "Version", "Revisions cited", "Instructor", "Step", "Measured", "Value", "Limit", "Verdict"]),
  );
  const at = (line: string[], column: string) => line[columns.indexOf(column)];
  // Split on commas outside quotes: the revisions cell is quoted.
  const cells = (line: string) =>
    line.match(/("([^"]|"")*"|[^,]*)(,|$)/g)!.map((c) => c.replace(/,$/, "").replace(/^"|"$/g, "").replace(/""/g, '"'));
  const mine = lines.map(cells).filter((l) => at(l, "Task card") === card);
  expect(mine.map((l) => at(l, "Measured"))).toEqual([
    "Thickest sheet (doubler)",
    "Edge distance, first rivet (1/8 in rivet)",
    "Shop head diameter",
    "Shop head height",
  ]);
  const edge = mine[1]!;
  expect(at(edge, "Version")).toBe("1");
  expect(at(edge, "Revisions cited")).toMatch(/^Fernhollow Sheet-Metal Standard Practices Rev 1, pages? \d/);
  expect(at(edge, "Step")).toBe("3");
  expect(at(edge, "Value")).toBe("0.375 in");
  expect(at(edge, "Limit")).toBe("0.25 to 0.5 in");
  expect(at(edge, "Verdict")).toBe("within limits");
  expect(at(edge, "Instructor")).toBe("Elena Brandt");
  expect(mine.every((l) => at(l, "Verdict") === "within limits")).toBe(true);
});

test("a student reads their coverage of the certification standard, marked as the demo's excerpt", async ({ page }) => {
  const signIn = new SignInPage(page);
  await signIn.open("/sign-in?next=%2Frecords");
  await signIn.signIn("student3@hangarleaf.test");
  const coverage = page.getByRole("region", { name: "Certification standard: coverage" });
  await expect(coverage).toContainText("demo's excerpt");
  // The signed-off riveted splice demonstrates its mapped skills; the cable run in work practises its one.
  const row = (code: string) => coverage.getByRole("row").filter({ hasText: code });
  await expect(row("AM.II.A.S1")).toContainText("Demonstrated");
  await expect(row("AM.II.A.S1")).toContainText(`${card} (version 1), signed off by Elena Brandt`);
  await expect(row("AM.II.C.S1")).toContainText("Practised, not signed off");
  await expect(row("AM.III.G.S1")).toContainText("Not yet");
  // The chart says its figures to a screen reader; the same figures open as a table.
  await expect(coverage.getByRole("img", { name: /^Skill elements per section: / })).toBeVisible();
  await coverage.getByText("The figures as a table").click();
  await expect(coverage.getByRole("row", { name: /^Airframe \d/ }).first()).toBeVisible();
  // What remains before the practical test, as a CSV.
  const [download] = await Promise.all([
    page.waitForEvent("download"),
    coverage.getByRole("link", { name: "Readiness report (CSV)" }).click(),
  ]);
  const text = await readFile((await download.path())!, "utf8");
  expect(text.split("\r\n")[0]).toBe("Student,Section,Code,Kind,Area of operation,Element,Status,Practised in");
  expect(text).toMatch(/Riley Amsel,Powerplant,AM\.III\.G\.S1,Skill,.*,Not yet,/);
  expect(text).not.toMatch(/,AM\.II\.A\.S1,/);
  await page.screenshot({ path: test.info().outputPath("coverage.png"), fullPage: true });
});
