// The tool room's pure rules: scanned codes, calibration on the day a reading counts as taken,
// and a card's tool lines against what a student has out.
import { describe, expect, it } from "vitest";
import {
  addDays,
  calibrationState,
  daysBetween,
  isOverdue,
  readCode,
  readingDay,
  toolLineStatuses,
  toolRefusal,
  type ToolForReading,
} from "@/lib/domain/tools/tool-room";
import { createToolSchema, checkoutSchema, clearHoldSchema } from "@/lib/domain/validation/tools";

const wrench = (over: Partial<ToolForReading> = {}): ToolForReading => ({
  number: "TW-2",
  description: "Torque wrench, 0-250 in-lb",
  calibrated: true,
  calibrationDueOn: "2026-11-20",
  status: "in_service",
  ...over,
});

describe("reading a scanned or typed code", () => {
  it("takes what scanners and people send, and refuses what cannot be a number", () => {
    expect(readCode("  tw-2\n")).toBe("TW-2");
    expect(readCode("HL:KIT:K-03")).toBe("K-03");
    expect(readCode("t- 104")).toBe("T-104");
    expect(readCode("")).toBeNull();
    expect(readCode("torque wrench")).toBeNull();
    expect(readCode("T-1234567")).toBeNull();
  });
});

describe("calibration", () => {
  it("counts days across month ends and leap days", () => {
    expect(daysBetween("2026-12-03", "2027-01-02")).toBe(30);
    expect(addDays("2028-02-28", 1)).toBe("2028-02-29");
    expect(addDays("2026-12-03", -12)).toBe("2026-11-21");
  });

  it("is usable through the due date, due soon within 30 days, and past the day after", () => {
    const tool = { calibrated: true, calibrationDueOn: "2026-12-31" };
    expect(calibrationState(tool, "2026-12-31")).toBe("due_soon");
    expect(calibrationState(tool, "2027-01-01")).toBe("past");
    expect(calibrationState(tool, "2026-12-01")).toBe("due_soon");
    expect(calibrationState(tool, "2026-11-30")).toBe("in");
    expect(calibrationState({ calibrated: true, calibrationDueOn: null }, "2026-12-01")).toBe("no_date");
    expect(calibrationState({ calibrated: false, calibrationDueOn: null }, "2026-12-01")).toBe("not_calibrated");
  });

  it("refuses a reading taken with a wrench past its date, naming the wrench and the dates", () => {
    expect(toolRefusal(wrench(), "2026-11-20")).toBeNull();
    expect(toolRefusal(wrench(), "2026-11-21")).toBe(
      "Torque wrench, 0-250 in-lb TW-2 was due for calibration on 2026-11-20: a reading taken with it on 2026-11-21 cannot be recorded. Take one within calibration from the tool room.",
    );
    expect(toolRefusal(wrench({ status: "out_of_service" }), "2026-11-01")).toMatch(/TW-2 is out of service/);
    expect(toolRefusal(wrench({ calibrated: false }), "2026-11-01")).toMatch(/not a calibrated tool/);
    expect(toolRefusal(wrench({ calibrationDueOn: null }), "2026-11-01")).toMatch(/no calibration on record/);
  });

  it("believes the cart's stamp only inside what the server saw: a clock set back does not bring a wrench back into calibration", () => {
    const received = "2026-12-03T15:00:00Z";
    // Stamped a week before its receipt: counted as taken 8 hours before it arrived, that day.
    expect(readingDay("UTC", "2026-11-26T15:00:00Z", received)).toBe("2026-12-03");
    // An offline reading of the morning, sent in the afternoon, keeps its morning.
    expect(readingDay("UTC", "2026-12-03T08:00:00Z", received)).toBe("2026-12-03");
    // Late on the day before, sent just after midnight, keeps its day.
    expect(readingDay("UTC", "2026-12-02T23:30:00Z", "2026-12-03T00:10:00Z")).toBe("2026-12-02");
    // A clock running ahead is pulled back to the receipt.
    expect(readingDay("UTC", "2026-12-09T08:00:00Z", received)).toBe("2026-12-03");
    // The school's day, not UTC's: 02:00 UTC is still the evening before in Chicago.
    expect(readingDay("America/Chicago", "2026-12-03T02:00:00Z", "2026-12-03T02:00:00Z")).toBe("2026-12-02");
  });
});

describe("a card's tools against what the student has out", () => {
  it("checks lines that start with a tool-room number, and leaves free text alone", () => {
    const lines = [
      "TW-1 Torque wrench, 0-250 in-lb",
      "K-02: Landing gear kit",
      "t-202 magnifying glass",
      "Wing jacks",
      "TW-9 Spare wrench",
    ];
    expect(toolLineStatuses(lines, { toolNumbers: new Set(["TW-1", "T-202"]), kitNumbers: new Set(["K-02"]) })).toEqual([
      { text: lines[0], number: "TW-1", status: "have" },
      { text: lines[1], number: "K-02", status: "have" },
      { text: lines[2], number: "T-202", status: "have" },
      { text: lines[3], number: null, status: "free_text" },
      { text: lines[4], number: "TW-9", status: "missing" },
    ]);
  });
});

describe("loans", () => {
  it("is overdue only when not counted back in by its due time", () => {
    const now = new Date("2026-12-03T12:00:00Z");
    expect(isOverdue({ dueAt: "2026-12-03T11:59:00Z", returnedAt: null }, now)).toBe(true);
    expect(isOverdue({ dueAt: "2026-12-03T11:59:00Z", returnedAt: "2026-12-03T12:30:00Z" }, now)).toBe(false);
    expect(isOverdue({ dueAt: "2026-12-03T12:01:00Z", returnedAt: null }, now)).toBe(false);
  });

  it("lends one kit or one tool, and a lost tool needs a note", () => {
    const id = "00000000-0000-4000-8000-000000000001";
    expect(checkoutSchema.safeParse({ userId: id }).success).toBe(false);
    expect(checkoutSchema.safeParse({ userId: id, kitId: id, toolId: id }).success).toBe(false);
    expect(checkoutSchema.safeParse({ userId: id, kitId: id }).success).toBe(true);
    expect(clearHoldSchema.safeParse({ outcome: "lost", note: "" }).success).toBe(false);
    expect(clearHoldSchema.safeParse({ outcome: "found" }).success).toBe(true);
  });

  it("numbers a tool in capitals and keeps calibration dates for precision tools", () => {
    expect(createToolSchema.parse({ number: " tw-3 ", description: "Torque wrench" }).number).toBe("TW-3");
    expect(createToolSchema.safeParse({ number: "wrench", description: "Torque wrench" }).success).toBe(false);
    expect(createToolSchema.safeParse({ number: "TW-3", description: "Wrench", calibrationDueOn: "2027-01-01" }).success).toBe(false);
    expect(
      createToolSchema.safeParse({ number: "TW-3", description: "Wrench", calibrated: true, calibrationDueOn: "2027-02-30" }).success,
    ).toBe(false);
  });
});
