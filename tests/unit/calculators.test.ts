// Calculator checks against published tables and worked examples. Each check names its source, with
// the values of ../shared/REFERENCES.md; a value that is not there says "from memory" or "common
// practice". Expected values are the handbook's, or worked by hand beside the check: never the
// code's own formula run again.
import { describe, expect, it } from "vitest";
import { AppError } from "@/lib/domain/errors";
import { bendAllowance, checkBendRadius, flatPattern, kFactor, setback } from "@/lib/domain/calc/bend";
import { coilShotCurrent, penetrantDwell, penetrantWindowF } from "@/lib/domain/calc/ndt";
import {
  chooseRivetDiameter,
  fractionOfInch,
  parseRivetPartNumber,
  rivetLayout,
  rivetLength,
  rivetPartNumber,
  rivetsForSplice,
  substituteWith2117,
} from "@/lib/domain/calc/rivets";
import { adapterWarnings, appliedTorque, wrenchSetting } from "@/lib/domain/calc/torque";
import { convert, formatNumber } from "@/lib/domain/calc/units";

/** Every refusal is the project's one error type, "invalid", with a message for the screen. */
function refused(fn: () => unknown, message: RegExp) {
  let caught: unknown;
  try {
    fn();
  } catch (error) {
    caught = error;
  }
  expect(caught).toBeInstanceOf(AppError);
  expect((caught as AppError).code).toBe("invalid");
  expect((caught as AppError).message).toMatch(message);
}

describe("rivet diameter", () => {
  it("AC 43.13-1B par. 4-58g: 0.032 in sheet → 3 × 0.032 = 0.096 → 1/8 in rivet, 5/32 also satisfactory", () => {
    const choice = chooseRivetDiameter(0.032);
    expect(choice.target).toBeCloseTo(0.096, 6);
    expect(choice.suggested).toBe(1 / 8);
    expect(choice.alternative).toBe(5 / 32);
  });

  it("NAVEDTRA 14018 ch. 13 (t to 3 t) with AC 43.13-1B 4-58g: a range to choose from, not one answer", () => {
    // 0.032 sheet: 3/32 (0.094, between t and 3 t), 1/8 (the AC's), 5/32 (also satisfactory); no larger.
    expect(chooseRivetDiameter(0.032).options.map((o) => o.diameter)).toEqual([3 / 32, 1 / 8, 5 / 32]);
    // 0.040 sheet: 3 t = 0.120 → 1/8; 5/32 also; 3/32 is under 3 t but at least t.
    expect(chooseRivetDiameter(0.04).options.map((o) => o.diameter)).toEqual([3 / 32, 1 / 8, 5 / 32]);
  });

  it("NAVEDTRA 14018 ch. 13: never smaller than the thickest sheet", () => {
    const choice = chooseRivetDiameter(0.1);
    expect(choice.minimum).toBe(0.1);
    expect(choice.options.map((o) => o.diameter)).toEqual([1 / 8, 5 / 32, 3 / 16, 1 / 4]); // 3/32 = 0.094 < 0.1: left out
  });

  it("warns instead of suggesting when 3 t is beyond a 1/4 in rivet (common practice: engineering data)", () => {
    const choice = chooseRivetDiameter(0.1);
    expect(choice.suggested).toBeNull();
    expect(choice.warnings.join(" ")).toMatch(/engineering data/);
  });

  it("refuses a sheet of zero or negative thickness", () => {
    refused(() => chooseRivetDiameter(0), /more than zero/);
    refused(() => chooseRivetDiameter(-0.032), /more than zero/);
  });
});

