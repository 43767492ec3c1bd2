// What a draft still needs before students may run it: a list, never a refusal to save.
import { randomUUID } from "node:crypto";
import { describe, expect, it } from "vitest";
import { ataChapterOf, cardContentSchema, cardProblems } from "@/lib/domain/validation/cards";

const card = (over: Record<string, unknown> = {}) =>
  cardContentSchema.parse({
    title: "Wheel bearing inspection",
    ataChapter: "32",
    subjectId: randomUUID(),
    steps: [{ id: randomUUID(), text: "Remove the hub cap." }],
    ...over,
  });

describe("card problems", () => {
  it("has none for a complete card", () => {
    expect(cardProblems(card())).toEqual([]);
  });

  it("lists every missing part, the step named as people count", () => {
    const problems = cardProblems(
      card({
        title: "",
        subjectId: null,
        ataChapter: "",
        steps: [
          { id: randomUUID(), text: "Fine." },
          { id: randomUUID(), text: " ", measurement: { label: "Play", unit: "in", nominal: 0.01 } },
        ],
      }),
    );
    expect(problems).toEqual([
      { field: "title", message: "Give the card a title." },
      { field: "subjectId", message: "Choose a curriculum subject." },
      { field: "ataChapter", message: "Give the ATA chapter." },
      { field: "steps.2.text", message: "Step 2: write the instruction." },
      { field: "steps.2.measurement", message: "Step 2: Give a minimum, a maximum, or a nominal value with its tolerance." },
    ]);
  });

  it("keeps a unit it does not know as typed, and flags it", () => {
    const drafted = card({ steps: [{ id: randomUUID(), text: "Measure.", measurement: { label: "Gap", unit: "cubits", max: 2 } }] });
    expect(drafted.steps[0]!.measurement!.unit).toBe("cubits");
    expect(cardProblems(drafted)[0]!.message).toMatch(/unit "cubits" is not known/);
  });

  it("reads a known unit's spelling as its code", () => {
    const drafted = card({ steps: [{ id: randomUUID(), text: "Torque.", measurement: { label: "Torque", unit: "inch-pounds", min: 1 } }] });
    expect(cardProblems(drafted)).toEqual([]);
  });

  it("needs no card without steps, and no empty card", () => {
    expect(cardProblems(card({ steps: [] })).map((p) => p.field)).toEqual(["steps"]);
  });

  it("reads one ATA digit as the two-digit chapter", () => {
    expect(ataChapterOf("5")).toBe("05");
    expect(ataChapterOf(" 27 ")).toBe("27");
    expect(ataChapterOf("")).toBe("");
    expect(card({ ataChapter: "5" }).ataChapter).toBe("05");
  });
});
