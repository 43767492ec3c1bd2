import { and, eq, inArray, like, sql } from "drizzle-orm";
import { describe, expect, it } from "vitest";
import { getDb } from "@/db";
import { classes, manuals, pages, revisions, taskCardVersions, users } from "@/db/schema";
import { demoCards, demoSubjects } from "@/db/demo/seed-cards";
import { demoManuals } from "@/db/demo/manual-content";
import { sectionPage } from "@/db/demo/manual-pdf";
import { demo } from "../support/http";

// `npm test` runs the seed twice before the tests: it must not duplicate anything.
describe("demo seed", () => {
  it("has one account per demo address and one per role at least", async () => {
    const rows = await getDb()
      .select({ email: users.email, role: users.role, n: sql<number>`count(*) over (partition by ${users.email})`.mapWith(Number) })
      .from(users)
      .where(inArray(users.email, Object.values(demo)));
    expect(rows).toHaveLength(4);
    expect(rows.every((r) => r.n === 1)).toBe(true);
    expect(new Set(rows.map((r) => r.role))).toEqual(new Set(["student", "instructor", "librarian", "admin"]));
  });

  it("has its classes once each", async () => {
    const rows = await getDb().select({ name: classes.name }).from(classes).where(like(classes.name, "AMT % Cohort 2027"));
    expect(rows.map((r) => r.name).sort()).toEqual(["AMT Day Cohort 2027", "AMT Evening Cohort 2027"]);
  });

  it("has each demo task card once, published", async () => {
    const rows = await getDb()
      .select({ title: taskCardVersions.title, status: taskCardVersions.status })
      .from(taskCardVersions)
      .where(
        and(
          inArray(
            taskCardVersions.title,
            demoCards.map((c) => c.title),
          ),
          eq(taskCardVersions.number, 1),
        ),
      );
    expect(rows.map((r) => r.title).sort()).toEqual(demoCards.map((c) => c.title).sort());
    expect(rows.every((r) => r.status === "published")).toBe(true);
    expect(demoSubjects.length).toBeGreaterThanOrEqual(4);
  });

  it("cites demo pages that hold the section the card means, once the manuals are read", async () => {
    for (const card of demoCards) {
      for (const ref of card.steps.flatMap((s) => s.refs ?? [])) {
        const manual = demoManuals.find((m) => m.title.startsWith(ref.manual))!;
        const page = sectionPage(manual, ref.code, ref.part);
        let text: string | undefined;
        for (let i = 0; i < 240 && text === undefined; i++) {
          const [row] = await getDb()
            .select({ text: pages.text })
            .from(pages)
            .innerJoin(revisions, eq(revisions.id, pages.revisionId))
            .innerJoin(manuals, eq(manuals.id, revisions.manualId))
            .where(and(eq(manuals.title, manual.title), eq(revisions.label, ref.label), eq(pages.pageNumber, page)));
          text = row?.text;
          if (text === undefined) await new Promise((r) => setTimeout(r, 500));
        }
        expect(text, `${card.title}: ${ref.manual} ${ref.code}`).toContain(ref.code);
      }
    }
  }, 150_000);
});
