// Calculator checks against published worked examples. Each check names its source; the values are
// those of ../shared/REFERENCES.md.
import { describe, expect, it } from "vitest";
import { bendAllowance, checkBendRadius, flatPattern, kFactor, setback } from "@/lib/calc/bend";
import { coilShotCurrent, penetrantDwell } from "@/lib/calc/ndt";
import {
  chooseRivetDiameter, fractionOfInch, parseRivetPartNumber, rivetLayout, rivetLength, rivetPartNumber, rivetsForSplice, substituteWith2117,
} from "@/lib/calc/rivets";
import { appliedTorque, wrenchSetting } from "@/lib/calc/torque";
import { convert } from "@/lib/calc/units";

describe("rivets", () => {
  it("AC 43.13-1B par. 4-58g: 0.032 in sheet → 3 × 0.032 = 0.096 → 1/8 in rivet, 5/32 also satisfactory", () => {
    const choice = chooseRivetDiameter(0.032);
    expect(choice.target).toBeCloseTo(0.096, 6);
    expect(choice.suggested).toBe(1 / 8);
    expect(choice.alternative).toBe(5 / 32);
  });

  it("NAVEDTRA 14018 ch. 13: never smaller than the thickest sheet", () => {
    expect(chooseRivetDiameter(0.04).minimum).toBe(0.04);
  });

  it("warns instead of answering when 3 t is beyond a 1/4 in rivet", () => {
    const choice = chooseRivetDiameter(0.1);
    expect(choice.suggested).toBeNull();
    expect(choice.warnings.join(" ")).toMatch(/engineering data/);
  });

  it("AC 43.13-1B par. 4-58g: 10 in splice, 4.9 × 0.75 rivets per inch → 37 rivets, two rows of 19", () => {
    const count = rivetsForSplice({ width: 10, rivetsPerInch: 4.9, factor: 0.75, rows: 2 });
    expect(count.required).toBe(37);
    expect(count.perRow).toBe(19);
  });

  it("AC 43.13-1B Fig. 4-20: t 0.040, 1/8 AD, 6.2 per inch; W 0.6 → 4, 60 % → 3; W 2.0 → 13, 60 % → 8", () => {
    expect(rivetsForSplice({ width: 0.6, rivetsPerInch: 6.2 }).required).toBe(4);
    expect(rivetsForSplice({ width: 0.6, rivetsPerInch: 6.2, factor: 0.6 }).required).toBe(3);
    expect(rivetsForSplice({ width: 2.0, rivetsPerInch: 6.2 }).required).toBe(13);
    expect(rivetsForSplice({ width: 2.0, rivetsPerInch: 6.2, factor: 0.6 }).required).toBe(8);
  });

  it("NAVEDTRA 14018; FAA-H-8083-31 ch. 4: L = grip + 1.5 D; two 0.032 sheets, 1/8 rivet → 0.2515 in (computed)", () => {
    const length = rivetLength({ grip: 0.064, diameter: 1 / 8 });
    expect(length.length).toBeCloseTo(0.2515, 6);
    // 0.0015 in over 1/4 is inside measuring slack: a 4/16 rivet (common practice).
    expect(length.lengthSixteenths).toBe(4);
    expect(rivetLength({ grip: 0.08, diameter: 1 / 8 }).lengthSixteenths).toBe(4.5);
  });

  it("TM 10-5410-229-13&P: edge ≥ 2 D, pitch ≥ 3 D, rows ≥ 2.5 D; NAVEDTRA 14018: pitch usually 4–8 D", () => {
    const layout = rivetLayout({ diameter: 1 / 8 });
    expect(layout.minimumEdgeDistance).toBeCloseTo(0.25, 9);
    expect(layout.minimumPitch).toBeCloseTo(0.375, 9);
    expect(layout.minimumRowSpacing).toBeCloseTo(0.3125, 9);
    expect(layout.usualPitch).toEqual([0.5, 1]);
    // Countersunk heads 2.5 D: secondary copies only (REFERENCES: partial).
    expect(rivetLayout({ diameter: 1 / 8, countersunk: true }).minimumEdgeDistance).toBeCloseTo(0.3125, 9);
  });

  it("AC 43.13-1B par. 4-57a(4): MS20470AD4-3.5 is 1/8 in diameter, 7/32 in long", () => {
    expect(parseRivetPartNumber("MS20470AD4-3.5")).toEqual({ head: "MS20470", material: "AD", diameter: 1 / 8, length: 7 / 32 });
    expect(rivetPartNumber({ head: "MS20470", material: "AD", diameter: 1 / 8, lengthSixteenths: 3.5 })).toBe("MS20470AD4-3.5");
    expect(() => rivetPartNumber({ head: "MS20470", material: "AD", diameter: 0.1, lengthSixteenths: 4 })).toThrow(/32nds/);
    expect(fractionOfInch(5 / 32)).toBe("5/32");
  });

  it("AC 43.13-1B par. 4-57b: 2017 ≤ 3/16 and 2024 ≤ 5/32 may take a 2117 rivet 1/32 larger", () => {
    expect(substituteWith2117({ alloy: "2017", diameter: 3 / 16 })).toMatchObject({ allowed: true, replacement: 7 / 32 });
    expect(substituteWith2117({ alloy: "2024", diameter: 5 / 32 })).toMatchObject({ allowed: true, replacement: 6 / 32 });
    expect(substituteWith2117({ alloy: "2024", diameter: 3 / 16 }).allowed).toBe(false);
  });
});

