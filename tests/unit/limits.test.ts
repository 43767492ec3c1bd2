import { describe, expect, it } from "vitest";
import { describeLimit, judgeValue } from "@/lib/calc/limits";
import { convert, parseNumber, parseQuantity, resolveUnit } from "@/lib/calc/units";

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
});
