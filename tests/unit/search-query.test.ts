import { describe, expect, it } from "vitest";
import { highlightWords } from "@/lib/domain/library/highlight";
import { expansionsOf, isEmptyQuery, markEnd, markStart, parseQuery, snippetToHtml } from "@/search/query";

describe("parseQuery", () => {
  it("takes words, the last one as a prefix while typing", () => {
    const q = parseQuery("Magneto tim");
    expect(q.words.map((w) => [w.text, w.prefix])).toEqual([
      ["magneto", false],
      ["tim", true],
    ]);
    expect(parseQuery("magneto tim ").words.every((w) => !w.prefix)).toBe(true);
  });

  it("takes quoted phrases and excluded words and phrases", () => {
    const q = parseQuery('"cable tension" rigging -rudder -"nose gear"');
    expect(q.phrases).toEqual(["cable tension"]);
    expect(q.words.map((w) => w.text)).toEqual(["rigging"]);
    expect(q.excluded).toEqual(["rudder", "nose gear"]);
  });

  it("keeps section codes and sizes whole", () => {
    expect(parseQuery("32-10-00 0.032 AN4-5").words.map((w) => w.text)).toEqual(["32-10-00", "0.032", "an4-5"]);
  });

  it("expands trade abbreviations from the data file", () => {
    expect(parseQuery("mag drop").words[0]?.expansions).toEqual(["magneto"]);
    expect(expansionsOf("NDT")).toContain("nondestructive testing");
    expect(expansionsOf("MLG")).toEqual(["main landing gear"]);
    expect(expansionsOf("prop")).toEqual(["propeller"]);
    expect(expansionsOf("carb")).toContain("carburetor");
  });

  it("never fails on odd input; what is left is searched as words", () => {
    for (const odd of ['"unclosed phrase', "a && b || !c", "((x))", "-", '""', "*:'", "\u0000\u0002", "x".repeat(2000), "тормоз"]) {
      expect(() => parseQuery(odd)).not.toThrow();
    }
    expect(parseQuery('"unclosed phrase').phrases).toEqual(["unclosed phrase"]);
    expect(parseQuery("a && b || !c").words.map((w) => w.text)).toEqual(["a", "b", "c"]);
    expect(isEmptyQuery(parseQuery("-only -excluded"))).toBe(true);
    expect(isEmptyQuery(parseQuery("!!! ???"))).toBe(true);
  });
});

describe("snippets", () => {
  it("escape the page text and keep only the marks as markup", () => {
    expect(snippetToHtml(`<script>x</script> ${markStart}torque${markEnd} & more`)).toBe(
      "&lt;script&gt;x&lt;/script&gt; <mark>torque</mark> &amp; more",
    );
  });

  it("mark the spellings a typo was corrected to", () => {
    expect(highlightWords("Magneto timing", "magento", ["magneto"])).toBe("<mark>Magneto</mark> timing");
  });

  it("mark the searched words on a page, endings included", () => {
    expect(highlightWords("Inspect the magneto. Inspection record.", "inspect mag")).toBe(
      "<mark>Inspect</mark> the <mark>magneto</mark>. <mark>Inspection</mark> record.",
    );
  });
});
