// A training record's measured values (folded from a run's events) and its CSV export.
import { describe, expect, it } from "vitest";
import type { StudentRecordDto } from "@/lib/contracts/runs";
import { foldRun, type RunEvent } from "@/lib/domain/runs/fold";
import { measuredValueLine, measuredValues, verdictOf } from "@/lib/domain/runs/measured";
import { recordCsvHeader, revisionsLine, signedAtText, studentRecordCsv } from "@/lib/domain/runs/record-csv";

const ids = ["00000000-0000-4000-8000-000000000001", "00000000-0000-4000-8000-000000000002", "00000000-0000-4000-8000-000000000003"];
const student = "10000000-0000-4000-8000-000000000001";
const steps = [
  { id: ids[0]!, text: "Measure the doubler.", measurement: { label: "Thickest sheet", unit: "in", nominal: 0.04, tolerance: 0.002 } },
  { id: ids[1]!, text: "Drill and deburr.", measurement: null },
  { id: ids[2]!, text: "Check the edge distance.", measurement: { label: "Edge distance", unit: "in", min: 0.25, max: 0.5 } },
];
const forFold = steps.map((s) => ({ id: s.id, inspectionPoint: false, measurement: s.measurement, timerMinutes: null }));
/** An event made at 08:minute on the cart, received at once. */
const event = (minute: number, type: RunEvent["type"], stepId: string | null, payload: Record<string, unknown> = {}): RunEvent => ({
  id: `20000000-0000-4000-8000-${String(minute).padStart(12, "0")}`,
  type,
  userId: student,
  clientTime: new Date(Date.UTC(2026, 11, 2, 8, minute)).toISOString(),
  serverTime: new Date(Date.UTC(2026, 11, 2, 8, minute)).toISOString(),
  stepId,
  payload,
});

describe("measured values of a run", () => {
  it("gives each measured step its counting reading, the limit as the card states it, and the verdict", () => {
    const state = foldRun(
      [
        event(1, "value.recorded", ids[0]!, { value: "0.05 in" }),
        event(2, "value.recorded", ids[0]!, { value: "1.02 mm", toolId: "t-101-id", toolNumber: "T-101" }),
        event(3, "value.recorded", ids[2]!, { value: "0.6" }),
      ],
      forFold,
      new Set(),
    );
    const measured = measuredValues(steps, state.steps);
    expect(measured).toEqual([
      {
        stepId: ids[0],
        stepNumber: 1,
        stepText: "Measure the doubler.",
        label: "Thickest sheet",
        limit: { unit: "in", nominal: 0.04, tolerance: 0.002, min: null, max: null, text: "0.04 ± 0.002 in" },
        value: "1.02 mm",
        recordedAt: "2026-12-02T08:02:00.000Z",
        toolNumber: "T-101",
        verdict: "within_limits",
      },
      expect.objectContaining({
        stepNumber: 3,
        value: "0.6",
        verdict: "out_of_limits",
        limit: expect.objectContaining({ min: 0.25, max: 0.5 }),
      }),
    ]);
    expect(measuredValueLine(measured[1]!)).toBe("Step 3, Edge distance: 0.6 (limits 0.25 to 0.5 in), OUT OF LIMITS");
    // Traceability: which micrometer measured it.
    expect(measuredValueLine(measured[0]!)).toBe("Step 1, Thickest sheet: 1.02 mm (limits 0.04 ± 0.002 in), within limits, with T-101");
  });

  it("says when nothing was recorded or the reading was not understood", () => {
    const state = foldRun([event(1, "value.recorded", ids[0]!, { value: "thin" })], forFold, new Set());
    const [first, second] = measuredValues(steps, state.steps);
    expect(first!.verdict).toBe("not_understood");
    expect(second).toMatchObject({ value: null, recordedAt: null, verdict: "not_recorded" });
    expect(measuredValueLine(second!)).toBe("Step 3, Edge distance: - (limits 0.25 to 0.5 in), no reading recorded");
    expect(verdictOf(null)).toBe("not_recorded");
  });
});

const record: StudentRecordDto = {
  student: { id: student, name: "Riley Amsel", email: "riley@example.test" },
  subjects: [
    {
      subjectName: "Sheet metal structures",
      signedOff: [
        {
          runId: "30000000-0000-4000-8000-000000000001",
          title: "Riveted splice patch",
          versionNumber: 2,
          signedAt: "2026-12-03T14:05:09.123Z",
          instructorName: "Elena Brandt",
          estimatedMinutes: 240,
          actualMinutes: 95,
          revisionsCited: [
            { revisionId: "r1", manualTitle: "Sheet-Metal Practices", label: "Rev 1", pages: [2, 5] },
            { revisionId: "r2", manualTitle: "Shop Handbook", label: "Rev B", pages: [7] },
          ],
          measured: measuredValues(
            steps,
            foldRun([event(1, "value.recorded", ids[0]!, { value: "0.041 in", toolNumber: "T-101" })], forFold, new Set()).steps,
          ),
        },
        {
          runId: "30000000-0000-4000-8000-000000000002",
          title: "=cmd|' /C calc'!A0",
          versionNumber: 1,
          signedAt: "2026-12-04T09:00:00.000Z",
          instructorName: "Elena Brandt",
          estimatedMinutes: null,
          actualMinutes: 30,
          revisionsCited: [],
          measured: [],
        },
      ],
    },
  ],
  open: [],
  returned: [],
  totals: { signedOff: 2, estimatedMinutes: 240, actualMinutes: 125 },
};

describe("the record's CSV", () => {
  it("has a line per measured step with the card's version, revisions, sign-off, value, limit and verdict", () => {
    const lines = studentRecordCsv(record).split("\r\n");
    expect(lines[0]).toBe(recordCsvHeader.join(","));
    expect(lines[0]).toBe(
      "Student,Subject,Task card,Version,Revisions cited,Signed off (UTC),Instructor,Estimated hours,Actual hours,Step,Measured,Value,Limit,Verdict,Tool",
    );
    const card =
      'Riley Amsel,Sheet metal structures,Riveted splice patch,2,"Sheet-Metal Practices Rev 1, pages 2, 5; Shop Handbook Rev B, page 7",2026-12-03 14:05,Elena Brandt,4.0,1.6';
    expect(lines[1]).toBe(`${card},1,Thickest sheet,0.041 in,0.04 ± 0.002 in,within limits,T-101`);
    expect(lines[2]).toBe(`${card},3,Edge distance,,0.25 to 0.5 in,no reading recorded,`);
    // A card that measures nothing has one line; a title typed as a formula stays text.
    expect(lines[3]).toBe(`Riley Amsel,Sheet metal structures,'=cmd|' /C calc'!A0,1,,2026-12-04 09:00,Elena Brandt,,0.5,,,,,,`);
    expect(lines[4]).toBe("");
    expect(lines).toHaveLength(5);
  });

  it("words revisions and times as the screens do", () => {
    expect(revisionsLine([])).toBe("");
    expect(revisionsLine([{ revisionId: "r", manualTitle: "M", label: "Rev 4", pages: [] }])).toBe("M Rev 4");
    expect(signedAtText("2026-12-03T14:05:09.123Z")).toBe("2026-12-03 14:05 UTC");
  });
});
