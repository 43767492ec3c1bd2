// The invented demo cards read against the invented manual pages they cite, the calculators they
// carry and the trade's common practice (issue 14). The integration seed test checks the same cards
// once they are in the database; this one needs none.
import { randomUUID } from "node:crypto";
import { describe, expect, it } from "vitest";
import { demoManuals, secondRevisionOfTrainer } from "@/db/demo/manual-content";
import { sectionPage } from "@/db/demo/manual-pdf";
import { demoCards } from "@/db/demo/seed-cards";
import { penetrantDwell, penetrantWindowF } from "@/lib/domain/calc/ndt";
import { chooseRivetDiameter, rivetLayout } from "@/lib/domain/calc/rivets";
import { publishableCardSchema } from "@/lib/domain/validation/cards";

const card = (title: string) => {
  const found = demoCards.find((c) => c.title === title);
  if (!found) throw new Error(`no demo card ${title}`);
  return found;
};
const section = (manualPrefix: string, code: string) => {
  const manual = demoManuals.find((m) => m.title.startsWith(manualPrefix))!;
  return manual.chapters.flatMap((c) => c.sections).find((s) => s.code === code)!;
};
const limit = (manualPrefix: string, code: string, item: string) => section(manualPrefix, code).limits!.find(([k]) => k === item)![1];
const allText = (c: (typeof demoCards)[number]) =>
  c.steps.map((s) => [s.text, ...(s.notices ?? []).map((n) => n.text)].join(" ")).join(" ");

