import { eq } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { getDb } from "@/db";
import { pages, revisions } from "@/db/schema";
import { call, demo, signIn } from "../support/http";
import { encrypt, makePdf, uniqueTitle, upload, waitForRevision } from "../support/library";

let librarian: string;
let student: string;
let pdf: Uint8Array;
const fields = (title = uniqueTitle("Test manual")) => ({
  title,
  documentType: "maintenance_manual",
  applicability: "HT-20",
  ataChapters: "32",
  revisionLabel: "Rev 1",
  revisionDate: "2026-10-01",
});

beforeAll(async () => {
  librarian = await signIn(demo.librarian);
  student = await signIn(demo.student);
  pdf = await makePdf(["32-10-00 MAIN GEAR\nfirst page", "second page", "third page"]);
});

async function errorOf(response: Response) {
  return ((await response.json()) as { error: { code: string; message: string; fields?: Record<string, string> } }).error;
}

describe("uploading a manual", () => {
  it("takes a PDF: 202, then the revision becomes ready and current", async () => {
    const response = await upload("/api/manuals", librarian, fields(), { bytes: pdf });
    expect(response.status).toBe(202);
    const { manualId, revisionId } = (await response.json()) as { manualId: string; revisionId: string };
    const done = await waitForRevision(librarian, revisionId);
    expect(done).toMatchObject({ status: "ready", pageCount: 3, pagesDone: 3, current: true, manualId });
    const manual = (await (await call("GET", `/api/manuals/${manualId}`, { cookie: student })).json()) as {
      currentRevisionId: string;
      applicability: string[];
    };
    expect(manual.currentRevisionId).toBe(revisionId);
    expect(manual.applicability).toEqual(["HT-20"]);
  });

  it("refuses a student with 403 and stores nothing", async () => {
    const title = uniqueTitle("Student attempt");
    const response = await upload("/api/manuals", student, fields(title), { bytes: pdf });
    expect(response.status).toBe(403);
    const list = (await (await call("GET", "/api/manuals", { cookie: librarian })).json()) as { manuals: { title: string }[] };
    expect(list.manuals.some((m) => m.title === title)).toBe(false);
  });

  it("sniffs the content: a text file named .pdf is 415", async () => {
    const response = await upload("/api/manuals", librarian, fields(), {
      bytes: new TextEncoder().encode("just words, no PDF here\n".repeat(100)),
      name: "looks.pdf",
    });
    expect(response.status).toBe(415);
    expect((await errorOf(response)).fields).toHaveProperty("file");
  });

  it("accepts a PDF sent with the wrong type and name, going by its bytes", async () => {
    const response = await upload("/api/manuals", librarian, fields(), { bytes: pdf, name: "scan.bin", type: "application/octet-stream" });
    expect(response.status).toBe(202);
  });

  it("refuses a truncated PDF, an empty file and a missing file with 422 naming the file", async () => {
    for (const file of [{ bytes: pdf.slice(0, Math.floor(pdf.length / 2)) }, { bytes: new Uint8Array() }, undefined]) {
      const response = await upload("/api/manuals", librarian, fields(), file);
      expect(response.status).toBe(422);
      expect((await errorOf(response)).fields).toHaveProperty("file");
    }
  });

  it("names missing and invalid fields with 422", async () => {
    const response = await upload(
      "/api/manuals",
      librarian,
      { documentType: "novel", revisionDate: "2026-02-31", ataChapters: "3A" },
      { bytes: pdf },
    );
    expect(response.status).toBe(422);
    const error = await errorOf(response);
    expect(Object.keys(error.fields ?? {}).sort()).toEqual(["ataChapters", "documentType", "revisionDate", "revisionLabel", "title"]);
  });

  it("refuses a file over the limit with 413", async () => {
    const limit = Number(process.env.HL_UPLOAD_LIMIT_BYTES ?? 8 * 1024 * 1024);
    const big = new Uint8Array(limit + 1024);
    big.set(pdf.subarray(0, 1024));
    const response = await upload("/api/manuals", librarian, fields(), { bytes: big });
    expect(response.status).toBe(413);
  });

  it("refuses a body that is not multipart with 415", async () => {
    const response = await call("POST", "/api/manuals", { cookie: librarian, json: fields() });
    expect(response.status).toBe(415);
  });

  it("refuses a second manual of the same title and a second revision of the same label with 409", async () => {
    const title = uniqueTitle("Twice");
    const first = await upload("/api/manuals", librarian, fields(title), { bytes: pdf });
    expect(first.status).toBe(202);
    const { manualId } = (await first.json()) as { manualId: string };
    expect((await upload("/api/manuals", librarian, fields(title), { bytes: pdf })).status).toBe(409);
    const again = await upload(
      `/api/manuals/${manualId}/revisions`,
      librarian,
      { revisionLabel: "Rev 1", revisionDate: "2026-11-01" },
      { bytes: pdf },
    );
    expect(again.status).toBe(409);
    expect((await errorOf(again)).fields).toHaveProperty("revisionLabel");
    const missing = await upload(
      "/api/manuals/00000000-0000-4000-8000-000000000001/revisions",
      librarian,
      { revisionLabel: "X", revisionDate: "2026-11-01" },
      { bytes: pdf },
    );
    expect(missing.status).toBe(404);
  });
});

