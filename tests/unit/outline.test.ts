import { describe, expect, it } from "vitest";
import { outlineFromHeadings, subjectAt } from "@/lib/domain/library/outline";

describe("a manual's contents from its page headings", () => {
  it("groups ATA-numbered pages into chapters and subjects, continuation pages included", () => {
    const outline = outlineFromHeadings([
      { page: 1, heading: "HT-20 TRAINER MAINTENANCE MANUAL" },
      { page: 2, heading: "05-10-00 TIME LIMITS - PROCEDURE" },
      { page: 3, heading: "05-10-00 TIME LIMITS - LIMITS" },
      { page: 4, heading: "Figure 05-10-1" },
      { page: 5, heading: "32-10-00 MAIN GEAR - PROCEDURE" },
      { page: 6, heading: "32-40-00 WHEELS AND BRAKES (continued)" },
    ]);
    expect(outline.map((c) => [c.code, c.title, c.firstPage])).toEqual([
      ["05", "Time limits and maintenance checks", 2],
      ["32", "Landing gear", 5],
    ]);
    expect(outline[0]!.subjects).toEqual([{ code: "05-10-00", title: "Time Limits", firstPage: 2, lastPage: 4 }]);
    expect(outline[1]!.subjects.map((s) => [s.code, s.title, s.firstPage, s.lastPage])).toEqual([
      ["32-10-00", "Main Gear", 5, 5],
      ["32-40-00", "Wheels and Brakes", 6, 6],
    ]);
    expect(subjectAt(outline, 4)?.code).toBe("05-10-00");
    expect(subjectAt(outline, 1)).toBeNull();
  });

  it("falls back to the headings as they change, and to nothing for a document without headings", () => {
    const outline = outlineFromHeadings([
      { page: 1, heading: "Safety in the shop" },
      { page: 2, heading: "Safety in the shop" },
      { page: 3, heading: "Fire extinguishers - types" },
      { page: 4, heading: "" },
    ]);
    expect(outline[0]!.subjects).toEqual([
      { code: "", title: "Safety in the shop", firstPage: 1, lastPage: 2 },
      { code: "", title: "Fire extinguishers", firstPage: 3, lastPage: 4 },
    ]);
    expect(outlineFromHeadings([{ page: 1, heading: "" }])).toEqual([]);
  });
});