describe("demo cards", () => {
  it("are complete enough to publish, as the seed publishes them", () => {
    for (const c of demoCards) {
      const parsed = publishableCardSchema.safeParse({
        ...c,
        subjectId: randomUUID(),
        steps: c.steps.map((s) => ({
          id: randomUUID(),
          text: s.text,
          notices: s.notices ?? [],
          references: (s.refs ?? []).map((r) => ({
            revisionId: randomUUID(),
            page: sectionPage(
              demoManuals.find((m) => m.title.startsWith(r.manual))!,
              r.code,
              r.part,
            ),
            quote: r.quote ?? "",
          })),
          measurement: s.measurement ?? null,
          calculator: s.calculator ?? null,
          inspectionPoint: s.inspectionPoint ?? false,
          timerMinutes: s.timerMinutes ?? null,
        })),
      });
      expect(parsed.success, c.title).toBe(true);
    }
  });

  it("say on their first step that their values are invented", () => {
    for (const c of demoCards)
      expect(
        c.steps[0]!.notices?.some((n) => n.kind === "note" && /invented/.test(n.text)),
        c.title,
      ).toBe(true);
  });

  it("keep the citations the revision-impact test expects (HT-20 cards: steps and pages)", () => {
    const parts = (title: string) =>
      card(title).steps.map((s) => (s.refs ?? []).map((r) => `${r.code} ${r.part ?? "procedure"}`).join(", "));
    expect(parts("Aileron control cable tension check")).toEqual(["27-10-00 procedure", "27-10-00 limits", "27-10-00 procedure"]);
    expect(parts("Main landing gear inspection on jacks")).toEqual(["32-10-00 procedure", "32-10-00 procedure", "32-10-00 limits"]);
    expect(parts("Propeller track check")).toEqual(["61-20-00 procedure", "61-20-00 limits"]);
    expect(
      card("Magneto-to-engine timing check")
        .steps.flatMap((s) => s.refs ?? [])
        .every((r) => r.code === "74-10-00"),
    ).toBe(true);
  });

  it("penetrant: one temperature window in the calculator, the procedure and the card; timers as the calculator says", () => {
    const c = card("Fluorescent penetrant inspection of a landing gear fitting");
    expect(c.steps[0]!.measurement).toMatchObject({ min: penetrantWindowF.min, max: penetrantWindowF.max });
    expect(limit("Penetrant Inspection", "51-61-01", "Part temperature")).toBe(`${penetrantWindowF.min} to ${penetrantWindowF.max} F`);
    // The procedure's 10 min dwell at room temperature: 10 min (T.O. 33B-1-1); development half of
    // it, 5, held at the 10 min floor (ASTM E1417, from memory).
    const times = penetrantDwell({ specifiedMinutes: 10, temperature: 70 });
    expect([c.steps[1]!.timerMinutes, c.steps[2]!.timerMinutes]).toEqual([times.dwellMinutes, times.developmentMinutes]);
    expect([c.steps[1]!.timerMinutes, c.steps[2]!.timerMinutes]).toEqual([10, 10]);
    expect(allText(c)).toMatch(/Never sand, blast or scrape/);
  });

  it("riveted splice: thickest sheet is the doubler, rivet and edge distance from the calculator, head diameter and height measured", () => {
    const c = card("Riveted splice patch on a practice skin panel");
    expect(section("Fernhollow", "51-50-00").steps.join(" ")).toMatch(/one gauge thicker/);
    expect(c.steps[0]!.measurement).toMatchObject({ nominal: 0.04 }); // 0.032 skin, doubler one gauge up
    // AC 43.13-1B 4-58g: 3 × 0.040 = 0.120 → 1/8 in, dash 4 in 32nds.
    expect(chooseRivetDiameter(0.04).suggested).toBe(1 / 8);
    expect(c.consumables.join(" ")).toMatch(/MS20470AD4/);
    // TM 10-5410-229-13&P 2 D and 4 D (from memory) for 1/8 in: 0.25 to 0.5 in.
    const edge = c.steps.find((s) => s.measurement?.label.startsWith("Edge distance"))!.measurement!;
    expect([edge.min, edge.max]).toEqual([0.25, 0.5]);
    expect([edge.min, edge.max]).toEqual(rivetLayout({ diameter: 1 / 8 }).edgeDistance);
    const labels = c.steps.map((s) => s.measurement?.label);
    expect(labels).toContain("Shop head diameter");
    expect(labels).toContain("Shop head height");
    expect(limit("Fernhollow", "51-30-00", "Shop head height")).toMatch(/0\.055 to 0\.070 in/);
  });

  it("magneto timing is approached in the direction of rotation only, on the card and the manual page", () => {
    const c = card("Magneto-to-engine timing check");
    expect(allText(c)).not.toMatch(/back and forward/);
    expect(allText(c)).toMatch(/direction of rotation only/);
    const trainer = demoManuals.find((m) => m.title.startsWith("HT-20"))!;
    for (const manual of [trainer, secondRevisionOfTrainer(trainer)]) {
      const timing = manual.chapters.flatMap((ch) => ch.sections).find((s) => s.code === "74-10-00")!;
      expect(timing.steps.join(" ")).not.toMatch(/back and forward/);
      expect(timing.steps.join(" ")).toMatch(/direction of rotation only/);
    }
    expect(c.steps.filter((s) => s.measurement?.label.startsWith("Ignition timing"))).toHaveLength(2); // left and right
  });

  it("no card or manual page backs a torqued nut off to line up a hole (AC 43.13-1B par. 7-37 ff.)", () => {
    // Every sentence that speaks of backing a nut off, or of the nearest slot, forbids it.
    const backsOff = (text: string) =>
      text.split(/[.;:]/).filter((sentence) => /\bback\b.*\boff\b|nearest slot/i.test(sentence) && !/never/i.test(sentence));
    for (const c of demoCards) expect(backsOff(allText(c)), c.title).toEqual([]);
    const trainer = demoManuals.find((m) => m.title.startsWith("HT-20"))!;
    for (const manual of [...demoManuals, secondRevisionOfTrainer(trainer)]) {
      for (const s of manual.chapters.flatMap((ch) => ch.sections)) {
        expect(backsOff([...s.steps, ...(s.limits ?? []).map(([, v]) => v)].join(". ")), `${manual.title} ${s.code}`).toEqual([]);
      }
    }
    expect(backsOff("Check the axle nut torque, then back the nut off to the nearest slot")).toHaveLength(1); // the old card's words
    expect(allText(card("Main landing gear inspection on jacks"))).toMatch(/Never back a torqued nut off/);
  });

  it("engine removal: weight taken up before the first bolt; breakers, connectors, tail stand and ignition cautions", () => {
    const text = allText(card("Turbine engine removal and installation on the stand"));
    expect(text).toMatch(/before the first mount bolt/);
    expect(text).not.toMatch(/before the last bolt/);
    expect(text).toMatch(/circuit breakers/);
    expect(text).toMatch(/connector/);
    expect(text).toMatch(/tail stand/);
    expect(text).toMatch(/centre of gravity/);
    expect(text).toMatch(/ignition exciter/);
    expect(section("TF-400", "71-00-20").caution).toMatch(/before the first mount bolt/);
  });
});
