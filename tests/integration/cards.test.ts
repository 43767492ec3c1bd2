// Task cards through the API against the real server and database: drafts, citations checked
// against the library, publishing freezes a version (in the API and in the database itself),
// editing a published card opens a new draft, duplicate, archive, the printable PDF, bad input.
import { execFile } from "node:child_process";
import { mkdtemp, rm, writeFile } from "node:fs/promises";
import { tmpdir } from "node:os";
import path from "node:path";
import { promisify } from "node:util";
import { randomUUID } from "node:crypto";
import { eq, sql } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { getDb } from "@/db";
import { cardCitations, curriculumSubjects, taskCardVersions } from "@/db/schema";
import type { CardDto, CardSummaryDto, CardVersionDto } from "@/lib/contracts/cards";
import { call, demo, makeAccount, signIn } from "../support/http";
import { makePdf, uniqueTitle, upload, waitForRevision } from "../support/library";

const run = promisify(execFile);

let instructor: string;
let student: string;
let admin: string;
let revisionId: string;
let subjectId: string;

const step = (over: Record<string, unknown> = {}) => ({
  id: randomUUID(),
  text: "Measure the cable tension at the marked station.",
  notices: [],
  references: [],
  measurement: null,
  calculator: null,
  inspectionPoint: false,
  timerMinutes: null,
  ...over,
});

const content = (over: Record<string, unknown> = {}) => ({
  title: uniqueTitle("Cable tension check"),
  applicability: ["HT-20"],
  ataChapter: "27",
  subjectId,
  estimatedMinutes: 30,
  tools: ["Tensiometer"],
  consumables: [],
  protectiveEquipment: ["Safety glasses"],
  steps: [step({ references: [{ revisionId, page: 2, quote: "tension" }] })],
  ...over,
});

async function createCard(body: Record<string, unknown> = content()) {
  const response = await call("POST", "/api/cards", { cookie: instructor, json: { content: body } });
  expect(response.status).toBe(201);
  return ((await response.json()) as { card: CardDto }).card;
}

beforeAll(async () => {
  const account = async (role: "instructor" | "student" | "librarian") => {
    const a = await makeAccount(role);
    return signIn(a.email, a.password);
  };
  instructor = await account("instructor");
  student = await account("student");
  admin = await signIn(demo.admin);
  const librarian = await account("librarian");
  const pdf = await makePdf(["Cable tension page one", "Aileron cable tension 30 to 40 lb", "Turnbuckle safety clips"]);
  const answer = await upload(
    "/api/manuals",
    librarian,
    {
      title: uniqueTitle("Cards test manual"),
      documentType: "maintenance_manual",
      applicability: "HT-20",
      ataChapters: "27",
      revisionLabel: "Rev 1",
      revisionDate: "2026-01-10",
    },
    { bytes: pdf },
  );
  expect(answer.status).toBe(202);
  const { revisionId: id } = (await answer.json()) as { revisionId: string };
  expect((await waitForRevision(librarian, id)).status).toBe("ready");
  revisionId = id;
  const name = uniqueTitle("Test subject");
  const created = await call("POST", "/api/subjects", { cookie: admin, json: { name } });
  expect(created.status).toBe(201);
  subjectId = ((await created.json()) as { subject: { id: string } }).subject.id;
}, 120_000);

