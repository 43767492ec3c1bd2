import { inArray, like, sql } from "drizzle-orm";
import { describe, expect, it } from "vitest";
import { getDb } from "@/db";
import { classes, users } from "@/db/schema";
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
});
