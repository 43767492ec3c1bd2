// A librarian corrects a manual's details and withdraws it (after seeing what cites it), against
// the real server and database: a withdrawn manual leaves the list and search, its pages stay
// readable for the cards that cite them, and restoring brings it all back.
import { randomUUID } from "node:crypto";
import { beforeAll, describe, expect, it } from "vitest";
import { getDb } from "@/db";
import { curriculumSubjects } from "@/db/schema";
import type { SearchResult } from "@/lib/contracts/search";
import { call, demo, signIn } from "../support/http";
import { makePdf, uniqueTitle, upload, waitForRevision } from "../support/library";

let librarian: string;
let instructor: string;
let student: string;
let manualId: string;
let revisionId: string;
// A word only this manual has, so search answers are about it alone.
const word = `zq${randomUUID()
  .slice(0, 6)
  .replace(/[^a-z]/g, "x")}bushing`;

const search = async (q: string) =>
  ((await (await call("GET", `/api/search?q=${encodeURIComponent(q)}`, { cookie: student })).json()) as SearchResult).hits;

beforeAll(async () => {
  [librarian, instructor, student] = [await signIn(demo.librarian), await signIn(demo.instructor), await signIn(demo.student)];
  const pdf = await makePdf([`32-50-00 STEERING\nInspect the ${word} for wear.`, "second page"]);
  const response = await upload(
    "/api/manuals",
    librarian,
    {
      title: uniqueTitle("Steering practice"),
      documentType: "maintenance_manual",
      applicability: "HT-20",
      ataChapters: "32",
      revisionLabel: "Rev 1",
      revisionDate: "2026-10-01",
    },
    { bytes: pdf },
  );
  expect(response.status).toBe(202);
  ({ manualId, revisionId } = (await response.json()) as { manualId: string; revisionId: string });
  await waitForRevision(librarian, revisionId);
});

describe("a manual's details and withdrawal", () => {
  it("corrects the details, reading 5 as chapter 05, and keeps titles one of a kind", async () => {
    const title = uniqueTitle("Nose steering practice");
    const fixed = await call("PATCH", `/api/manuals/${manualId}`, {
      cookie: librarian,
      json: { title, documentType: "school_procedure", applicability: "HT-20, HT-20B", ataChapters: "32, 5" },
    });
    expect(fixed.status).toBe(200);
    const manual = (await (await call("GET", `/api/manuals/${manualId}`, { cookie: student })).json()) as {
      title: string;
      ataChapters: string[];
      applicability: string[];
      documentType: string;
    };
    expect(manual).toMatchObject({
      title,
      documentType: "school_procedure",
      applicability: ["HT-20", "HT-20B"],
      ataChapters: ["32", "05"],
    });
    const taken = await call("PATCH", `/api/manuals/${manualId}`, {
      cookie: librarian,
      json: { title: "HT-20 Trainer Maintenance Manual", documentType: "maintenance_manual" },
    });
    expect(taken.status).toBe(409);
    const bad = await call("PATCH", `/api/manuals/${manualId}`, {
      cookie: librarian,
      json: { title: "x", documentType: "maintenance_manual", ataChapters: "321" },
    });
    expect(bad.status).toBe(422);
    expect(((await bad.json()) as { error: { fields: Record<string, string> } }).error.fields.ataChapters).toMatch(/two digits/);
    expect(
      (await call("PATCH", `/api/manuals/${manualId}`, { cookie: instructor, json: { title, documentType: "handbook" } })).status,
    ).toBe(403);
  });

  it("says what cites it, withdraws it from the list and search, keeps cited pages readable, and restores it", async () => {
    const [subject] = await getDb().select().from(curriculumSubjects).limit(1);
    const created = await call("POST", "/api/cards", {
      cookie: instructor,
      json: {
        content: {
          title: uniqueTitle("Steering card"),
          ataChapter: "32",
          subjectId: subject!.id,
          steps: [{ id: randomUUID(), text: "Inspect the bushing.", references: [{ revisionId, page: 1 }] }],
        },
      },
    });
    expect(created.status).toBe(201);
    const cardId = ((await created.json()) as { card: { id: string } }).card.id;
    const citing = (await (await call("GET", `/api/manuals/${manualId}/citations`, { cookie: librarian })).json()) as {
      cards: { cardId: string; status: string; openRuns: number }[];
    };
    expect(citing.cards).toEqual([expect.objectContaining({ cardId, status: "draft", openRuns: 0 })]);
    expect((await search(word)).length).toBeGreaterThan(0);

    expect((await call("POST", `/api/manuals/${manualId}/withdraw`, { cookie: librarian, json: { reason: " " } })).status).toBe(422);
    const out = await call("POST", `/api/manuals/${manualId}/withdraw`, {
      cookie: librarian,
      json: { reason: "Replaced by the school's new procedure." },
    });
    expect(out.status).toBe(200);
    expect((await call("POST", `/api/manuals/${manualId}/withdraw`, { cookie: librarian, json: { reason: "again" } })).status).toBe(409);
    // Out of search at once (the kept answers follow the change) …
    expect(await search(word)).toEqual([]);
    // … but its pages still open for the card that cites them, and in the revision's own search.
    expect((await call("GET", `/api/revisions/${revisionId}/pages/1`, { cookie: student })).status).toBe(200);
    const inside = (await (
      await call("GET", `/api/search?q=${encodeURIComponent(word)}&revision=${revisionId}`, { cookie: student })
    ).json()) as SearchResult;
    expect(inside.hits.length).toBeGreaterThan(0);
    const manual = (await (await call("GET", `/api/manuals/${manualId}`, { cookie: student })).json()) as {
      withdrawnAt: string | null;
      withdrawReason: string;
    };
    expect(manual.withdrawnAt).toBeTruthy();
    expect(manual.withdrawReason).toBe("Replaced by the school's new procedure.");

    expect((await call("POST", `/api/manuals/${manualId}/restore`, { cookie: student })).status).toBe(403);
    expect((await call("POST", `/api/manuals/${manualId}/restore`, { cookie: librarian })).status).toBe(200);
    expect((await call("POST", `/api/manuals/${manualId}/restore`, { cookie: librarian })).status).toBe(409);
    expect((await search(word)).length).toBeGreaterThan(0);
  });
});
