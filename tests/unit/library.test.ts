import { describe, expect, it } from "vitest";
import { parseRange } from "@/lib/domain/library/range";
import { headingOf, needsOcr, normalisePageText, wordOverlap, wordsOf } from "@/lib/domain/library/page-text";
import { assertKey, storageKeys } from "@/lib/server/storage/types";
import { manualUploadSchema, revisionFieldsSchema } from "@/lib/domain/validation/library";

describe("page text", () => {
  it("trims trailing blanks and folds runs of empty lines", () => {
    expect(normalisePageText("A line   \r\n\n\n\nB\t \n")).toBe("A line\n\nB");
  });

  it("sends a page with almost no text to OCR", () => {
    expect(needsOcr("")).toBe(true);
    expect(needsOcr("  12  \n")).toBe(true);
    expect(needsOcr("32-10-00 MAIN LANDING GEAR - INSPECTION")).toBe(false);
  });

  it("takes the first line with words as the heading", () => {
    expect(headingOf("12\n\n32-10-00 MAIN LANDING GEAR\nbody")).toBe("32-10-00 MAIN LANDING GEAR");
  });

  it("compares the words of two extractions, order aside", () => {
    const a = wordsOf("Torque the AN4 bolt to 50 in-lb. Safety-wire it.");
    expect(a).toEqual(["torque", "the", "an4", "bolt", "to", "50", "in-lb", "safety-wire", "it"]);
    expect(wordOverlap(a, wordsOf("it safety-wire. bolt AN4 the torque to 50 in-lb"))).toBe(1);
    expect(wordOverlap(["the"], ["the", "the"])).toBe(0.5);
    expect(wordOverlap([], [])).toBe(1);
  });
});

describe("Range header (RFC 9110, 14.1.2)", () => {
  it.each([
    ["bytes=0-99", 1000, { start: 0, end: 99 }],
    ["bytes=900-", 1000, { start: 900, end: 999 }],
    ["bytes=-100", 1000, { start: 900, end: 999 }],
    ["bytes=500-5000", 1000, { start: 500, end: 999 }],
  ] as const)("%s of %i bytes", (header, size, expected) => {
    expect(parseRange(header, size)).toEqual(expected);
  });

  it("answers the whole file for no range or a form it does not serve", () => {
    expect(parseRange(null, 10)).toBeNull();
    expect(parseRange("bytes=0-1,5-6", 10)).toBeNull();
    expect(parseRange("items=0-1", 10)).toBeNull();
  });

  it("refuses a range past the end", () => {
    expect(parseRange("bytes=1000-", 1000)).toBe("unsatisfiable");
    expect(parseRange("bytes=-0", 1000)).toBe("unsatisfiable");
  });
});

describe("storage keys", () => {
  it("are made from ids only", () => {
    expect(storageKeys.revisionFile("0aa5cf27-6c0b-424e-b431-d3f47cae8afe")).toBe(
      "revisions/0aa5cf27-6c0b-424e-b431-d3f47cae8afe/document.pdf",
    );
  });

  it.each(["../etc/passwd", "/abs", "revisions/../../x", "Revisions/A", "a//b", ""])("refuse %j", (key) => {
    expect(() => assertKey(key)).toThrow();
  });
});

describe("upload fields", () => {
  const good = { title: "T", documentType: "handbook", revisionLabel: "Rev 1", revisionDate: "2026-01-31" };

  it("splits, trims and de-duplicates the lists", () => {
    const parsed = manualUploadSchema.parse({ ...good, applicability: " HT-20, C-9 ,HT-20,", ataChapters: "32, 61" });
    expect(parsed.applicability).toEqual(["HT-20", "C-9"]);
    expect(parsed.ataChapters).toEqual(["32", "61"]);
  });

  it("names each bad field", () => {
    const result = manualUploadSchema.safeParse({
      title: "",
      documentType: "novel",
      ataChapters: "3A",
      revisionLabel: "",
      revisionDate: "31/01/2026",
    });
    expect(result.success).toBe(false);
    const fields = new Set(result.error!.issues.map((i) => String(i.path[0])));
    expect(fields).toEqual(new Set(["title", "documentType", "ataChapters", "revisionLabel", "revisionDate"]));
  });

  it("refuses a date that does not exist", () => {
    expect(revisionFieldsSchema.safeParse({ revisionLabel: "A", revisionDate: "2026-02-31" }).success).toBe(false);
    expect(revisionFieldsSchema.safeParse({ revisionLabel: "A", revisionDate: "2026-13-01" }).success).toBe(false);
  });
});
