import { describe, expect, it } from "vitest";
import { highlightWords } from "@/lib/domain/library/highlight";
import abbreviations from "@/search/abbreviations.json";
import {
  ataSectionOf,
  expansionsOf,
  expansionTableOf,
  familiesOf,
  isEmptyQuery,
  markEnd,
  markStart,
  parseQuery,
  snippetToHtml,
} from "@/search/query";
import { searchParamsSchema } from "@/lib/domain/validation/search";

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

describe("concept families", () => {
  it("find the family's methods from its name, its other names and its abbreviations", () => {
    for (const typed of ["nondestructive testing", "NDT", "ndi", "non-destructive inspection"]) {
      const [word, ...rest] = parseQuery(typed).words;
      expect(rest).toEqual([]);
      expect(word?.text).toBe(typed.toLowerCase());
      expect(word?.expansions).toEqual(
        expect.arrayContaining(["penetrant", "magnetic particle", "eddy current", "ultrasonic", "radiographic"]),
      );
    }
    // The spellings of the flat list are kept beside the family's.
    expect(expansionsOf("ndt")).toContain("nondestructive inspection");
  });

  it("do not widen a member to the other members", () => {
    expect(expansionsOf("penetrant")).toEqual([]);
    expect(parseQuery("dye penetrant").words.map((w) => [w.text, w.expansions])).toEqual([["dye penetrant", ["liquid penetrant"]]]);
    expect(parseQuery("mag particle").words[0]?.expansions).toEqual(["magnetic particle"]);
    // "mag" alone is still the magneto.
    expect(parseQuery("mag drop").words.map((w) => w.text)).toEqual(["mag", "drop"]);
  });

  it("keep words typed together as one term, and not as a prefix", () => {
    const q = parseQuery("check nondestructive testing");
    expect(q.words.map((w) => [w.text, w.prefix])).toEqual([
      ["check", false],
      ["nondestructive testing", false],
    ]);
  });

  it("are read from the data file's _families, every one with names and members", () => {
    const families = familiesOf(abbreviations as Record<string, unknown>);
    expect(families.map((f) => f.name)).toContain("nondestructive testing");
    for (const family of families) {
      expect(family.names.length + family.members.length).toBeGreaterThan(0);
      for (const entry of [family.name, ...family.names, ...family.members]) expect(entry).toBe(entry.toLowerCase().trim());
    }
    // Every flat entry is a list of lower-case spellings, as the format has always been.
    for (const [key, value] of Object.entries(abbreviations)) {
      if (key.startsWith("_")) continue;
      expect(key).toBe(key.toLowerCase());
      expect(Array.isArray(value) && value.every((v) => typeof v === "string" && v === v.toLowerCase())).toBe(true);
    }
  });

  it("are data: a new family works without code", () => {
    const table = expansionTableOf({
      _about: "test",
      gear: ["landing gear"],
      _families: { _about: "x", "flight controls": { names: ["primary controls"], members: ["aileron", "rudder", "elevator"] } },
    });
    expect(table.get("gear")).toEqual(["landing gear"]);
    expect(table.get("primary controls")).toEqual(["flight controls", "aileron", "rudder", "elevator"]);
    expect(table.get("flight controls")).toEqual(["primary controls", "aileron", "rudder", "elevator"]);
    expect(table.has("aileron")).toBe(false);
    expect(table.has("_about")).toBe(false);
  });
});

describe("ATA codes", () => {
  it("are recognised as sections, with a two-digit chapter", () => {
    expect(ataSectionOf("32-10-00")).toEqual({ code: "32-10-00", chapter: "32" });
    expect(ataSectionOf("32-10")).toEqual({ code: "32-10", chapter: "32" });
    expect(ataSectionOf("5-10")).toEqual({ code: "05-10", chapter: "05" });
    for (const other of ["32", "0.032", "an4-5", "32-1", "321-10", "32-10-00-1", "a-10"]) expect(ataSectionOf(other)).toBeNull();
  });

  it("give the query its section, and a one-digit chapter also as written in manuals", () => {
    expect(parseQuery("32-10-00").section).toEqual({ code: "32-10-00", chapter: "32" });
    expect(parseQuery("axle 32-40").section).toEqual({ code: "32-40", chapter: "32" });
    expect(parseQuery("axle nut").section).toBeNull();
    const q = parseQuery("5-10 ");
    expect(q.section?.code).toBe("05-10");
    expect(q.words[0]?.expansions).toEqual(["05-10"]);
    expect(parseQuery("05-10 ").words[0]?.expansions).toEqual([]);
  });

  it("as a filter: one digit is the chapter with a leading zero", () => {
    expect(searchParamsSchema.parse({ q: "x", ata: "5" }).ata).toBe("05");
    expect(searchParamsSchema.parse({ q: "x", ata: "32" }).ata).toBe("32");
    expect(searchParamsSchema.safeParse({ q: "x", ata: "123" }).success).toBe(false);
    expect(searchParamsSchema.safeParse({ q: "x", ata: "ab" }).success).toBe(false);
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
