import { describe, expect, it } from "vitest";
import { describeLimit, judgeValue } from "@/lib/domain/calc/limits";
import { convert, formatAgainst, formatNumber, parseNumber, parseQuantity, resolveUnit } from "@/lib/domain/calc/units";

describe("limits checks", () => {
  const torque = { unit: "in-lb", min: 50, max: 70 };

  it("judges in the limit's own unit, boundaries included", () => {
    expect(judgeValue("50", torque).status).toBe("in");
    expect(judgeValue("70 in-lb", torque).status).toBe("in");
    expect(judgeValue("49.99", torque).status).toBe("out");
    expect(judgeValue("70.01", torque).status).toBe("out");
  });

  it("converts N·m to in-lb and shows the conversion", () => {
    // 7.9 N·m = 69.92 in-lb (exact definitions): in; 8 N·m = 70.81 in-lb: out.
    const inside = judgeValue("7.9 N·m", torque);
    expect(inside).toMatchObject({ status: "in", limitUnit: "in-lb" });
    expect(inside.status !== "invalid" && inside.shown).toBe("7.9 N·m = 69.921 in-lb");
    expect(judgeValue("8 nm", torque).status).toBe("out");
    expect(judgeValue({ value: 5, unit: "ft-lb" }, torque).status).toBe("in"); // 60 in-lb
  });

  it("converts mm against an inch limit at the boundary", () => {
    const gap = { unit: "in", min: 0.016, max: 0.021 };
    expect(judgeValue("0.4064 mm", gap).status).toBe("in"); // exactly 0.016 in
    expect(judgeValue("0.40 mm", gap).status).toBe("out");
    expect(judgeValue("0.5334mm", gap).status).toBe("in"); // exactly 0.021 in
  });

  it("takes nominal ± tolerance", () => {
    const eGap = { unit: "deg", nominal: 10, tolerance: 4 };
    expect(describeLimit(eGap)).toBe("10 ± 4 °");
    expect(judgeValue("6", eGap).status).toBe("in");
    expect(judgeValue("14°", eGap).status).toBe("in");
    expect(judgeValue("14.1", eGap).status).toBe("out");
  });

  it("converts temperatures with their offsets", () => {
    const part = { unit: "°F", min: 40, max: 125 };
    expect(convert(4.4, "°C", "°F")).toBeCloseTo(39.92, 2);
    expect(judgeValue("4.4 °C", part).status).toBe("out"); // 39.92 °F
    expect(judgeValue("4.5 C", part).status).toBe("in"); // 40.1 °F
    expect(judgeValue("51.6 °C", part).status).toBe("in"); // 124.88 °F
    expect(judgeValue("51.7 °C", part).status).toBe("out"); // 125.06 °F
  });

  it("one-sided limits", () => {
    expect(judgeValue("0.1 in", { unit: "in", min: 0.1 }).status).toBe("in");
    expect(judgeValue("0.099", { unit: "in", min: 0.1 }).status).toBe("out");
    expect(judgeValue("0.3", { unit: "in", max: 0.1 + 0.2 }).status).toBe("in"); // float noise is not "out"
  });

  it("refuses what it cannot judge, with a message", () => {
    expect(judgeValue("", torque)).toMatchObject({ status: "invalid" });
    expect(judgeValue("abc", torque)).toMatchObject({ status: "invalid" });
    expect(judgeValue("12 mm", torque)).toMatchObject({ status: "invalid", message: expect.stringMatching(/same thing/) });
    expect(judgeValue("12 furlongs", torque)).toMatchObject({ status: "invalid" });
    expect(judgeValue("5", { unit: "cubits", max: 3 })).toMatchObject({ status: "invalid" });
  });

  it("reads the numbers a student types", () => {
    expect(parseNumber("1/8")).toBe(0.125);
    expect(parseNumber("1 1/4")).toBe(1.25);
    expect(parseNumber("3/0")).toBeNull();
    expect(parseNumber("1e3")).toBe(1000);
    expect(parseNumber("12abc")).toBeNull();
    expect(parseQuantity("300in-lb")).toEqual({ value: 300, unit: "in-lb" });
    expect(parseQuantity("70 F")).toEqual({ value: 70, unit: "°F" });
    expect(parseQuantity("42", "psi")).toEqual({ value: 42, unit: "psi" });
    expect(resolveUnit("LB-FT")).toBe("ft-lb");
  });

  it("reads the torque and length units people write: ft-lbs, in-lbs, in., lbf·ft, N.m (common practice)", () => {
    expect(parseQuantity("40 ft-lbs")).toEqual({ value: 40, unit: "ft-lb" });
    expect(parseQuantity("150 in-lbs")).toEqual({ value: 150, unit: "in-lb" });
    expect(parseQuantity("0.25 in.")).toEqual({ value: 0.25, unit: "in" });
    expect(parseQuantity("55 lbf·ft")).toEqual({ value: 55, unit: "ft-lb" });
    expect(parseQuantity("55 lbf⋅ft")).toEqual({ value: 55, unit: "ft-lb" }); // the dot operator
    expect(parseQuantity("9 N.m")).toEqual({ value: 9, unit: "N·m" });
    expect(parseQuantity("9 N m")).toEqual({ value: 9, unit: "N·m" });
    expect(parseQuantity("30 ft–lb")).toEqual({ value: 30, unit: "ft-lb" }); // an en dash from a word processor
    expect(parseQuantity("5 FT-LBS")).toEqual({ value: 5, unit: "ft-lb" });
    expect(judgeValue("5 ft-lbs", torque).status).toBe("in"); // 60 in-lb
  });

  it("never shows 0 or -0 for a tiny conversion, nor exponents for a huge one", () => {
    // 1 nm is 0.0000000393701 in (exact definition: 1 in = 25.4 mm; 1e-6 / 25.4 = 3.93700787e-8).
    expect(formatNumber(convert(1e-6, "mm", "in"), 6)).toBe("0.0000000393701");
    expect(formatNumber(convert(-1e-6, "mm", "in"), 6)).toBe("-0.0000000393701");
    expect(formatNumber(1e-7)).toBe("0.0000001");
    expect(formatNumber(-0)).toBe("0");
    expect(formatNumber(2.54e25)).toBe("2.54 × 10^25");
    expect(formatNumber(1234567)).toBe("1235000");
  });

  it("shows an OUT reading with the digits that put it out: 6.35001 mm against at most 0.25 in", () => {
    // 6.35001 mm ÷ 25.4 = 0.2500004 in (exact definition): five figures would print 0.25, which is the limit.
    const out = judgeValue("6.35001 mm", { unit: "in", max: 0.25 });
    expect(out.status).toBe("out");
    expect(out.status !== "invalid" && out.shown).toBe("6.35001 mm = 0.2500004 in");
    const same = judgeValue("0.2500001", { unit: "in", max: 0.25 });
    expect(same.status !== "invalid" && same.message).toMatch(/^0\.2500001 in: OUT OF LIMITS, above at most 0\.25 in/);
    expect(formatAgainst(0.24999996, 0.25)).toBe("0.24999996");
  });

  it("never rounds a shown limit outward: a minimum is rounded up, a maximum down", () => {
    expect(describeLimit({ unit: "in", min: 0.1234564 })).toBe("at least 0.123457 in");
    expect(describeLimit({ unit: "in", max: 0.1234567 })).toBe("at most 0.123456 in");
  });
});
