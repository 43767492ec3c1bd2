import { execFileSync } from "node:child_process";
import { and, asc, eq, isNotNull, sql } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { getDb } from "@/db";
import { manuals, pages, revisions } from "@/db/schema";
import { ingestRevision } from "@/lib/server/ingest/ingest-revision";
import { wordOverlap, wordsOf } from "@/lib/domain/library/page-text";
import { getStore } from "@/lib/server/storage";
import { demoManuals } from "@/db/demo/manual-content";
import { expectedPageCount } from "@/db/demo/manual-pdf";
import { call, demo, signIn } from "../support/http";
import { makePdf, uniqueTitle, upload, waitForRevision } from "../support/library";

let librarian: string;
beforeAll(async () => {
  librarian = await signIn(demo.librarian);
});

/** The demo manuals are queued by the seed; the worker reads them while the other tests run. */
async function demoRevisionsReady(seconds = 120) {
  const deadline = Date.now() + seconds * 1000;
  for (;;) {
    const rows = await getDb()
      .select({
        id: revisions.id,
        status: revisions.status,
        fileKey: revisions.fileKey,
        title: manuals.title,
        label: revisions.label,
        pageCount: revisions.pageCount,
      })
      .from(revisions)
      .innerJoin(manuals, eq(manuals.id, revisions.manualId))
      .where(sql`${manuals.title} in ${demoManuals.map((m) => m.title)}`);
    if (rows.length >= demoManuals.length + 1 && rows.every((r) => r.status === "ready")) return rows;
    if (Date.now() > deadline) throw new Error(`demo revisions not ready: ${rows.map((r) => `${r.title} ${r.status}`).join(", ")}`);
    await new Promise((r) => setTimeout(r, 1000));
  }
}

