import { describe, expect, it } from "vitest";
import { appliesTo, bookingProblem, installationProblem, readApplicability, weekOf } from "@/lib/domain/fleet/fleet";

describe("effectivity", () => {
  it("reads a model with a serial range, either dash", () => {
    expect(readApplicability("HT-20 s/n 1001-1200")).toEqual({ model: "HT-20", from: 1001, to: 1200 });
    expect(readApplicability("HT-20 S/N 1200–1001")).toEqual({ model: "HT-20", from: 1001, to: 1200 });
    expect(readApplicability("  Kestrel O-200  ")).toEqual({ model: "Kestrel O-200", from: null, to: null });
  });

  it("applies a general document to every asset, a model's only to that model, a range only inside it", () => {
    const trainer = { model: "ht-20", serial: "HT20-1107" };
    expect(appliesTo([], trainer)).toEqual({ applies: true, general: true });
    expect(appliesTo(["HT-20"], trainer).applies).toBe(true);
    expect(appliesTo(["HT-30"], trainer).applies).toBe(false);
    expect(appliesTo(["HT-20 s/n 1001-1200"], trainer).applies).toBe(true);
    expect(appliesTo(["HT-20 s/n 1201-1400"], trainer).applies).toBe(false);
    // Edges are inside; a serial that is no number matches no range.
    expect(appliesTo(["HT-20 s/n 1107-1107"], trainer).applies).toBe(true);
    expect(appliesTo(["HT-20 s/n 1-9999"], { model: "HT-20", serial: "unknown" }).applies).toBe(false);
  });
});

describe("bookings", () => {
  const asset = { identifier: "N-HL01", kind: "aircraft" as const, spanMetres: 10.2, status: "instructional" as const };
  const bay = { name: "Bay 1", takes: ["aircraft"], maxSpanMetres: 12 };
  const at = (h: number) => new Date(Date.UTC(2026, 11, 7, h)).toISOString();
  const booking = { assetId: "a1", placeId: "p1", startsAt: at(8), endsAt: at(12) };
  const other = (o: Partial<typeof booking>) => ({
    ...booking,
    id: "b2",
    assetIdentifier: "N-HL02",
    placeName: "Bay 2",
    className: "Evening Cohort",
    ...o,
  });

  it("refuses an overlap of one asset or one place, and names who holds it", () => {
    expect(bookingProblem(booking, asset, bay, [other({ placeId: "p2" })])).toMatch(/N-HL01 is already booked in Bay 2 for Evening Cohort/);
    expect(bookingProblem(booking, asset, bay, [other({ assetId: "a2" })])).toMatch(/Bay 1 already holds N-HL02 for Evening Cohort/);
    // Told on the school's clock.
    expect(bookingProblem(booking, asset, bay, [other({ placeId: "p2" })], "America/Chicago")).toMatch(/2026-12-07 02:00 to 06:00 CST\.$/);
    // Back to back is not an overlap; another asset in another place is nothing to do with it.
    expect(bookingProblem(booking, asset, bay, [other({ startsAt: at(12), endsAt: at(14) })])).toBeNull();
    expect(bookingProblem(booking, asset, bay, [other({ assetId: "a2", placeId: "p2" })])).toBeNull();
    // A booking is not in its own way when it is moved.
    expect(bookingProblem({ ...booking, id: "b2" }, asset, bay, [other({})])).toBeNull();
  });

  it("refuses an aircraft wider than the bay, a kind the place does not take, and an end before the start", () => {
    expect(bookingProblem(booking, { ...asset, spanMetres: 12.5 }, bay, [])).toMatch(/spans 12.5 m; Bay 1 takes at most 12 m/);
    expect(bookingProblem(booking, { ...asset, kind: "engine" }, bay, [])).toMatch(/Bay 1 does not take an engine: it takes aircraft/);
    expect(bookingProblem({ ...booking, endsAt: at(8) }, asset, bay, [])).toMatch(/ends before it starts/);
    expect(bookingProblem(booking, { ...asset, spanMetres: null }, bay, [])).toBeNull();
  });
});

describe("installation changes", () => {
  const engine = { id: "e1", identifier: "E-101", kind: "engine" as const };
  const airframe = { id: "a1", identifier: "N-HL01", kind: "aircraft" as const };
  it("installs only what is free and fits, removes only from where it is", () => {
    expect(installationProblem({ action: "install" }, engine, airframe, null)).toBeNull();
    expect(installationProblem({ action: "install" }, engine, airframe, { parentId: "a2", parentIdentifier: "N-HL02" })).toMatch(
      /still on N-HL02/,
    );
    expect(installationProblem({ action: "install" }, airframe, engine, null)).toMatch(/does not go on/);
    expect(installationProblem({ action: "remove" }, engine, airframe, { parentId: "a1", parentIdentifier: "N-HL01" })).toBeNull();
    expect(installationProblem({ action: "remove" }, engine, airframe, null)).toMatch(/not installed on N-HL01/);
    expect(installationProblem({ action: "install" }, engine, engine, null)).toMatch(/itself/);
  });
});

describe("the hangar week", () => {
  it("runs Monday to Sunday around any day of it", () => {
    expect(weekOf("2026-12-03")).toEqual([
      "2026-11-30",
      "2026-12-01",
      "2026-12-02",
      "2026-12-03",
      "2026-12-04",
      "2026-12-05",
      "2026-12-06",
    ]);
    expect(weekOf("2026-12-06")[0]).toBe("2026-11-30");
    expect(weekOf("2026-11-30")[6]).toBe("2026-12-06");
  });
});