describe("rivet length", () => {
  it("FAA-H-8083-31 ch. 4, TM 10-5410-229-13&P: two 0.032 sheets, 1/8 rivet → 0.2515 in, just past 1/4: the next length up, 9/32", () => {
    const length = rivetLength({ grip: 0.064, diameter: 1 / 8 });
    expect(length.length).toBeCloseTo(0.2515, 6); // REFERENCES: computed
    // "nearest standard length greater" (TM 10-5410-229-13&P): 0.0015 in over 4/16 is 9/32, never 4/16.
    expect(length.lengthSixteenths).toBe(4.5);
    expect(rivetPartNumber({ head: "MS20470", material: "AD", diameter: 1 / 8, lengthSixteenths: length.lengthSixteenths })).toBe(
      "MS20470AD4-4.5",
    );
  });

  it("a length exactly on a standard step keeps it (worked by hand: 0.0625 + 0.1875 = 0.25 in → 4/16)", () => {
    expect(rivetLength({ grip: 0.0625, diameter: 1 / 8 }).lengthSixteenths).toBe(4);
    // 0.08 + 0.1875 = 0.2675 in → 9/32 = 0.28125 (worked by hand).
    expect(rivetLength({ grip: 0.08, diameter: 1 / 8 }).lengthSixteenths).toBe(4.5);
    // 0.064 + 1.5 × 3/32 = 0.2046 in → 7/32 = 0.21875 (worked by hand).
    expect(rivetLength({ grip: 0.064, diameter: 3 / 32 }).lengthSixteenths).toBe(3.5);
  });

  it("refuses zero or negative grip and diameter", () => {
    refused(() => rivetLength({ grip: 0, diameter: 1 / 8 }), /more than zero/);
    refused(() => rivetLength({ grip: 0.064, diameter: -1 / 8 }), /more than zero/);
  });
});

describe("rivet layout", () => {
  it("TM 10-5410-229-13&P: edge ≥ 2 D, pitch ≥ 3 D, rows ≥ 2.5 D; NAVEDTRA 14018: pitch usually 4–8 D", () => {
    const layout = rivetLayout({ diameter: 1 / 8 });
    expect(layout.minimumEdgeDistance).toBeCloseTo(0.25, 9);
    expect(layout.minimumPitch).toBeCloseTo(0.375, 9);
    expect(layout.minimumRowSpacing).toBeCloseTo(0.3125, 9);
    expect(layout.usualPitch).toEqual([0.5, 1]);
    // Countersunk heads 2.5 D: secondary copies only (REFERENCES: partial).
    expect(rivetLayout({ diameter: 1 / 8, countersunk: true }).minimumEdgeDistance).toBeCloseTo(0.3125, 9);
  });

  it("edge distance as a range, 2 D to 4 D (4 D from memory, FAA-H-8083-31 ch. 4)", () => {
    const [low, high] = rivetLayout({ diameter: 1 / 8 }).edgeDistance;
    expect(low).toBeCloseTo(0.25, 9);
    expect(high).toBeCloseTo(0.5, 9);
  });

  it("transverse pitch about 75 % of pitch, never under 2.5 D (REFERENCES: partial)", () => {
    // 1/8 rivet at 6 D = 0.75 in pitch → rows 0.5625 in apart (worked by hand).
    expect(rivetLayout({ diameter: 1 / 8, pitch: 0.75 }).transversePitch[0]).toBeCloseTo(0.5625, 9);
    // At the 3 D minimum, 0.375 in, 75 % is 0.281 in: under 2.5 D, so 0.3125 in.
    expect(rivetLayout({ diameter: 1 / 8, pitch: 0.375 }).transversePitch[0]).toBeCloseTo(0.3125, 9);
    // No pitch given: 75 % of the usual 4–8 D, 0.375 to 0.75 in.
    const [low, high] = rivetLayout({ diameter: 1 / 8 }).transversePitch;
    expect([low, high]).toEqual([0.375, 0.75]);
  });

  it("flags a pitch under 3 D (NAVEDTRA 14018) and refuses a negative one", () => {
    expect(rivetLayout({ diameter: 1 / 8, pitch: 0.3 }).warnings[0]).toMatch(/3 D minimum/);
    refused(() => rivetLayout({ diameter: 1 / 8, pitch: -1 }), /pitch/);
    refused(() => rivetLayout({ diameter: 0 }), /more than zero/);
  });

  it("a minimum is shown rounded up: 2.5 × 5/32 = 0.390625 in (25/64) reads 0.3907, not 0.3906", () => {
    const edge = rivetLayout({ diameter: 5 / 32, countersunk: true }).minimumEdgeDistance;
    expect(formatNumber(edge, 4, "up")).toBe("0.3907");
    expect(fractionOfInch(edge)).toBe("25/64");
    expect(formatNumber(0.3, 4, "up")).toBe("0.3"); // 0.1 × 3 float noise is not a step up
  });
});