describe("ingest failures and atomicity", () => {
  it("fails a password-protected PDF with a clear reason; the manual keeps its current revision", async () => {
    const first = await upload("/api/manuals", librarian, fields(), { bytes: pdf });
    const { manualId, revisionId: goodId } = (await first.json()) as { manualId: string; revisionId: string };
    await waitForRevision(librarian, goodId);

    const second = await upload(
      `/api/manuals/${manualId}/revisions`,
      librarian,
      { revisionLabel: "Rev 2", revisionDate: "2026-12-01" },
      { bytes: encrypt(pdf) },
    );
    expect(second.status).toBe(202);
    const { revisionId: lockedId } = (await second.json()) as { revisionId: string };
    const failed = await waitForRevision(librarian, lockedId);
    expect(failed.status).toBe("failed");
    expect(failed.error).toMatch(/password/i);

    const manual = (await (await call("GET", `/api/manuals/${manualId}`, { cookie: student })).json()) as {
      currentRevisionId: string;
      revisions: { id: string }[];
    };
    expect(manual.currentRevisionId).toBe(goodId);
    expect(manual.revisions.map((r) => r.id)).toEqual([goodId]); // the failed one is the librarian's business
    expect((await call("GET", `/api/revisions/${lockedId}/pages/1`, { cookie: librarian })).status).toBe(404);
    expect((await call("GET", `/api/revisions/${lockedId}/file`, { cookie: student })).status).toBe(404);
    expect(await getDb().select().from(pages).where(eq(pages.revisionId, lockedId))).toEqual([]);

    // A failed revision can be tried again; it fails the same way, and nothing else changes.
    const retried = await call("POST", `/api/revisions/${lockedId}/retry`, { cookie: librarian });
    expect(retried.status).toBe(202);
    expect((await waitForRevision(librarian, lockedId)).status).toBe("failed");
    expect((await call("POST", `/api/revisions/${goodId}/retry`, { cookie: librarian })).status).toBe(409);
  });

  it("fails a PDF whose body is garbage behind a valid header and end marker", async () => {
    const junk = new TextEncoder().encode(`%PDF-1.7\n${"garbage ".repeat(500)}\n%%EOF\n`);
    const response = await upload("/api/manuals", librarian, fields(), { bytes: junk });
    expect(response.status).toBe(202);
    const { revisionId } = (await response.json()) as { revisionId: string };
    const failed = await waitForRevision(librarian, revisionId);
    expect(failed.status).toBe("failed");
    expect(failed.error).toMatch(/damaged|no pages/i);
  });

  it("reads a newer revision and supersedes the old one, which stays readable", async () => {
    const first = await upload("/api/manuals", librarian, fields(), { bytes: pdf });
    const { manualId, revisionId: oldId } = (await first.json()) as { manualId: string; revisionId: string };
    await waitForRevision(librarian, oldId);
    const next = await upload(
      `/api/manuals/${manualId}/revisions`,
      librarian,
      { revisionLabel: "Rev 2", revisionDate: "2026-12-01" },
      { bytes: await makePdf(["new one", "new two"]) },
    );
    const { revisionId: newId } = (await next.json()) as { revisionId: string };
    expect(await waitForRevision(librarian, newId)).toMatchObject({ status: "ready", current: true, pageCount: 2 });
    const old = (await (await call("GET", `/api/revisions/${oldId}`, { cookie: student })).json()) as {
      current: boolean;
      supersededAt: string | null;
    };
    expect(old.current).toBe(false);
    expect(old.supersededAt).not.toBeNull();
    expect((await call("GET", `/api/revisions/${oldId}/pages/1`, { cookie: student })).status).toBe(200);
    const [row] = await getDb().select({ status: revisions.status }).from(revisions).where(eq(revisions.id, oldId));
    expect(row?.status).toBe("ready");
  });
});