describe("ingest", () => {
  it("stores each page's own text, in order", async () => {
    const texts = Array.from(
      { length: 12 },
      (_, i) => `Section 32-${10 + i}-00\nInspect item number ${i + 1} with the gauge marked k${i + 1}x`,
    );
    const response = await upload(
      "/api/manuals",
      librarian,
      { title: uniqueTitle("Known pages"), documentType: "handbook", revisionLabel: "Rev 1", revisionDate: "2026-09-09" },
      { bytes: await makePdf(texts) },
    );
    const { revisionId } = (await response.json()) as { revisionId: string };
    expect((await waitForRevision(librarian, revisionId)).status).toBe("ready");
    const rows = await getDb()
      .select({ n: pages.pageNumber, text: pages.text, heading: pages.heading, ocr: pages.ocr })
      .from(pages)
      .where(eq(pages.revisionId, revisionId))
      .orderBy(asc(pages.pageNumber));
    expect(rows.map((r) => r.n)).toEqual(texts.map((_, i) => i + 1));
    rows.forEach((row, i) => {
      expect(row.text).toContain(`item number ${i + 1} `);
      expect(row.text).toContain(`k${i + 1}x`);
      expect(row.heading).toBe(`Section 32-${10 + i}-00`);
      expect(row.ocr).toBe(false);
    });
    const page = (await (await call("GET", `/api/revisions/${revisionId}/pages/7`, { cookie: librarian })).json()) as {
      page: number;
      text: string;
      ocr: boolean;
    };
    expect(page).toMatchObject({ page: 7, ocr: false });
    expect((await call("GET", `/api/revisions/${revisionId}/pages/13`, { cookie: librarian })).status).toBe(404);
    expect((await call("GET", `/api/revisions/${revisionId}/pages/zero`, { cookie: librarian })).status).toBe(422);
  });

  it("reads every demo page as poppler's pdftotext does (same words, order aside, at least 98 %)", async () => {
    const rows = await demoRevisionsReady();
    for (const manual of demoManuals) {
      const revision = rows.find((r) => r.title === manual.title && r.label !== "Rev 4")!;
      expect(revision.pageCount, manual.title).toBe(expectedPageCount(manual));
    }
    let checked = 0;
    for (const revision of rows) {
      const stored = await getDb()
        .select({ n: pages.pageNumber, text: pages.text, ocr: pages.ocr })
        .from(pages)
        .where(eq(pages.revisionId, revision.id))
        .orderBy(asc(pages.pageNumber));
      expect(stored).toHaveLength(revision.pageCount!);
      await getStore().withLocalFile(revision.fileKey, async (file) => {
        for (const page of stored) {
          if (page.ocr) continue; // no text layer to compare with
          const reference = execFileSync("pdftotext", ["-f", String(page.n), "-l", String(page.n), "-enc", "UTF-8", file, "-"]).toString();
          const overlap = wordOverlap(wordsOf(page.text), wordsOf(reference));
          expect(overlap, `${revision.title} ${revision.label} page ${page.n}`).toBeGreaterThanOrEqual(0.98);
          checked++;
        }
      });
    }
    expect(checked).toBeGreaterThan(250);
  });

  it("reads the scanned page of the penetrant procedure by OCR", async () => {
    await demoRevisionsReady();
    const [row] = await getDb()
      .select({ n: pages.pageNumber, text: pages.text })
      .from(pages)
      .innerJoin(revisions, eq(revisions.id, pages.revisionId))
      .innerJoin(manuals, eq(manuals.id, revisions.manualId))
      .where(and(eq(manuals.title, "Penetrant Inspection Procedure FTC-NDT-02"), eq(pages.ocr, true)));
    expect(row).toBeDefined();
    const words = wordsOf(row!.text);
    // The form's printed words, as placed on the image by the seed.
    const expected = wordsOf(
      "APPENDIX A PENETRANT PROCESS RECORD SCANNED FORM Penetrant batch number Dwell time started at Development time started at Indications found and their location Student initials and instructor initials",
    );
    expect(wordOverlap(words, expected)).toBeGreaterThanOrEqual(0.9);
  });

  it("starts over cleanly when the worker died half way", async () => {
    const response = await upload(
      "/api/manuals",
      librarian,
      { title: uniqueTitle("Interrupted"), documentType: "handbook", revisionLabel: "Rev 1", revisionDate: "2026-09-09" },
      { bytes: await makePdf(["one alpha", "two bravo", "three charlie"]) },
    );
    const { revisionId } = (await response.json()) as { revisionId: string };
    await waitForRevision(librarian, revisionId);
    // Make it look as a dead worker leaves it: processing, half its pages, a heartbeat long gone.
    await getDb()
      .delete(pages)
      .where(and(eq(pages.revisionId, revisionId), sql`${pages.pageNumber} > 1`));
    await getDb().update(pages).set({ text: "half written" }).where(eq(pages.revisionId, revisionId));
    await getDb()
      .update(revisions)
      .set({ status: "processing", pagesDone: 1, heartbeatAt: sql`now() - interval '1 hour'` })
      .where(eq(revisions.id, revisionId));
    expect((await call("GET", `/api/revisions/${revisionId}/pages/1`, { cookie: librarian })).status).toBe(404); // not visible meanwhile

    expect(await ingestRevision({ revisionId, log: () => undefined })).toBe("ready");
    const rows = await getDb()
      .select({ text: pages.text })
      .from(pages)
      .where(eq(pages.revisionId, revisionId))
      .orderBy(asc(pages.pageNumber));
    expect(rows.map((r) => r.text)).toEqual(["one alpha", "two bravo", "three charlie"]);
    // A second claim of a ready revision does nothing.
    expect(await ingestRevision({ revisionId, log: () => undefined })).toBe("skipped");
  });

  it("makes thumbnails after the revision is ready", async () => {
    const rows = await demoRevisionsReady();
    const deadline = Date.now() + 60_000;
    let withThumbs = 0;
    while (Date.now() < deadline) {
      [{ n: withThumbs } = { n: 0 }] = await getDb()
        .select({ n: sql<number>`count(*)`.mapWith(Number) })
        .from(pages)
        .where(and(eq(pages.revisionId, rows[0]!.id), isNotNull(pages.thumbnailKey)));
      if (withThumbs === rows[0]!.pageCount) break;
      await new Promise((r) => setTimeout(r, 1000));
    }
    expect(withThumbs).toBe(rows[0]!.pageCount);
    const image = await call("GET", `/api/revisions/${rows[0]!.id}/pages/1/thumbnail`, { cookie: librarian });
    expect(image.status).toBe(200);
    expect(image.headers.get("content-type")).toBe("image/png");
    expect(
      Buffer.from(await image.arrayBuffer())
        .subarray(1, 4)
        .toString(),
    ).toBe("PNG");
  });

  it("serves the file whole and by range", async () => {
    const rows = await demoRevisionsReady();
    const student = await signIn(demo.student);
    const whole = await call("GET", `/api/revisions/${rows[0]!.id}/file`, { cookie: student });
    expect(whole.status).toBe(200);
    const bytes = Buffer.from(await whole.arrayBuffer());
    expect(bytes.subarray(0, 5).toString()).toBe("%PDF-");
    const part = await call("GET", `/api/revisions/${rows[0]!.id}/file`, { cookie: student, headers: { range: "bytes=100-199" } });
    expect(part.status).toBe(206);
    expect(part.headers.get("content-range")).toBe(`bytes 100-199/${bytes.length}`);
    expect(Buffer.from(await part.arrayBuffer())).toEqual(bytes.subarray(100, 200));
    expect(
      (await call("GET", `/api/revisions/${rows[0]!.id}/file`, { cookie: student, headers: { range: `bytes=${bytes.length}-` } })).status,
    ).toBe(416);
    // If-Range: the current tag gets the range, a stale one the whole file.
    const etag = whole.headers.get("etag")!;
    expect(
      (await call("GET", `/api/revisions/${rows[0]!.id}/file`, { cookie: student, headers: { range: "bytes=0-9", "if-range": etag } }))
        .status,
    ).toBe(206);
    const stale = await call("GET", `/api/revisions/${rows[0]!.id}/file`, {
      cookie: student,
      headers: { range: "bytes=0-9", "if-range": '"other"' },
    });
    expect(stale.status).toBe(200);
    expect(Buffer.from(await stale.arrayBuffer()).length).toBe(bytes.length);
  });
});