describe("task cards", () => {
  it("creates a draft whose citation names the manual, revision and page", async () => {
    const card = await createCard();
    expect(card.draft?.number).toBe(1);
    expect(card.published).toBeNull();
    const ref = card.draft!.steps[0]!.references[0]!;
    expect(ref).toMatchObject({ revisionId, page: 2, quote: "tension", revisionLabel: "Rev 1", current: true });
    expect(ref.manualTitle).toMatch(/Cards test manual/);
    const rows = await getDb().select().from(cardCitations).where(eq(cardCitations.versionId, card.draft!.id));
    expect(rows).toHaveLength(1);
    expect(rows[0]).toMatchObject({ pageNumber: 2, stepNumber: 1 });
  });

  it("refuses a page the revision does not have, and keeps the saved draft", async () => {
    const card = await createCard();
    const before = card.draft!;
    const bad = await call("PUT", `/api/cards/${card.id}/draft`, {
      cookie: instructor,
      json: {
        content: content({ title: before.title, steps: [step({ references: [{ revisionId, page: 99 }] })] }),
        editCount: before.editCount,
      },
    });
    expect(bad.status).toBe(422);
    expect(((await bad.json()) as { error: { message: string } }).error.message).toMatch(/page 99 .* has 3 pages/);
    const unknown = await call("PUT", `/api/cards/${card.id}/draft`, {
      cookie: instructor,
      json: { content: content({ steps: [step({ references: [{ revisionId: randomUUID(), page: 1 }] })] }) },
    });
    expect(unknown.status).toBe(422);
    const again = ((await (await call("GET", `/api/cards/${card.id}`, { cookie: instructor })).json()) as { card: CardDto }).card;
    expect(again.draft!.steps).toEqual(before.steps);
    expect(again.draft!.editCount).toBe(before.editCount);
  });

  it("rejects what could never be stored, with the field named", async () => {
    const cases: [unknown, RegExp][] = [
      [{ content: { ...content(), ataChapter: "123" } }, /ataChapter/],
      [{ content: { ...content(), steps: [step({ notices: [{ kind: "danger", text: "x" }] })] } }, /steps/],
      [{ content: { ...content(), steps: [step({ measurement: { label: "Gap", unit: "in", min: "one" } })] } }, /steps/],
      [{ content: { ...content(), steps: "one" } }, /steps/],
      [{ content: { ...content(), subjectId: "not-an-id" } }, /subjectId/],
      [{ content: { ...content(), title: "x".repeat(161) } }, /title/],
      [{ content: { ...content(), title: "Nul\u0000inside" } }, /content/],
    ];
    for (const [json, field] of cases) {
      const response = await call("POST", "/api/cards", { cookie: instructor, json });
      expect(response.status).toBe(422);
      const body = (await response.json()) as { error: { message: string; fields?: Record<string, string> } };
      expect(Object.keys(body.error.fields ?? {}).join(" ")).toMatch(field);
    }
    const unknownSubject = await call("POST", "/api/cards", {
      cookie: instructor,
      json: { content: content({ subjectId: randomUUID() }) },
    });
    expect(unknownSubject.status).toBe(422);
    const notJson = await call("POST", "/api/cards", {
      cookie: instructor,
      body: "title=x",
      headers: { "content-type": "application/x-www-form-urlencoded" },
    });
    expect(notJson.status).toBe(415);
    const broken = await call("POST", "/api/cards", {
      cookie: instructor,
      body: '{"content":',
      headers: { "content-type": "application/json" },
    });
    expect(broken.status).toBe(400);
    const huge = await call("POST", "/api/cards", {
      cookie: instructor,
      json: { content: content({ steps: [step({ text: "x".repeat(600 * 1024) })] }) },
    });
    expect(huge.status).toBe(413);
  });

  it("saves an unfinished draft as typed, lists what it still needs, and publishing names every one", async () => {
    const unfinished = content({
      title: "",
      ataChapter: "2B",
      estimatedMinutes: -5,
      steps: [
        step(),
        step({ text: "", measurement: { label: "Gap", unit: "in", min: 2, max: 1 } }),
        step({ notices: [{ kind: "warning", text: "" }], measurement: { label: "", unit: "furlongs" }, timerMinutes: 0 }),
      ],
    });
    const card = await createCard(unfinished);
    const draft = card.draft!;
    // Nothing typed is dropped: the unknown unit and the inverted limits are stored as written.
    expect(draft.title).toBe("");
    expect(draft.ataChapter).toBe("2B");
    expect(draft.steps[1]!.measurement).toMatchObject({ min: 2, max: 1, unit: "in" });
    expect(draft.steps[2]!.measurement).toMatchObject({ label: "", unit: "furlongs" });
    expect(draft.problems.map((p) => p.field)).toEqual([
      "title",
      "ataChapter",
      "estimatedMinutes",
      "steps.2.text",
      "steps.2.measurement",
      "steps.3.notices",
      "steps.3.measurement",
      "steps.3.timerMinutes",
    ]);
    expect(draft.problems.find((p) => p.field === "steps.2.measurement")!.message).toBe("Step 2: The minimum is above the maximum.");
    expect(draft.problems.find((p) => p.field === "steps.3.measurement")!.message).toMatch(
      /^Step 3: Say what is measured; the unit "furlongs" is not known .*; give a minimum/,
    );

    const refused = await call("POST", `/api/cards/${card.id}/publish`, { cookie: instructor });
    expect(refused.status).toBe(422);
    const body = (await refused.json()) as { error: { message: string; fields: Record<string, string> } };
    expect(Object.keys(body.error.fields)).toEqual(draft.problems.map((p) => p.field));
    expect(body.error.message).toMatch(/^Not ready to publish: Give the card a title\. \(and 7 more\)$/);

    // One chapter digit is chapter 05; once everything is there, the list is empty and it publishes.
    const fixed = await call("PUT", `/api/cards/${card.id}/draft`, {
      cookie: instructor,
      json: { content: content({ ataChapter: "5" }), editCount: draft.editCount },
    });
    expect(fixed.status).toBe(200);
    const version = ((await fixed.json()) as { version: CardVersionDto }).version;
    expect(version.ataChapter).toBe("05");
    expect(version.problems).toEqual([]);
    expect((await call("POST", `/api/cards/${card.id}/publish`, { cookie: instructor })).status).toBe(200);
  });

  it("publishes only a complete draft, then freezes it: 409 from the API, and the database refuses too", async () => {
    const incomplete = await createCard(content({ subjectId: null }));
    const refused = await call("POST", `/api/cards/${incomplete.id}/publish`, { cookie: instructor });
    expect(refused.status).toBe(422);
    expect(((await refused.json()) as { error: { fields: Record<string, string> } }).error.fields.subjectId).toMatch(/subject/);

    const card = await createCard();
    const published = await call("POST", `/api/cards/${card.id}/publish`, { cookie: instructor });
    expect(published.status).toBe(200);
    const version = ((await published.json()) as { version: CardVersionDto }).version;
    expect(version).toMatchObject({ number: 1, status: "published" });
    expect(version.publishedAt).toBeTruthy();

    const twice = await call("POST", `/api/cards/${card.id}/publish`, { cookie: instructor });
    expect(twice.status).toBe(409);

    const patch = await call("PATCH", `/api/cards/${card.id}/versions/1`, {
      cookie: instructor,
      json: { content: content({ title: "Changed after publishing" }) },
    });
    expect(patch.status).toBe(409);
    const stored = (
      (await (await call("GET", `/api/cards/${card.id}/versions/1`, { cookie: instructor })).json()) as { version: CardVersionDto }
    ).version;
    expect(stored.title).toBe(version.title);
    expect(stored.steps).toEqual(version.steps);

    // Below the API: the trigger refuses an update, a delete and a change to the citations.
    const db = getDb();
    await expect(db.update(taskCardVersions).set({ title: "sneaky" }).where(eq(taskCardVersions.id, version.id))).rejects.toMatchObject({
      cause: { code: "HLF01" },
    });
    await expect(db.delete(taskCardVersions).where(eq(taskCardVersions.id, version.id))).rejects.toMatchObject({
      cause: { code: "HLF01" },
    });
    await expect(db.update(cardCitations).set({ pageNumber: 3 }).where(eq(cardCitations.versionId, version.id))).rejects.toMatchObject({
      cause: { code: "HLF01" },
    });
    await expect(
      db.execute(sql`insert into card_citations (version_id, step_id, step_number, manual_id, revision_id, page_number)
      select ${version.id}, step_id, 9, manual_id, revision_id, 1 from card_citations where version_id = ${version.id} limit 1`),
    ).rejects.toMatchObject({ cause: { code: "HLF01" } });
  });

  it("editing a published card opens draft version 2 and leaves version 1 as it was", async () => {
    const card = await createCard();
    await call("POST", `/api/cards/${card.id}/publish`, { cookie: instructor });
    const v1 = (
      (await (await call("GET", `/api/cards/${card.id}/versions/1`, { cookie: instructor })).json()) as { version: CardVersionDto }
    ).version;
    const save = await call("PUT", `/api/cards/${card.id}/draft`, {
      cookie: instructor,
      json: {
        content: content({ title: v1.title, steps: [...v1.steps.map(stripRefs), step({ text: "Safety the turnbuckles." })] }),
        editCount: v1.editCount,
      },
    });
    expect(save.status).toBe(200);
    const draft = ((await save.json()) as { version: CardVersionDto }).version;
    expect(draft).toMatchObject({ number: 2, status: "draft" });
    expect(draft.steps).toHaveLength(2);
    const after = ((await (await call("GET", `/api/cards/${card.id}`, { cookie: instructor })).json()) as { card: CardDto }).card;
    expect(after.versions.map((v) => [v.number, v.status])).toEqual([
      [1, "published"],
      [2, "draft"],
    ]);
    expect(after.published!.steps).toHaveLength(1);

    // A save from the copy loaded before that one is refused rather than overwriting it.
    const stale = await call("PUT", `/api/cards/${card.id}/draft`, {
      cookie: instructor,
      json: { content: content(), editCount: draft.editCount - 1 },
    });
    expect(stale.status).toBe(409);

    // Students see version 1 only.
    const seen = ((await (await call("GET", `/api/cards/${card.id}`, { cookie: student })).json()) as { card: CardDto }).card;
    expect(seen.draft).toBeNull();
    expect(seen.versions.map((v) => v.number)).toEqual([1]);
    expect((await call("GET", `/api/cards/${card.id}/versions/2`, { cookie: student })).status).toBe(404);

    const discard = await call("DELETE", `/api/cards/${card.id}/draft`, { cookie: instructor });
    expect(discard.status).toBe(204);
    const gone = ((await (await call("GET", `/api/cards/${card.id}`, { cookie: instructor })).json()) as { card: CardDto }).card;
    expect(gone.draft).toBeNull();
  });

  it("cites a page while reading: once, into the chosen step of the draft", async () => {
    const card = await createCard(content({ steps: [step(), step({ text: "Second step" })] }));
    const target = card.draft!.steps[1]!.id;
    const first = await call("POST", `/api/cards/${card.id}/draft/citations`, {
      cookie: instructor,
      json: { stepId: target, revisionId, page: 3, quote: "safety clips" },
    });
    expect(first.status).toBe(201);
    expect(await first.json()).toMatchObject({ citation: { stepNumber: 2, added: true } });
    const again = await call("POST", `/api/cards/${card.id}/draft/citations`, {
      cookie: instructor,
      json: { stepId: target, revisionId, page: 3 },
    });
    expect(again.status).toBe(200);
    const beyond = await call("POST", `/api/cards/${card.id}/draft/citations`, {
      cookie: instructor,
      json: { stepId: target, revisionId, page: 4 },
    });
    expect(beyond.status).toBe(422);
    const wrongStep = await call("POST", `/api/cards/${card.id}/draft/citations`, {
      cookie: instructor,
      json: { stepId: randomUUID(), revisionId, page: 1 },
    });
    expect(wrongStep.status).toBe(422);
    const after = ((await (await call("GET", `/api/cards/${card.id}`, { cookie: instructor })).json()) as { card: CardDto }).card;
    expect(after.draft!.steps[1]!.references.map((r) => [r.page, r.quote])).toEqual([[3, "safety clips"]]);
    expect(after.draft!.steps[0]!.references).toHaveLength(0);
  });

  it("lists with filters; students see published cards only", async () => {
    const title = uniqueTitle("Filterable");
    const card = await createCard(content({ title, ataChapter: "32", applicability: ["Filter-Model"] }));
    const list = async (cookie: string, query: string) =>
      ((await (await call("GET", `/api/cards?${query}`, { cookie })).json()) as { cards: CardSummaryDto[] }).cards.map((c) => c.id);
    expect(await list(instructor, `q=${encodeURIComponent(title)}`)).toEqual([card.id]);
    expect(await list(instructor, "ata=32&model=filter-model")).toContain(card.id);
    expect(await list(instructor, "ata=27&model=filter-model")).not.toContain(card.id);
    expect(await list(instructor, "status=draft")).toContain(card.id);
    expect(await list(instructor, "status=published")).not.toContain(card.id);
    expect(await list(instructor, `subject=${subjectId}&q=${encodeURIComponent(title)}`)).toEqual([card.id]);
    expect(await list(student, `q=${encodeURIComponent(title)}`)).toEqual([]);
    expect((await call("GET", `/api/cards/${card.id}`, { cookie: student })).status).toBe(404);
    // Nonsense filters are ignored, not errors.
    expect((await call("GET", "/api/cards?status=bogus&ata=abc&subject=1", { cookie: instructor })).status).toBe(200);
    // LIKE wildcards in q are text.
    expect(await list(instructor, "q=%25%25%25")).toEqual([]);

    await call("POST", `/api/cards/${card.id}/publish`, { cookie: instructor });
    expect(await list(student, `q=${encodeURIComponent(title)}`)).toEqual([card.id]);
  });

  it("duplicates into a new draft card with its own step ids", async () => {
    const card = await createCard();
    const response = await call("POST", `/api/cards/${card.id}/duplicate`, { cookie: instructor });
    expect(response.status).toBe(201);
    const copy = ((await response.json()) as { card: CardDto }).card;
    expect(copy.id).not.toBe(card.id);
    expect(copy.draft!.title).toBe(`Copy of ${card.draft!.title}`);
    expect(copy.draft!.steps[0]!.id).not.toBe(card.draft!.steps[0]!.id);
    expect(copy.draft!.steps[0]!.references).toEqual(card.draft!.steps[0]!.references);
  });

  it("archives: gone from the lists and from students, no edits until restored", async () => {
    const card = await createCard();
    await call("POST", `/api/cards/${card.id}/publish`, { cookie: instructor });
    const archived = await call("POST", `/api/cards/${card.id}/archive`, { cookie: instructor, json: { archived: true } });
    expect(archived.status).toBe(200);
    const ids = ((await (await call("GET", "/api/cards", { cookie: instructor })).json()) as { cards: CardSummaryDto[] }).cards.map(
      (c) => c.id,
    );
    expect(ids).not.toContain(card.id);
    const inArchive = (
      (await (await call("GET", "/api/cards?status=archived", { cookie: instructor })).json()) as { cards: CardSummaryDto[] }
    ).cards;
    expect(inArchive.find((c) => c.id === card.id)?.status).toBe("archived");
    expect((await call("GET", `/api/cards/${card.id}`, { cookie: student })).status).toBe(404);
    // A pinned published version stays readable (an assignment may hold it).
    expect((await call("GET", `/api/cards/${card.id}/versions/1`, { cookie: student })).status).toBe(200);
    const edit = await call("PUT", `/api/cards/${card.id}/draft`, { cookie: instructor, json: { content: content() } });
    expect(edit.status).toBe(409);
    const restored = await call("POST", `/api/cards/${card.id}/archive`, { cookie: instructor, json: { archived: false } });
    expect(restored.status).toBe(200);
  });

  it("prints a version as a PDF with its notices, blanks, limits and references, in a font that has every character", async () => {
    const card = await createCard(
      content({
        tools: ["Torque wrench 30–150 ft-lb", "Dial indicator ±0.001 in", "Crowfoot ½ in"],
        consumables: ["Safety wire Ø 0.032 in", "Anti-seize, 60 °F minimum"],
        protectiveEquipment: ["Safety glasses", "Nitrile gloves"],
        steps: [
          step({
            text: "Torque the **mount bolts** ≤ 45 ft-lb in sequence.",
            notices: [
              { kind: "note", text: "Clean dry threads." },
              { kind: "caution", text: "Do not exceed the torque." },
              { kind: "warning", text: "Support the engine." },
            ],
            references: [{ revisionId, page: 2, quote: "" }],
            measurement: { label: "Mount bolt torque", unit: "ft-lb", min: 40, max: 45 },
            inspectionPoint: true,
            timerMinutes: 10,
          }),
        ],
      }),
    );
    await call("POST", `/api/cards/${card.id}/publish`, { cookie: instructor });
    const response = await call("GET", `/api/cards/${card.id}/versions/1/pdf`, { cookie: student });
    expect(response.status).toBe(200);
    expect(response.headers.get("content-type")).toBe("application/pdf");
    const bytes = Buffer.from(await response.arrayBuffer());
    expect(bytes.subarray(0, 5).toString()).toBe("%PDF-");
    const dir = await mkdtemp(path.join(tmpdir(), "hl-card-"));
    try {
      const file = path.join(dir, "card.pdf");
      await writeFile(file, bytes);
      const { stdout } = await run("pdftotext", ["-layout", file, "-"]);
      const text = stdout.replace(/\s+/g, " ");
      // No character is swapped for "?", and each tool, consumable and item of equipment is its own line.
      expect(text).not.toContain("?");
      const lines = stdout.split("\n").map((l) => l.trim());
      for (const item of [
        "Torque wrench 30–150 ft-lb",
        "Dial indicator ±0.001 in",
        "Crowfoot ½ in",
        "Safety wire Ø 0.032 in",
        "Anti-seize, 60 °F minimum",
        "Nitrile gloves",
      ])
        expect(lines).toContain(item);
      expect(text).toContain(card.draft!.title);
      expect(text).toMatch(/Training use/);
      // Shown in the trade's order, before the step text.
      expect(text.indexOf("WARNING")).toBeLessThan(text.indexOf("CAUTION"));
      expect(text.indexOf("CAUTION")).toBeLessThan(text.indexOf("NOTE Clean dry threads"));
      expect(text.indexOf("NOTE Clean dry threads")).toBeLessThan(text.indexOf("Torque the mount bolts ≤ 45"));
      expect(text).toMatch(/Mount bolt torque: measured _+ ft-lb limits 40 to 45 ft-lb/);
      expect(text).toMatch(/Instructor buy-off/);
      expect(text).toMatch(/Timer 10 min/);
      expect(text).toMatch(/Ref: Cards test manual \w+, Rev 1, page 2/);
      expect(text).toMatch(/Sign-off/);
    } finally {
      await rm(dir, { recursive: true, force: true });
    }
    expect((await call("GET", `/api/cards/${card.id}/versions/7/pdf`, { cookie: student })).status).toBe(404);
    expect((await call("GET", `/api/cards/${card.id}/versions/abc/pdf`, { cookie: student })).status).toBe(404);
  });

  it("keeps one list of subjects: admin adds, a name is taken once", async () => {
    const name = uniqueTitle("Subject");
    expect((await call("POST", "/api/subjects", { cookie: admin, json: { name } })).status).toBe(201);
    expect((await call("POST", "/api/subjects", { cookie: admin, json: { name } })).status).toBe(409);
    expect((await call("POST", "/api/subjects", { cookie: instructor, json: { name: "x" } })).status).toBe(403);
    const rows = await getDb().select().from(curriculumSubjects).where(eq(curriculumSubjects.name, name));
    expect(rows).toHaveLength(1);
  });
});

function stripRefs(s: CardVersionDto["steps"][number]) {
  return { ...s, references: s.references.map((r) => ({ revisionId: r.revisionId, page: r.page, quote: r.quote })) };
}