describe("rivet count and part numbers", () => {
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
    refused(() => rivetsForSplice({ width: -2, rivetsPerInch: 6.2 }), /more than zero/);
  });

  it("AC 43.13-1B par. 4-57a(4): MS20470AD4-3.5 is 1/8 in diameter, 7/32 in long", () => {
    expect(parseRivetPartNumber("MS20470AD4-3.5")).toEqual({ head: "MS20470", material: "AD", diameter: 1 / 8, length: 7 / 32 });
    expect(rivetPartNumber({ head: "MS20470", material: "AD", diameter: 1 / 8, lengthSixteenths: 3.5 })).toBe("MS20470AD4-3.5");
    refused(() => rivetPartNumber({ head: "MS20470", material: "AD", diameter: 0.1, lengthSixteenths: 4 }), /32nds/);
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

  it("FAA-H-8083-31 ch. 4 U-channel: 0.040 in, R 0.16 → SB 0.2; flats 0.8, 1.6, 0.8; BA 0.2791 and 3.758 in (REFERENCES: computed)", () => {
    expect(setback({ thickness: 0.04, radius: 0.16 })).toBeCloseTo(0.2, 9);
    expect(bendAllowance({ thickness: 0.04, radius: 0.16, degrees: 90 })).toBeCloseTo(0.2791, 4);
    const flat = flatPattern({ thickness: 0.04, radius: 0.16, dimensions: [1, 2, 1], bends: [90, 90] });
    expect(flat.flats.map((f) => Number(f.toFixed(4)))).toEqual([0.8, 1.6, 0.8]);
    expect(flat.developedLength).toBeCloseTo(3.758, 3);
    expect(flat.warnings).toEqual([]);
  });

  it("REFERENCES, computed: R 0.125, T 0.040, 90° → BA 0.2242 in, SB 0.165 in", () => {
    expect(bendAllowance({ thickness: 0.04, radius: 0.125 })).toBeCloseTo(0.2242, 4);
    expect(setback({ thickness: 0.04, radius: 0.125 })).toBeCloseTo(0.165, 9);
  });

  it("warns when a flange is shorter than its setbacks", () => {
    const flat = flatPattern({ thickness: 0.04, radius: 0.16, dimensions: [0.15, 2, 1], bends: [90, 90] });
    expect(flat.warnings[0]).toMatch(/Flat 1/);
  });

  it("refuses negative thickness, radius and dimensions in every function", () => {
    refused(() => setback({ thickness: -0.04, radius: 0.16 }), /thickness/);
    refused(() => setback({ thickness: 0.04, radius: -0.16 }), /radius/);
    refused(() => bendAllowance({ thickness: 0, radius: 0.16 }), /thickness/);
    refused(() => bendAllowance({ thickness: 0.04, radius: -0.01 }), /radius/);
    refused(() => flatPattern({ thickness: 0.04, radius: 0.16, dimensions: [1, -2, 1], bends: [90, 90] }), /dimension/);
    refused(() => checkBendRadius({ thickness: -0.032, radius: 0.1 }), /thickness/);
    refused(() => checkBendRadius({ thickness: 0.032, radius: -0.1 }), /radius/);
    refused(() => kFactor(180), /angle/);
  });

  // AC 43.13-1B Table 4-6, 2024-T3: 0.016 1.5t–3t · 0.032 2t–4t · 0.064 3t–5t · 0.128 4t–6t · 0.182 4t–6t · 0.258 5t–7t.
  // The low and high radii below are the table's multiples times the gauge, worked by hand.
  it.each([
    [0.016, 0.024, 0.048],
    [0.032, 0.064, 0.128],
    [0.064, 0.192, 0.32],
    [0.128, 0.512, 0.768],
    [0.182, 0.728, 1.092],
    [0.258, 1.29, 1.806],
  ])("AC 43.13-1B Table 4-6, 2024-T3, row %f in: minimum %f in, top of the range %f in", (t, low, high) => {
    const check = checkBendRadius({ thickness: t, radius: high });
    expect(check.tableThickness).toBe(t);
    expect(check.low).toBeCloseTo(low, 9);
    expect(check.high).toBeCloseTo(high, 9);
    expect(check.status).toBe("ok");
    expect(checkBendRadius({ thickness: t, radius: low }).status).toBe("tight"); // on the minimum: allowed, inside the range
    expect(checkBendRadius({ thickness: t, radius: low * 0.99 }).status).toBe("too-small");
  });

  it("AC 43.13-1B Table 4-6 between gauges: the thicker (safer) row, so a radius the thinner row would pass is refused", () => {
    // 0.020 in sits between 0.016 (1.5 t = 0.030) and 0.032 (2 t = 0.040): 0.035 in is too tight.
    expect(checkBendRadius({ thickness: 0.02, radius: 0.035 })).toMatchObject({ status: "too-small", tableThickness: 0.032 });
    // FAA-H-8083-31 ch. 4 worked example: 0.040 in 2024-T3 bent at 0.16 in is allowed (0.064 row, 3 t = 0.12 minimum).
    expect(checkBendRadius({ thickness: 0.04, radius: 0.16 })).toMatchObject({ status: "tight", tableThickness: 0.064 });
    expect(checkBendRadius({ thickness: 0.04, radius: 0.11 }).status).toBe("too-small");
    expect(checkBendRadius({ thickness: 0.3, radius: 2 }).status).toBe("no-data"); // past the table
  });

  it("AC 43.13-1B Table 4-6, 2024-O: 0 to 1 t", () => {
    expect(checkBendRadius({ thickness: 0.04, radius: 0.04, temper: "2024-O" }).status).toBe("ok");
    expect(checkBendRadius({ thickness: 0.04, radius: 0, temper: "2024-O" }).status).toBe("tight");
  });

  it("shows the minimum radius rounded up: 0.04111 in on the 0.064 row, 3 t = 0.12333 reads 0.1234, never 0.1233 (worked by hand)", () => {
    const check = checkBendRadius({ thickness: 0.04111, radius: 0.1 });
    expect(check.status).toBe("too-small");
    expect(check.message).toMatch(/0\.1234 to 0\.2056 in/);
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
  it("TM 1-1500-204-23-9: an adapter that shortens the lever subtracts A (300 × 10 ÷ 8 = 375, worked by hand)", () => {
    expect(wrenchSetting({ desired: 300, lever: 10, adapter: 2, direction: "shortens" })).toBeCloseTo(375, 9);
  });
  it("refuses an adapter that shortens the lever past half (common practice): 9.9 in on 10 in would ask 100 × the torque", () => {
    refused(
      () => wrenchSetting({ desired: 300, lever: 10, adapter: 9.9, direction: "shortens" }),
      /half the wrench length \(5 in of 10 in\)/,
    );
    refused(() => wrenchSetting({ desired: 300, lever: 10, adapter: 10, direction: "shortens" }), /half the wrench/);
    refused(() => wrenchSetting({ desired: 300, lever: 10, adapter: 12, direction: "shortens" }), /half the wrench/);
    // Exactly half: twice the torque (300 × 10 ÷ 5 = 600, worked by hand) is still given.
    expect(wrenchSetting({ desired: 300, lever: 10, adapter: 5, direction: "shortens" })).toBeCloseTo(600, 9);
  });
  it("positive torque and lengths only", () => {
    refused(() => wrenchSetting({ desired: 0, lever: 10, adapter: 4 }), /torque/);
    refused(() => wrenchSetting({ desired: -300, lever: 10, adapter: 4 }), /torque/);
    refused(() => wrenchSetting({ desired: 300, lever: 0, adapter: 4 }), /wrench length/);
    refused(() => wrenchSetting({ desired: 300, lever: 10, adapter: -4 }), /adapter/);
    refused(() => appliedTorque({ setting: -60, lever: 12, adapter: 2 }), /setting/);
  });
  it("warns when the adapter is longer than the wrench (common practice: low in the wrench's range)", () => {
    expect(adapterWarnings({ lever: 10, adapter: 12 })[0]).toMatch(/longer than the wrench/);
    expect(adapterWarnings({ lever: 10, adapter: 4 })).toEqual([]);
  });
  it("exact definitions: 1 lbf·ft = 1.3558179483314004 N·m, 1 lbf·in = 0.11298482902761668 N·m, 1 N·m = 8.850745791 lbf·in", () => {
    expect(convert(1, "ft-lb", "N·m")).toBeCloseTo(1.3558179483314, 12);
    expect(convert(1, "in-lb", "N·m")).toBeCloseTo(0.11298482902761668, 15);
    expect(convert(1, "N·m", "in-lb")).toBeCloseTo(8.850745791, 8);
    expect(convert(12, "in-lb", "ft-lb")).toBeCloseTo(1, 12);
  });
});

describe("penetrant dwell and development", () => {
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
  it("T.O. 33B-1-1 gives no rule above 120 °F: 120.1 and 125 °F get no dwell; the window is 40 to 120 °F", () => {
    expect(penetrantDwell({ specifiedMinutes: 10, temperature: 120.1 }).allowed).toBe(false);
    expect(penetrantDwell({ specifiedMinutes: 10, temperature: 125 }).allowed).toBe(false);
    expect(penetrantWindowF).toEqual({ min: 40, max: 120 });
  });
  it("T.O. 33B-1-1: service-induced flaws need at least 30 min", () => {
    const result = penetrantDwell({ specifiedMinutes: 10, temperature: 70, serviceInduced: true });
    expect(result.dwellMinutes).toBe(30);
    expect(result.warnings.join(" ")).toMatch(/30 minutes/);
  });
  it("TM 1-1500-204-23-7: development about half the dwell (20 min dwell → 10 min)", () => {
    expect(penetrantDwell({ specifiedMinutes: 20, temperature: 70 }).developmentMinutes).toBe(10);
  });
  it("ASTM E1417 (from memory): development never under 10 min, whatever half the dwell is", () => {
    // A 10 min dwell would give 5 min by "half the dwell": the floor holds at 10.
    expect(penetrantDwell({ specifiedMinutes: 10, temperature: 70 }).developmentMinutes).toBe(10);
    expect(penetrantDwell({ specifiedMinutes: 12, temperature: 110, developer: "dry" }).developmentMinutes).toBe(10);
  });
  it("NAVSEA T9074-AS-GIB-010/271: nonaqueous developer inspected by 30 min after it dries", () => {
    const result = penetrantDwell({ specifiedMinutes: 80, temperature: 70 });
    expect(result.developmentMinutes).toBe(30);
    expect(result.developmentWindow).toEqual([10, 30]);
    expect(result.warnings.join(" ")).toMatch(/30 min/);
    // Dry powder allows longer (ASTM E1417, from memory: 4 h): half of 80 is 40.
    expect(penetrantDwell({ specifiedMinutes: 80, temperature: 70, developer: "dry" }).developmentMinutes).toBe(40);
  });
  it("ASTM E1417 (from memory): a specified dwell under 10 min is flagged", () => {
    const short = penetrantDwell({ specifiedMinutes: 5, temperature: 70 });
    expect(short.dwellBelowMinimum).toBe(true);
    expect(short.warnings.join(" ")).toMatch(/under the 10-minute minimum/);
    expect(penetrantDwell({ specifiedMinutes: 10, temperature: 70 }).dwellBelowMinimum).toBe(false);
  });
  it("refuses a zero or negative dwell", () => {
    refused(() => penetrantDwell({ specifiedMinutes: 0, temperature: 70 }), /more than zero/);
    refused(() => penetrantDwell({ specifiedMinutes: -10, temperature: 70 }), /more than zero/);
  });
});

describe("magnetic-particle coil shot", () => {
  it("T.O. 33B-1-1: 2 in bar, 10 in long, 5 turns, against the coil wall → 1800 A; ±10 % is 1620 to 1980 A (from memory)", () => {
    const shot = coilShotCurrent({ length: 10, diameter: 2, turns: 5 });
    expect(shot.ratio).toBe(5);
    expect(shot.amperes).toBeCloseTo(1800, 9);
    expect(shot.range[0]).toBeCloseTo(1620, 9);
    expect(shot.range[1]).toBeCloseTo(1980, 9);
    expect(shot.notes.join(" ")).toMatch(/field indicator/);
  });

  it("T.O. 33B-1-1: L/D of 3 or less gives no current without pole pieces", () => {
    refused(() => coilShotCurrent({ length: 6, diameter: 2, turns: 5 }), /pole pieces/);
    refused(() => coilShotCurrent({ length: 4, diameter: 2, turns: 5, polePieces: true }), /longer pole pieces/);
    // Just under the bound, the message shows enough digits to say why (2.99999, not 3).
    refused(() => coilShotCurrent({ length: 5.99998, diameter: 2, turns: 5 }), /L\/D is 2\.99999, 3 or less/);
    // With pole pieces the length is the part and pieces together: 8 in on a 2 in bar is L/D 4, 45,000 ÷ (4 × 5) = 2250 A (worked by hand).
    expect(coilShotCurrent({ length: 8, diameter: 2, turns: 5, polePieces: true }).amperes).toBeCloseTo(2250, 9);
  });

  it("ASTM E1444 (from memory): L/D over 15 counts as 15 (40 in × 2 in, 5 turns → 45,000 ÷ 75 = 600 A, worked by hand)", () => {
    const shot = coilShotCurrent({ length: 40, diameter: 2, turns: 5 });
    expect(shot.ratio).toBe(20);
    expect(shot.ratioUsed).toBe(15);
    expect(shot.amperes).toBeCloseTo(600, 9);
  });

  it("ASTM E1444 (from memory): a hollow part takes D = √(OD² − ID²); OD 2, ID 1.2 → 1.6 in, L/D 6.25, 5 turns → 1440 A (worked by hand)", () => {
    const shot = coilShotCurrent({ length: 10, diameter: 2, insideDiameter: 1.2, turns: 5 });
    expect(shot.effectiveDiameter).toBeCloseTo(1.6, 9);
    expect(shot.ratio).toBeCloseTo(6.25, 9);
    expect(shot.amperes).toBeCloseTo(1440, 9);
    // The solid-bar answer would be 1800 A: the bore matters.
    refused(() => coilShotCurrent({ length: 10, diameter: 2, insideDiameter: 2, turns: 5 }), /bore/);
  });

  it("ASTM E1444 (from memory): part centred in a low fill-factor coil, NI = 43,000 R ÷ (6 L/D − 5); 12 in coil, 2 × 10 in bar, 5 turns → 2064 A (worked by hand)", () => {
    const shot = coilShotCurrent({ length: 10, diameter: 2, turns: 5, arrangement: "centred", coilDiameter: 12 });
    expect(shot.fillFactor).toBeCloseTo(36, 9);
    expect(shot.amperes).toBeCloseTo(2064, 9);
    refused(() => coilShotCurrent({ length: 10, diameter: 2, turns: 5, arrangement: "centred" }), /inside diameter/);
  });

  it("ASTM E1444 (from memory): high fill factor or cable wrap, NI = 35,000 ÷ (L/D + 2); 2 × 10 in bar, 5 turns → 1000 A (worked by hand)", () => {
    expect(coilShotCurrent({ length: 10, diameter: 2, turns: 5, arrangement: "high-fill" }).amperes).toBeCloseTo(1000, 9);
    expect(coilShotCurrent({ length: 10, diameter: 2, turns: 5, arrangement: "high-fill", coilDiameter: 2.5 }).fillFactor).toBeCloseTo(
      1.5625,
      9,
    );
  });

  it("refuses a fill factor the chosen formula does not cover", () => {
    refused(() => coilShotCurrent({ length: 10, diameter: 2, turns: 5, coilDiameter: 4 }), /between 2 and 10/); // fill 4
    refused(() => coilShotCurrent({ length: 10, diameter: 2, turns: 5, arrangement: "high-fill", coilDiameter: 12 }), /low fill factor/);
    refused(() => coilShotCurrent({ length: 10, diameter: 2, turns: 5, arrangement: "wall", coilDiameter: 2.5 }), /high fill factor/);
  });

  it("refuses zero or negative sizes and broken turn counts", () => {
    refused(() => coilShotCurrent({ length: -10, diameter: 2, turns: 5 }), /more than zero/);
    refused(() => coilShotCurrent({ length: 10, diameter: 0, turns: 5 }), /more than zero/);
    refused(() => coilShotCurrent({ length: 10, diameter: 2, turns: 2.5 }), /whole number/);
  });
});