describe("sheet-metal bend", () => {
  it("AC 43.13-1B Table 4-7: K(90°) = 1, K(45°) = 0.41421, K(135°) = 2.414", () => {
    expect(kFactor(90)).toBeCloseTo(1, 9);
    expect(kFactor(45)).toBeCloseTo(0.41421, 5);
    expect(kFactor(135)).toBeCloseTo(2.414, 3);
  });

  it("AC 43.13-1B Table 4-7: 0.064 sheet, R 0.25 → SB 0.130 in at 45°, 0.758 in at 135°", () => {
    expect(setback({ thickness: 0.064, radius: 0.25, degrees: 45 })).toBeCloseTo(0.13, 3);
    expect(setback({ thickness: 0.064, radius: 0.25, degrees: 135 })).toBeCloseTo(0.758, 3);
  });

  it("FAA-H-8083-31 ch. 4 U-channel: 0.040 in, R 0.16 → SB 0.2; flats 0.8, 1.6, 0.8; BA 0.2791 and 3.758 in (computed)", () => {
    expect(setback({ thickness: 0.04, radius: 0.16 })).toBeCloseTo(0.2, 9);
    expect(bendAllowance({ thickness: 0.04, radius: 0.16, degrees: 90 })).toBeCloseTo(0.2791, 4);
    const flat = flatPattern({ thickness: 0.04, radius: 0.16, dimensions: [1, 2, 1], bends: [90, 90] });
    expect(flat.flats.map((f) => Number(f.toFixed(4)))).toEqual([0.8, 1.6, 0.8]);
    expect(flat.developedLength).toBeCloseTo(3.758, 3);
    expect(flat.warnings).toEqual([]);
  });

  it("computed: R 0.125, T 0.040, 90° → BA 0.2242 in, SB 0.165 in", () => {
    expect(bendAllowance({ thickness: 0.04, radius: 0.125 })).toBeCloseTo(0.2242, 4);
    expect(setback({ thickness: 0.04, radius: 0.125 })).toBeCloseTo(0.165, 9);
  });

  it("warns when a flange is shorter than its setbacks", () => {
    const flat = flatPattern({ thickness: 0.04, radius: 0.16, dimensions: [0.15, 2, 1], bends: [90, 90] });
    expect(flat.warnings[0]).toMatch(/Flat 1/);
  });

  it("AC 43.13-1B Table 4-6, 2024-T3: 0.032 → 2t–4t, 0.064 → 3t–5t, 0.258 → 5t–7t", () => {
    expect(checkBendRadius({ thickness: 0.032, radius: 0.05 })).toMatchObject({ status: "too-small", low: 0.064 });
    expect(checkBendRadius({ thickness: 0.032, radius: 0.064 }).status).toBe("tight"); // exactly 2t: inside the range
    expect(checkBendRadius({ thickness: 0.032, radius: 0.128 }).status).toBe("ok"); // exactly 4t
    expect(checkBendRadius({ thickness: 0.064, radius: 0.19 }).status).toBe("too-small"); // under 3t = 0.192
    expect(checkBendRadius({ thickness: 0.258, radius: 1.806 }).status).toBe("ok"); // 7t
    expect(checkBendRadius({ thickness: 0.3, radius: 2 }).status).toBe("no-data");
    // Between listed gauges the thicker row (3t–5t for 0.040) is used: the safer side (common practice).
    expect(checkBendRadius({ thickness: 0.04, radius: 0.16 })).toMatchObject({ status: "tight", tableThickness: 0.064 });
    // 2024-O: 0 to 1t.
    expect(checkBendRadius({ thickness: 0.04, radius: 0.04, temper: "2024-O" }).status).toBe("ok");
  });
});

