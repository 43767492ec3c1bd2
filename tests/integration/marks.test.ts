// Bookmarks and notes on manual pages, against the demo manual's Rev 3 → Rev 4 comparison: a
// mark follows its page to the later revision (moved, changed, removed), a note shown to a class
// reaches its students and nobody else, and only the writer removes a mark.
import { and, eq } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { getDb } from "@/db";
import { classes, manuals, revisionComparisons, revisions } from "@/db/schema";
import type { PageMarkDto } from "@/lib/contracts/marks";
import type { PageChange } from "@/lib/domain/revisions/compare";
import { call, demo, makeAccount, signIn } from "../support/http";

let student: string;
let instructor: string;
let outsider: string; // a student of no class of the demo instructor
let manualId: string;
let rev3: string;
let rev4: string;
let changes: PageChange[];
let dayClass: string;

const mark = (cookie: string, json: Record<string, unknown>) => call("POST", "/api/marks", { cookie, json });
const marksIn = async (cookie: string, revision: string) => {
  const answer = await call("GET", `/api/manuals/${manualId}/marks?revision=${revision}`, { cookie });
  expect(answer.status).toBe(200);
  return ((await answer.json()) as { marks: PageMarkDto[] }).marks;
};

beforeAll(async () => {
  student = await signIn(demo.student);
  instructor = await signIn(demo.instructor);
  const other = await makeAccount("student");
  outsider = await signIn(other.email, other.password);
  const [manual] = await getDb().select().from(manuals).where(eq(manuals.title, "HT-20 Trainer Maintenance Manual"));
  manualId = manual!.id;
  const revs = await getDb().select().from(revisions).where(eq(revisions.manualId, manualId));
  rev3 = revs.find((r) => r.label === "Rev 3")!.id;
  rev4 = revs.find((r) => r.label === "Rev 4")!.id;
  // The worker compares the revisions shortly after the seed; wait for it.
  for (let i = 0; i < 240 && !changes; i++) {
    const [row] = await getDb()
      .select()
      .from(revisionComparisons)
      .where(and(eq(revisionComparisons.revisionId, rev4), eq(revisionComparisons.previousRevisionId, rev3)));
    if (row) changes = row.pages as PageChange[];
    else await new Promise((r) => setTimeout(r, 500));
  }
  const [day] = await getDb().select().from(classes).where(eq(classes.name, "AMT Day Cohort 2027"));
  dayClass = day!.id;
}, 150_000);

describe("bookmarks and notes", () => {
  it("follow their page to the later revision: moved, changed, removed", async () => {
    const moved = changes.find((c) => c.status === "moved")!;
    const removed = changes.find((c) => c.status === "removed")!;
    const first = await mark(student, { revisionId: rev3, page: moved.oldPage, kind: "bookmark" });
    expect(first.status).toBe(201);
    const again = await mark(student, { revisionId: rev3, page: moved.oldPage, kind: "bookmark" });
    expect(((await again.json()) as { mark: { id: string } }).mark.id).toBe(((await first.json()) as { mark: { id: string } }).mark.id);
    expect(
      (await mark(student, { revisionId: rev3, page: removed.oldPage, kind: "note", text: "Check the torque table here." })).status,
    ).toBe(201);

    const inRev4 = await marksIn(student, rev4);
    const bookmark = inRev4.find((m) => m.kind === "bookmark" && m.made.page === moved.oldPage)!;
    expect(bookmark.here).toEqual({ page: moved.newPage, status: "moved" });
    expect(bookmark.made).toMatchObject({ revisionId: rev3, revisionLabel: "Rev 3" });
    const note = inRev4.find((m) => m.kind === "note" && m.made.page === removed.oldPage)!;
    expect(note.here).toEqual({ page: null, status: "removed" });
    // In the revision it was made on, it is where it was made.
    expect((await marksIn(student, rev3)).find((m) => m.id === bookmark.id)!.here).toEqual({ page: moved.oldPage, status: "unchanged" });
    // A mark made on Rev 4, read in Rev 3, cannot be placed backwards and says where it was made.
    await mark(student, { revisionId: rev4, page: 1, kind: "bookmark" });
    expect((await marksIn(student, rev3)).find((m) => m.made.revisionId === rev4)!.here).toBeNull();
  });

  it("shows an instructor's class note to that class only, and lets only the writer remove a mark", async () => {
    const text = `Bring the tensiometer ${Date.now()}`;
    const made = await mark(instructor, { revisionId: rev4, page: 2, kind: "note", text, classId: dayClass });
    expect(made.status).toBe(201);
    const id = ((await made.json()) as { mark: { id: string } }).mark.id;
    const seen = (await marksIn(student, rev4)).find((m) => m.id === id)!;
    expect(seen).toMatchObject({
      text,
      mine: false,
      className: "AMT Day Cohort 2027",
      authorName: "Elena Brandt",
      here: { page: 2, status: "unchanged" },
    });
    expect((await marksIn(outsider, rev4)).some((m) => m.id === id)).toBe(false);
    // Students' own marks are theirs alone.
    expect((await marksIn(instructor, rev4)).some((m) => m.kind === "bookmark" && !m.mine)).toBe(false);
    expect((await call("DELETE", `/api/marks/${id}`, { cookie: student })).status).toBe(404);
    expect((await call("DELETE", `/api/marks/${id}`, { cookie: instructor })).status).toBe(200);
    expect((await marksIn(student, rev4)).some((m) => m.id === id)).toBe(false);
  });

  it("refuses a page the revision lacks, an empty note, a class the writer does not teach, and NUL", async () => {
    const refused = async (cookie: string, json: Record<string, unknown>, field: string) => {
      const answer = await mark(cookie, json);
      expect(answer.status).toBe(422);
      expect(Object.keys(((await answer.json()) as { error: { fields: Record<string, string> } }).error.fields)).toContain(field);
    };
    await refused(student, { revisionId: rev4, page: 100_000, kind: "bookmark" }, "page");
    await refused(student, { revisionId: rev4, page: 1, kind: "note", text: "  " }, "text");
    await refused(student, { revisionId: rev4, page: 1, kind: "note", text: "x", classId: dayClass }, "classId");
    await refused(student, { revisionId: rev4, page: 1, kind: "bookmark", classId: dayClass }, "classId");
    await refused(student, { revisionId: rev4, page: 1, kind: "note", text: "a\u0000b" }, "text");
    await refused(student, { revisionId: rev4, page: 1, kind: "sticker" }, "kind");
    expect((await call("GET", `/api/manuals/${manualId}/marks`, { cookie: student })).status).toBe(422);
  });
});
