// The small pure parts of runs: hours from events, "overdue", CSV cells, and photo sniffing.
import { describe, expect, it } from "vitest";
import { csvCell, toCsv } from "@/lib/domain/runs/csv";
import { activeMinutes, offlineHours, workingMinutes } from "@/lib/domain/runs/hours";
import { workStatusOf } from "@/lib/domain/runs/work-status";
import { sniffImage } from "@/lib/domain/validation/runs";

const t = (minutes: number) => new Date(Date.UTC(2026, 11, 2, 8, 0) + minutes * 60_000).toISOString();

describe("active minutes", () => {
  it("adds the gaps between events, each at most the idle limit", () => {
    expect(activeMinutes([t(0), t(5), t(12)])).toBe(12);
    // Lunch between two sittings counts 20 minutes, not 70.
    expect(activeMinutes([t(0), t(10), t(80), t(90)])).toBe(40);
    expect(activeMinutes([t(90), t(0), t(10), t(80)])).toBe(40);
    expect(activeMinutes([])).toBe(0);
    expect(activeMinutes([t(3)])).toBe(0);
    expect(activeMinutes([t(0), "not a time", t(4)])).toBe(4);
  });
});

describe("work status", () => {
  it("is overdue only before handing in, and only after the due day", () => {
    expect(workStatusOf("in_progress", "2026-12-01", "2026-12-02")).toBe("overdue");
    expect(workStatusOf("not_started", "2026-12-02", "2026-12-02")).toBe("not_started");
    expect(workStatusOf("returned", "2026-11-30", "2026-12-02")).toBe("overdue");
    expect(workStatusOf("submitted", "2026-11-30", "2026-12-02")).toBe("submitted");
    expect(workStatusOf("signed_off", "2026-11-30", "2026-12-02")).toBe("signed_off");
    expect(workStatusOf("in_progress", null, "2026-12-02")).toBe("in_progress");
  });
});

describe("CSV", () => {
  it("quotes what needs it and keeps formulas as text", () => {
    expect(csvCell("plain")).toBe("plain");
    expect(csvCell('say "hi", then')).toBe('"say ""hi"", then"');
    expect(csvCell("two\nlines")).toBe('"two\nlines"');
    expect(csvCell('=HYPERLINK("http://x")')).toBe('"\'=HYPERLINK(""http://x"")"');
    expect(csvCell("+1")).toBe("'+1");
    expect(csvCell("-2")).toBe("'-2");
    expect(csvCell("@SUM(A1)")).toBe("'@SUM(A1)");
    expect(csvCell(null)).toBe("");
    expect(csvCell(3.5)).toBe("3.5");
    expect(toCsv(["a", "b"], [[1, "x,y"]])).toBe('a,b\r\n1,"x,y"\r\n');
  });
});

describe("photo sniffing", () => {
  const bytes = (...values: number[]) => new Uint8Array([...values, ...new Array(16).fill(0)]);
  it("knows JPEG, PNG and WebP by their first bytes, and nothing else", () => {
    expect(sniffImage(bytes(0xff, 0xd8, 0xff, 0xe0))).toBe("image/jpeg");
    expect(sniffImage(bytes(0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a))).toBe("image/png");
    expect(sniffImage(new TextEncoder().encode("RIFF\0\0\0\0WEBPVP8 "))).toBe("image/webp");
    expect(sniffImage(new TextEncoder().encode("RIFF\0\0\0\0WAVEfmt "))).toBeNull();
    expect(sniffImage(new TextEncoder().encode("<svg onload=alert(1)>"))).toBeNull();
    expect(sniffImage(new TextEncoder().encode("%PDF-1.7"))).toBeNull();
    expect(sniffImage(new Uint8Array(0))).toBeNull();
  });
});

describe("working time bounded by what the server saw", () => {
  const t = (m: number) => new Date(Date.UTC(2026, 11, 1, 8, 0) + m * 60_000).toISOString();
  it("counts honest live and late-sent work at the cart's stamps", () => {
    const live = [0, 5, 12].map((m) => ({ clientTime: t(m), serverTime: t(m) }));
    expect(workingMinutes(live, { assignedAt: t(-60) })).toBe(12);
    const sentAtTheEnd = [0, 5, 12].map((m) => ({ clientTime: t(m), serverTime: t(240) })); // four hours offline
    expect(workingMinutes(sentAtTheEnd, { assignedAt: t(-60) })).toBe(12);
  });

  it("does not let a batch of back-dated stamps inflate the hours", () => {
    // 500 events stamped 20 minutes apart over a week before, all sent in one batch after 10 minutes of work.
    const honest = [0, 5, 10].map((m) => ({ clientTime: t(m), serverTime: t(m) }));
    const backDated = Array.from({ length: 500 }, (_, i) => ({ clientTime: t(-i * 20), serverTime: t(10) }));
    const bySumOfStamps = activeMinutes([...honest, ...backDated].map((e) => e.clientTime));
    expect(bySumOfStamps).toBeGreaterThan(9000);
    // Assigned an hour before: nothing counts before that.
    expect(workingMinutes([...honest, ...backDated], { assignedAt: t(-60) })).toBe(70);
    // Assigned long ago: at most one offline session (offlineHours) before the first receipt.
    expect(workingMinutes([...honest, ...backDated], { assignedAt: t(-100_000) })).toBeLessThanOrEqual(offlineHours * 60 + 10);
  });

  it("does not count a stamp after its receipt (a fast clock)", () => {
    const fast = [
      { clientTime: t(0), serverTime: t(0) },
      { clientTime: t(600), serverTime: t(6) },
    ];
    expect(workingMinutes(fast, { assignedAt: t(-1) })).toBe(6);
  });
});