describe("torque wrench with an extension", () => {
  it("TM 1-1500-204-23-9: L 10 in, A 4 in, TA 300 in-lb → 214 in-lb", () => {
    expect(Math.round(wrenchSetting({ desired: 300, lever: 10, adapter: 4 }))).toBe(214);
  });
  it("NAVEDTRA 14315 Fig. 3-44/45: 100 in-lb, 12 in wrench, 6 in extension → 66.7 in-lb", () => {
    expect(wrenchSetting({ desired: 100, lever: 12, adapter: 6 })).toBeCloseTo(66.7, 1);
  });
  it("TM 9-2350-261-20-1: 40 lb-ft, 12 in, 4 in → 30 lb-ft", () => {
    expect(wrenchSetting({ desired: 40, lever: 12, adapter: 4 })).toBeCloseTo(30, 9);
  });
  it("TM 5-3810-305-23: 300 ft-lb, 18 in, 6 in → 225 ft-lb", () => {
    expect(wrenchSetting({ desired: 300, lever: 18, adapter: 6 })).toBeCloseTo(225, 9);
  });
  it("TM 9-254: 60 in-lb setting, 12 in wrench, 2 in extension → 70 in-lb applied", () => {
    expect(appliedTorque({ setting: 60, lever: 12, adapter: 2 })).toBeCloseTo(70, 9);
  });
  it("TM 1-1500-204-23-9: an adapter that shortens the lever subtracts A", () => {
    expect(wrenchSetting({ desired: 300, lever: 10, adapter: 2, direction: "shortens" })).toBeCloseTo(375, 9);
    expect(() => wrenchSetting({ desired: 300, lever: 10, adapter: 10, direction: "shortens" })).toThrow(RangeError);
  });
  it("exact definitions: 1 lbf·ft = 1.3558179483314004 N·m, 1 lbf·in = 0.11298482902761668 N·m, 1 N·m = 8.850745791 lbf·in", () => {
    expect(convert(1, "ft-lb", "N·m")).toBeCloseTo(1.3558179483314, 12);
    expect(convert(1, "in-lb", "N·m")).toBeCloseTo(0.11298482902761668, 15);
    expect(convert(1, "N·m", "in-lb")).toBeCloseTo(8.850745791, 8);
    expect(convert(12, "in-lb", "ft-lb")).toBeCloseTo(1, 12);
  });
});

describe("nondestructive testing", () => {
  it("T.O. 33B-1-1: the specified dwell from 60 to 100 °F, boundaries included", () => {
    expect(penetrantDwell({ specifiedMinutes: 10, temperature: 60 }).dwellMinutes).toBe(10);
    expect(penetrantDwell({ specifiedMinutes: 10, temperature: 100 }).dwellMinutes).toBe(10);
  });
  it("T.O. 33B-1-1: double from 40 to under 60 °F", () => {
    expect(penetrantDwell({ specifiedMinutes: 10, temperature: 40 }).dwellMinutes).toBe(20);
    expect(penetrantDwell({ specifiedMinutes: 10, temperature: 59.9 }).dwellMinutes).toBe(20);
  });
  it("T.O. 33B-1-1: may halve from 100 to 120 °F but never under 5 min", () => {
    expect(penetrantDwell({ specifiedMinutes: 20, temperature: 110 }).shortestMinutes).toBe(10);
    expect(penetrantDwell({ specifiedMinutes: 8, temperature: 120 }).shortestMinutes).toBe(5);
  });
  it("T.O. 33B-1-1: no penetrant test below 40 °F, with a warning, not a number", () => {
    const result = penetrantDwell({ specifiedMinutes: 10, temperature: 39.9 });
    expect(result.allowed).toBe(false);
    expect(result.dwellMinutes).toBeNull();
    expect(result.warnings[0]).toMatch(/below 40 °F/);
    // 4 °C is 39.2 °F: the same refusal from a Celsius reading.
    expect(penetrantDwell({ specifiedMinutes: 10, temperature: 4, unit: "°C" }).allowed).toBe(false);
  });
  it("T.O. 33B-1-1: service-induced flaws need at least 30 min", () => {
    const result = penetrantDwell({ specifiedMinutes: 10, temperature: 70, serviceInduced: true });
    expect(result.dwellMinutes).toBe(30);
    expect(result.warnings.join(" ")).toMatch(/30 minutes/);
  });
  it("TM 1-1500-204-23-7: development about half the dwell", () => {
    expect(penetrantDwell({ specifiedMinutes: 20, temperature: 70 }).developmentMinutes).toBe(10);
  });
  it("T.O. 33B-1-1: 2 in bar, 10 in long, 5 turns → 1800 A; L/D ≤ 3 needs pole pieces", () => {
    const shot = coilShotCurrent({ length: 10, diameter: 2, turns: 5 });
    expect(shot.ratio).toBe(5);
    expect(shot.amperes).toBeCloseTo(1800, 9);
    expect(shot.warnings).toEqual([]);
    expect(coilShotCurrent({ length: 6, diameter: 2, turns: 5 }).warnings[0]).toMatch(/pole pieces/);
  });
});
