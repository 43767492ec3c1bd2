// The demo trainer manual's Rev 4 (known changes against Rev 3, see secondRevisionOfTrainer) is
// ingested by the seed: its comparison, the citations it flags with their suggestions, the mails,
// and an instructor's recheck that makes a new draft version.
import { and, eq } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { getDb } from "@/db";
import { demoManuals, demoRevisions, secondRevisionOfTrainer } from "@/db/demo/manual-content";
import { sectionPage } from "@/db/demo/manual-pdf";
import { citationRechecks, manuals, revisionComparisons, revisions, taskCardVersions } from "@/db/schema";
import type { CardDto, CardVersionDto } from "@/lib/contracts/cards";
import type { PageChange } from "@/lib/domain/revisions/compare";
import { compareRevision } from "@/lib/server/revisions/impact";
import { call, demo, signIn, waitForMail } from "../support/http";

const first = demoManuals.find((m) => m.title.startsWith("HT-20"))!;
const second = secondRevisionOfTrainer(first);
const before = (code: string, part: Parameters<typeof sectionPage>[2] = "procedure") => sectionPage(first, code, part);
const after = (code: string, part: Parameters<typeof sectionPage>[2] = "procedure") => sectionPage(second, code, part);
const sectionPages = (manual: typeof first, code: string) => [0, 1, 2, 3, 4].map((k) => sectionPage(manual, code, "description") + k);

let rev3: string;
let rev4: string;
let instructor: string;
let propellerOwner: string;
let librarian: string;
let student: string;

async function cardId(title: string) {
  const [row] = await getDb()
    .select({ id: taskCardVersions.cardId })
    .from(taskCardVersions)
    .where(and(eq(taskCardVersions.title, title), eq(taskCardVersions.number, 1)));
  return row!.id;
}

beforeAll(async () => {
  const db = getDb();
  const ids = await db
    .select({ id: revisions.id, label: revisions.label })
    .from(revisions)
    .innerJoin(manuals, eq(manuals.id, revisions.manualId))
    .where(eq(manuals.title, first.title));
  rev3 = ids.find((r) => r.label === demoRevisions.trainerFirst.label)!.id;
  rev4 = ids.find((r) => r.label === demoRevisions.trainerSecond.label)!.id;
  // The comparison job runs in the worker a moment after Rev 4 (and Rev 3) are read.
  for (let i = 0; i < 300; i++) {
    const [row] = await db
      .select({ previous: revisionComparisons.previousRevisionId })
      .from(revisionComparisons)
      .where(eq(revisionComparisons.revisionId, rev4));
    if (row?.previous === rev3) break;
    await new Promise((r) => setTimeout(r, 500));
  }
  instructor = await signIn(demo.instructor);
  // The propeller card is the evening instructor's: only its owner (or a co-author, or an admin) rechecks it.
  propellerOwner = await signIn("instructor2@hangarleaf.test");
  librarian = await signIn(demo.librarian);
  student = await signIn(demo.student);
}, 180_000);

