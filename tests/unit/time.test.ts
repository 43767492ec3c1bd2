import { describe, expect, it } from "vitest";
import { clockIn, dateTimeIn, dayIn, isTimeZone, zoneLabel } from "@/lib/domain/time";
import { workStatusOf } from "@/lib/domain/runs/work-status";

describe("the school's time zone", () => {
  it("knows real zones and refuses made-up ones", () => {
    expect(isTimeZone("America/Denver")).toBe(true);
    expect(isTimeZone("UTC")).toBe(true);
    expect(isTimeZone("Mars/Olympus")).toBe(false);
    expect(isTimeZone("")).toBe(false);
  });

  it("tells a stored UTC time as the school's clock, across midnight and daylight saving", () => {
    // 05:30 UTC on 2 December is still 1 December in Denver (UTC−7 in winter).
    expect(dayIn("America/Denver", "2026-12-02T05:30:00Z")).toBe("2026-12-01");
    expect(dateTimeIn("America/Denver", "2026-12-02T05:30:00Z")).toBe("2026-12-01 22:30");
    expect(clockIn("Europe/Oslo", "2026-12-02T05:30:00Z")).toBe("06:30");
    // Summer time: UTC−6 in Denver.
    expect(dateTimeIn("America/Denver", "2026-07-01T12:00:00Z")).toBe("2026-07-01 06:00");
    expect(dateTimeIn("UTC", "2026-07-01T12:00:00Z")).toBe("2026-07-01 12:00");
    expect(zoneLabel("UTC")).toBe("UTC");
  });

  it("makes a run overdue by the school's day, not the server's", () => {
    // Late evening in Denver on the due day is already the next day in UTC: not overdue yet.
    const evening = "2026-12-02T05:30:00Z";
    expect(workStatusOf("in_progress", "2026-12-01", dayIn("America/Denver", evening))).toBe("in_progress");
    expect(workStatusOf("in_progress", "2026-12-01", dayIn("UTC", evening))).toBe("overdue");
  });
});
