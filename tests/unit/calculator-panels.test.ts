// Each calculator as a student first sees it (its default inputs), rendered on the server: the
// notice that the manufacturer's data, the instructor, local rules and licensed sign-off come
// first, the trade's cautions of issue 14, and the default worked example's result.
import { createElement } from "react";
import { renderToString } from "react-dom/server";
import { describe, expect, it } from "vitest";
import { CalculatorPanel } from "@/components/calculators/calculator-panel";
import { calculators, calculatorSlugs, type CalculatorSlug } from "@/lib/domain/calc";

const text = (slug: CalculatorSlug) =>
  renderToString(createElement(CalculatorPanel, { slug }))
    .replace(/<[^>]+>/g, " ")
    .replace(/&#x27;/g, "'")
    .replace(/&amp;/g, "&")
    .replace(/\s+/g, " ");

describe("calculator panels", () => {
  it("every panel puts the manufacturer's data, the instructor, local rules and licensed sign-off first, and shows its notices", () => {
    for (const slug of calculatorSlugs) {
      const shown = text(slug);
      expect(shown, slug).toMatch(
        /manufacturer's current data, your instructor, the school's and local rules, and the sign-off of a licensed technician come first/,
      );
      for (const notice of calculators[slug].notices) expect(shown, slug).toContain(notice.text);
      const kinds = [...shown.matchAll(/\b(WARNING|CAUTION|NOTE)\b(?= [A-Z])/g)].map((m) => m[1]);
      expect(kinds, slug).toHaveLength(calculators[slug].notices.length);
      expect(kinds, `${slug}: warnings, then cautions, then notes`).toEqual(
        [...kinds].sort((a, b) => ["WARNING", "CAUTION", "NOTE"].indexOf(a!) - ["WARNING", "CAUTION", "NOTE"].indexOf(b!)),
      );
    }
  });

  it("carries the cautions the trade gives with each calculator", () => {
    expect(text("rivets")).toMatch(/icebox/);
    expect(text("rivets")).toMatch(/approved repair data comes first/);
    const torque = text("torque");
    expect(torque).toMatch(/dry or lubricated/);
    expect(torque).toMatch(/self-locking nut/);
    expect(torque).toMatch(/calibrated wrench/);
    expect(torque).toMatch(/Never back a torqued nut off, or go past the maximum, to line up a cotter-pin hole/);
    expect(text("coil-shot")).toMatch(/Demagnetise/);
    expect(text("penetrant")).toMatch(/Do not sand, blast or scrape paint off/);
  });

  it("shows the default worked examples with their safe-side results", () => {
    // Two 0.032 sheets, 1/8 rivet: 0.2515 in → 9/32 in, MS20470AD4-4.5 (TM 10-5410-229-13&P: next length greater).
    expect(text("rivets")).toMatch(/0\.2515 in → 9\/32 in/);
    expect(text("rivets")).toContain("MS20470AD4-4.5");
    // T.O. 33B-1-1: 2 × 10 in bar, 5 turns → 1800 A; ±10 % (from memory) with the field-indicator note.
    expect(text("coil-shot")).toMatch(/1800 A/);
    expect(text("coil-shot")).toMatch(/1620 to 1980 A/);
    expect(text("coil-shot")).toMatch(/field indicator/);
    // FAA-H-8083-31 ch. 4: 0.040 in at 0.16 in is inside the 0.064 row's 0.12 to 0.2 in.
    expect(text("bend")).toMatch(/Minimum bend radius 0\.12 in/);
    // 10 min dwell at 70 °F: development held at the 10 min floor (ASTM E1417, from memory), not 5.
    expect(text("penetrant")).toMatch(/Development time 10 min/);
  });
});