describe("revision impact", () => {
  it("compares Rev 4 with Rev 3 exactly as the known changes say", async () => {
    const response = await call("GET", `/api/revisions/${rev4}/changes`, { cookie: librarian });
    expect(response.status).toBe(200);
    const body = (await response.json()) as { previousRevisionId: string; pages: PageChange[]; summary: Record<string, number> };
    expect(body.previousRevisionId).toBe(rev3);
    // 12-40-00 added (5 pages), 61-20-00 withdrawn (5 pages), one limits page of 32-10-00 changed;
    // the pages between the insertion and the withdrawal shifted by five; after it, nothing moved.
    expect(body.summary).toEqual({ unchanged: 50, changed: 1, moved: 34, added: 5, removed: 5 });
    expect(body.pages.filter((p) => p.status === "added").map((p) => p.newPage)).toEqual(sectionPages(second, "12-40-00"));
    expect(body.pages.filter((p) => p.status === "removed").map((p) => p.oldPage)).toEqual(sectionPages(first, "61-20-00"));
    expect(body.pages.find((p) => p.status === "changed")).toMatchObject({
      oldPage: before("32-10-00", "limits"),
      newPage: after("32-10-00", "limits"),
    });
    expect(body.pages.find((p) => p.oldPage === before("27-10-00"))).toMatchObject({ status: "moved", newPage: after("27-10-00") });
    expect(body.pages.find((p) => p.oldPage === before("74-10-00"))).toMatchObject({ status: "unchanged", newPage: before("74-10-00") });
    // The first revision has nothing before it.
    const firstOne = (await (await call("GET", `/api/revisions/${rev3}/changes`, { cookie: librarian })).json()) as {
      previousRevisionId: string | null;
    };
    expect(firstOne.previousRevisionId).toBeNull();
  });

  it("flags exactly the expected cards and steps, with the expected suggestions", async () => {
    const rows = await getDb()
      .select({
        title: taskCardVersions.title,
        step: citationRechecks.stepNumber,
        status: citationRechecks.status,
        old: citationRechecks.oldPage,
        suggested: citationRechecks.suggestedPage,
      })
      .from(citationRechecks)
      .innerJoin(taskCardVersions, eq(taskCardVersions.id, citationRechecks.versionId))
      .where(eq(citationRechecks.revisionId, rev4));
    const seen = rows.map((r) => `${r.title} | step ${r.step} | ${r.status} | ${r.old} -> ${r.suggested ?? "none"}`).sort();
    expect(seen).toEqual(
      [
        `Aileron control cable tension check | step 1 | moved | ${before("27-10-00")} -> ${after("27-10-00")}`,
        `Aileron control cable tension check | step 2 | moved | ${before("27-10-00", "limits")} -> ${after("27-10-00", "limits")}`,
        `Aileron control cable tension check | step 3 | moved | ${before("27-10-00")} -> ${after("27-10-00")}`,
        `Main landing gear inspection on jacks | step 1 | moved | ${before("32-10-00")} -> ${after("32-10-00")}`,
        `Main landing gear inspection on jacks | step 2 | moved | ${before("32-10-00")} -> ${after("32-10-00")}`,
        `Main landing gear inspection on jacks | step 3 | changed | ${before("32-10-00", "limits")} -> ${after("32-10-00", "limits")}`,
        // The track section was withdrawn and nothing like it remains: no suggestion.
        `Propeller track check | step 1 | removed | ${before("61-20-00")} -> none`,
        `Propeller track check | step 2 | removed | ${before("61-20-00", "limits")} -> none`,
      ].sort(),
    );
    // The magneto timing card cites pages that did not change (the shift cancels out): not flagged.
    expect(rows.some((r) => r.title === "Magneto-to-engine timing check")).toBe(false);
  });

  it("runs again without flagging or mailing anything twice", async () => {
    const again = await compareRevision({ revisionId: rev4 });
    expect(again).toMatchObject({ previousRevisionId: rev3, flagged: 0, mailed: 0 });
    const rows = await getDb().select({ id: citationRechecks.id }).from(citationRechecks).where(eq(citationRechecks.revisionId, rev4));
    expect(rows).toHaveLength(8);
  });

  it("mails each owning instructor once, listing the cards and steps with links", async () => {
    const mail = await waitForMail(demo.instructor, /HT-20 Trainer Maintenance Manual Rev 4: 2 task cards to recheck/, 60);
    expect(mail.text).toContain("Aileron control cable tension check");
    expect(mail.text).toContain("Main landing gear inspection on jacks");
    expect(mail.text).toMatch(
      new RegExp(`Step 3: page ${before("32-10-00", "limits")} of Rev 3 changed; suggested page ${after("32-10-00", "limits")} of Rev 4`),
    );
    expect(mail.text).toMatch(/\/cards\/[0-9a-f-]+\/recheck/);
    expect(mail.text).not.toContain("Propeller track check");
    const other = await waitForMail("instructor2@hangarleaf.test", /HT-20 Trainer Maintenance Manual Rev 4: a task card to recheck/, 60);
    expect(other.text).toContain("Propeller track check");
    expect(other.text).toContain("no similar page found");
  });

  it("shows students a notice on the flagged steps, and the author a recheck that makes a new draft", async () => {
    const id = await cardId("Propeller track check");
    const v1 = ((await (await call("GET", `/api/cards/${id}/versions/1`, { cookie: student })).json()) as { version: CardVersionDto })
      .version;
    expect(v1.steps.map((s) => s.underRecheck)).toEqual([true, true]);
    const untouched = await cardId("Magneto-to-engine timing check");
    const magneto = (
      (await (await call("GET", `/api/cards/${untouched}/versions/1`, { cookie: student })).json()) as { version: CardVersionDto }
    ).version;
    expect(magneto.steps.every((s) => !s.underRecheck)).toBe(true);

    expect((await call("GET", `/api/cards/${id}/rechecks`, { cookie: student })).status).toBe(403);
    const list = (await (await call("GET", `/api/cards/${id}/rechecks`, { cookie: propellerOwner })).json()) as {
      rechecks: { id: string; stepNumber: number; old: { text: string }; suggested: { page: number | null } }[];
    };
    expect(list.rechecks.map((r) => r.stepNumber)).toEqual([1, 2]);
    expect(list.rechecks[0]!.old.text).toContain("61-20-00");

    // Accepting a suggestion that does not exist, or a page past the end, is refused and changes nothing.
    const [one, two] = list.rechecks;
    const noSuggestion = await call("POST", `/api/cards/${id}/rechecks`, {
      cookie: propellerOwner,
      json: { decisions: [{ id: one!.id, action: "accept" }] },
    });
    expect(noSuggestion.status).toBe(422);
    const pastEnd = await call("POST", `/api/cards/${id}/rechecks`, {
      cookie: propellerOwner,
      json: { decisions: [{ id: one!.id, action: "relink", page: 5000 }] },
    });
    expect(pastEnd.status).toBe(422);
    expect(((await (await call("GET", `/api/cards/${id}`, { cookie: propellerOwner })).json()) as { card: CardDto }).card.draft).toBeNull();

    const propellerInspection = after("61-10-00");
    const done = await call("POST", `/api/cards/${id}/rechecks`, {
      cookie: propellerOwner,
      json: {
        decisions: [
          { id: one!.id, action: "relink", page: propellerInspection },
          { id: two!.id, action: "drop" },
        ],
      },
    });
    expect(done.status).toBe(200);
    const draft = ((await done.json()) as { version: CardVersionDto }).version;
    expect(draft).toMatchObject({ number: 2, status: "draft" });
    expect(draft.steps[0]!.references.map((r) => [r.revisionId, r.page])).toEqual([[rev4, propellerInspection]]);
    expect(draft.steps[1]!.references).toEqual([]);
    const twice = await call("POST", `/api/cards/${id}/rechecks`, {
      cookie: propellerOwner,
      json: { decisions: [{ id: two!.id, action: "drop" }] },
    });
    expect(twice.status).toBe(409);

    // Until version 2 is published, students still see the notice on version 1.
    const stillFlagged = (
      (await (await call("GET", `/api/cards/${id}/versions/1`, { cookie: student })).json()) as { version: CardVersionDto }
    ).version;
    expect(stillFlagged.steps.map((s) => s.underRecheck)).toEqual([true, true]);
    expect((await (await call("GET", `/api/cards/${id}/rechecks`, { cookie: propellerOwner })).json()) as { rechecks: unknown[] }).toEqual({
      rechecks: [],
    });
    expect((await call("POST", `/api/cards/${id}/publish`, { cookie: propellerOwner })).status).toBe(200);
    const v2 = ((await (await call("GET", `/api/cards/${id}/versions/2`, { cookie: student })).json()) as { version: CardVersionDto })
      .version;
    expect(v2.steps.every((s) => !s.underRecheck)).toBe(true);
  });

  it("moves a card's unchanged citations of the old revision along when its others are rechecked", async () => {
    const id = await cardId("Aileron control cable tension check");
    const list = (await (await call("GET", `/api/cards/${id}/rechecks`, { cookie: instructor })).json()) as { rechecks: { id: string }[] };
    const response = await call("POST", `/api/cards/${id}/rechecks`, {
      cookie: instructor,
      json: { decisions: list.rechecks.map((r) => ({ id: r.id, action: "accept" })) },
    });
    expect(response.status).toBe(200);
    const draft = ((await response.json()) as { version: CardVersionDto }).version;
    expect(draft.steps.map((s) => s.references.map((r) => `${r.revisionLabel} p${r.page}`))).toEqual([
      [`Rev 4 p${after("27-10-00")}`],
      [`Rev 4 p${after("27-10-00", "limits")}`],
      [`Rev 4 p${after("27-10-00")}`],
    ]);
    // Throwing the draft away reopens the rechecks it held.
    expect((await call("DELETE", `/api/cards/${id}/draft`, { cookie: instructor })).status).toBe(204);
    const reopened = (await (await call("GET", `/api/cards/${id}/rechecks`, { cookie: instructor })).json()) as { rechecks: unknown[] };
    expect(reopened.rechecks).toHaveLength(3);
  });
});
