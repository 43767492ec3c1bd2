// The audit log in plain words: every action the code records has its sentence, names come from
// what the read query resolved, and nothing on the screen is a dotted code or JSON.
import { readdirSync, readFileSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { describeAuditEvent, describedActions, listWords, noNames, type AuditNames } from "@/lib/domain/audit/describe";

const id = (n: number) => `00000000-0000-4000-8000-${String(n).padStart(12, "0")}`;
const people = { elena: id(1), riley: id(2), jordan: id(3), morgan: id(4), sam: id(5), avery: id(6) };
const names: AuditNames = {
  people: {
    [people.elena]: "Elena Brandt",
    [people.riley]: "Riley Amsel",
    [people.jordan]: "Jordan Pike",
    [people.morgan]: "Morgan Vale",
    [people.sam]: "Sam Whitlock",
    [people.avery]: "Avery Lund",
  },
  manuals: { [id(10)]: "HT-20 Trainer Maintenance Manual" },
  classes: { [id(20)]: "AMT Day Cohort 2027" },
  cards: { [id(30)]: "Wheel bearing inspection", [id(31)]: "Wheel bearing inspection (copy)" },
  subjects: { [id(40)]: "Landing gear and brakes" },
  revisions: { [id(50)]: { label: "Rev 4", manualTitle: "HT-20 Trainer Maintenance Manual" } },
  runs: { [id(60)]: { studentName: "Jonas Weber", title: "Wheel bearing inspection", version: 3, stepIds: [id(70), id(71), id(72)] } },
};

const entry = (
  action: string,
  subjectType: string,
  subjectId: string | null,
  details: Record<string, unknown> = {},
  actorName: string | null = "Elena Brandt",
) => ({
  action,
  actorName,
  subjectType,
  subjectId,
  details,
});

/** One entry per action, with the details the code writes for it (lib/server/**: recordAudit). */
const cases: Record<string, { entry: ReturnType<typeof entry>; summary: string; details?: [string, string][] }> = {
  "account.created": {
    entry: entry("account.created", "user", people.riley, { email: "riley@school.test", role: "student" }, "Morgan Vale"),
    summary: "Morgan Vale created a student account for Riley Amsel, with a password set",
    details: [
      ["E-mail", "riley@school.test"],
      ["Role", "student"],
    ],
  },
  "account.invited": {
    entry: entry("account.invited", "user", people.elena, { email: "elena@school.test", role: "instructor" }, "Morgan Vale"),
    summary: "Morgan Vale invited Elena Brandt as an instructor",
    details: [
      ["E-mail", "elena@school.test"],
      ["Role", "instructor"],
    ],
  },
  "account.invitation_resent": {
    entry: entry("account.invitation_resent", "user", people.elena, {}, "Morgan Vale"),
    summary: "Morgan Vale sent Elena Brandt's invitation again",
  },
  "account.updated": {
    entry: entry(
      "account.updated",
      "user",
      people.elena,
      { role: ["instructor", "admin"], name: ["Elena Brant", "Elena Brandt"] },
      "Morgan Vale",
    ),
    summary: "Morgan Vale changed Elena Brandt's name and role",
    details: [
      ["Name", "Elena Brant → Elena Brandt"],
      ["Role", "instructor → admin"],
    ],
  },
  "account.password_reset_requested": {
    entry: entry("account.password_reset_requested", "user", people.sam, {}, null),
    summary: "A password reset link was asked for Sam Whitlock's account",
  },
  "account.invitation_accepted": {
    entry: entry("account.invitation_accepted", "user", people.riley, {}, "Riley Amsel"),
    summary: "Riley Amsel accepted the invitation and chose a password",
  },
  "account.password_reset": {
    entry: entry("account.password_reset", "user", people.sam, {}, "Sam Whitlock"),
    summary: "Sam Whitlock chose a new password with a reset link",
  },
  "manual.uploaded": {
    entry: entry(
      "manual.uploaded",
      "manual",
      id(10),
      { title: "HT-20 Trainer Maintenance Manual", revision: "Rev 3", revisionId: id(51), bytes: 3 * 1024 * 1024 },
      "Ines Okoro",
    ),
    summary: "Ines Okoro uploaded the manual 'HT-20 Trainer Maintenance Manual', Rev 3",
    details: [
      ["Revision", "Rev 3"],
      ["File size", "3.0 MiB"],
    ],
  },
  "revision.uploaded": {
    entry: entry("revision.uploaded", "manual", id(10), { revision: "Rev 4", revisionId: id(50), bytes: 2048 }, "Ines Okoro"),
    summary: "Ines Okoro uploaded Rev 4 of 'HT-20 Trainer Maintenance Manual'",
    details: [
      ["Revision", "Rev 4"],
      ["File size", "2 KiB"],
    ],
  },
  "revision.retried": {
    entry: entry("revision.retried", "manual", id(10), { revisionId: id(50) }, "Ines Okoro"),
    summary: "Ines Okoro asked for Rev 4 of 'HT-20 Trainer Maintenance Manual' to be read again",
    details: [["Revision", "Rev 4"]],
  },
  "revision.ready": {
    entry: entry("revision.ready", "manual", id(10), { revisionId: id(50), label: "Rev 4", pages: 42, current: true }, null),
    summary: "Hangarleaf finished reading Rev 4 of 'HT-20 Trainer Maintenance Manual' (42 pages); it is now the current revision",
    details: [
      ["Revision", "Rev 4"],
      ["Pages", "42"],
      ["Current revision", "yes"],
    ],
  },
  "manual.kept_on_carts": {
    entry: entry("manual.kept_on_carts", "manual", id(10), { title: "HT-20 Trainer Maintenance Manual" }, "Ines Okoro"),
    summary: "Ines Okoro had 'HT-20 Trainer Maintenance Manual' kept whole on the carts",
  },
  "manual.not_kept_on_carts": {
    entry: entry("manual.not_kept_on_carts", "manual", id(10), { title: "HT-20 Trainer Maintenance Manual" }, "Ines Okoro"),
    summary: "Ines Okoro stopped keeping 'HT-20 Trainer Maintenance Manual' whole on the carts",
  },
  "class.created": {
    entry: entry("class.created", "class", id(20), { name: "AMT Day Cohort 2027" }, "Morgan Vale"),
    summary: "Morgan Vale created the class 'AMT Day Cohort 2027'",
  },
  "class.updated": {
    entry: entry("class.updated", "class", id(20), { startsOn: "2026-09-01", endsOn: null, description: "" }, "Morgan Vale"),
    summary: "Morgan Vale changed the class 'AMT Day Cohort 2027'",
    details: [
      ["Description", "(none)"],
      ["Starts", "2026-09-01"],
      ["Ends", "(no date)"],
    ],
  },
  "class.members_added": {
    entry: entry("class.members_added", "class", id(20), { userIds: [people.riley, people.jordan] }, "Morgan Vale"),
    summary: "Morgan Vale added Riley Amsel and Jordan Pike to the class 'AMT Day Cohort 2027'",
  },
  "class.member_removed": {
    entry: entry("class.member_removed", "class", id(20), { userId: people.jordan }, "Morgan Vale"),
    summary: "Morgan Vale removed Jordan Pike from the class 'AMT Day Cohort 2027'",
  },
  "card.created": {
    entry: entry("card.created", "task_card", id(30), { title: "Wheel bearing inspection" }),
    summary: "Elena Brandt created the task card 'Wheel bearing inspection'",
  },
  "card.published": {
    entry: entry("card.published", "task_card", id(30), { title: "Wheel bearing inspection", version: 3 }),
    summary: "Elena Brandt published version 3 of the task card 'Wheel bearing inspection'",
  },
  "card.draft_discarded": {
    entry: entry("card.draft_discarded", "task_card", id(30)),
    summary: "Elena Brandt discarded the draft of the task card 'Wheel bearing inspection'",
  },
  "card.duplicated": {
    entry: entry("card.duplicated", "task_card", id(31), { from: id(30), title: "Wheel bearing inspection (copy)" }),
    summary: "Elena Brandt duplicated the task card 'Wheel bearing inspection' as 'Wheel bearing inspection (copy)'",
  },
  "card.archived": {
    entry: entry("card.archived", "task_card", id(30)),
    summary: "Elena Brandt archived the task card 'Wheel bearing inspection'",
  },
  "card.restored": {
    entry: entry("card.restored", "task_card", id(30)),
    summary: "Elena Brandt brought the task card 'Wheel bearing inspection' back from the archive",
  },
  "card.coauthors_set": {
    entry: entry("card.coauthors_set", "task_card", id(30), { coauthors: [people.morgan] }),
    summary: "Elena Brandt made Morgan Vale co-author of the task card 'Wheel bearing inspection'",
  },
  "card.rechecked": {
    entry: entry("card.rechecked", "task_card", id(30), { decisions: 2 }),
    summary: "Elena Brandt rechecked the cited pages of the task card 'Wheel bearing inspection' (2 decisions)",
  },
  "subject.created": {
    entry: entry("subject.created", "subject", id(40), { name: "Landing gear and brakes" }),
    summary: "Elena Brandt added the curriculum subject 'Landing gear and brakes'",
  },
  "subject.renamed": {
    entry: entry("subject.renamed", "subject", id(40), { name: "Landing gear and brakes" }),
    summary: "Elena Brandt renamed a curriculum subject to 'Landing gear and brakes'",
  },
  "assignment.created": {
    entry: entry("assignment.created", "assignment", id(80), {
      title: "Wheel bearing inspection",
      version: 3,
      classId: id(20),
      students: 14,
      dueOn: "2026-12-18",
    }),
    summary: "Elena Brandt assigned 'Wheel bearing inspection' (version 3) to the class 'AMT Day Cohort 2027'",
    details: [
      ["Students", "14"],
      ["Due", "2026-12-18"],
    ],
  },
  "assignment.changed": {
    entry: entry("assignment.changed", "assignment", id(80), {
      dueOn: { from: "2026-12-18", to: "2026-12-23" },
      note: { from: "Bay 1", to: "Bay 1" },
    }),
    summary: "Elena Brandt changed an assignment",
    details: [["Due", "2026-12-18 → 2026-12-23"]],
  },
  "assignment.withdrawn": {
    entry: entry("assignment.withdrawn", "assignment", id(80), {
      reason: "The aircraft went back to the flight line.",
      runs: { not_started: 3, in_progress: 1, signed_off: 2 },
    }),
    summary: "Elena Brandt withdrew an assignment",
    details: [
      ["Why", "The aircraft went back to the flight line."],
      ["Runs", "4 taken off the students' work, 2 signed off kept"],
    ],
  },
  "manual.changed": {
    entry: entry(
      "manual.changed",
      "manual",
      id(10),
      { title: "HT-20 Trainer Maintenance Manual", ataChapters: { from: ["32"], to: ["32", "05"] } },
      "Avery Lund",
    ),
    summary: "Avery Lund corrected the details of 'HT-20 Trainer Maintenance Manual'",
    details: [["ATA chapters", "32 → 32, 05"]],
  },
  "manual.withdrawn": {
    entry: entry("manual.withdrawn", "manual", id(10), { reason: "Replaced." }, "Avery Lund"),
    summary: "Avery Lund withdrew 'HT-20 Trainer Maintenance Manual' from the library",
    details: [["Why", "Replaced."]],
  },
  "manual.restored": {
    entry: entry("manual.restored", "manual", id(10), {}, "Avery Lund"),
    summary: "Avery Lund restored 'HT-20 Trainer Maintenance Manual' to the library",
  },
  "asset.created": {
    entry: entry("asset.created", "asset", id(80), { identifier: "N-HL01", kind: "aircraft", model: "HT-20" }, "Morgan Vale"),
    summary: "Morgan Vale added N-HL01 to the fleet",
    details: [
      ["Kind", "aircraft"],
      ["Model", "HT-20"],
    ],
  },
  "asset.updated": {
    entry: entry("asset.updated", "asset", id(80), { identifier: "N-HL01" }, "Morgan Vale"),
    summary: "Morgan Vale changed the details of N-HL01",
  },
  "asset.status_changed": {
    entry: entry("asset.status_changed", "asset", id(80), {
      identifier: "N-HL01",
      from: "instructional",
      to: "out_of_service",
      reason: "Cracked rib",
    }),
    summary: "Elena Brandt set N-HL01 to out of service",
    details: [["Why", "Cracked rib"]],
  },
  "asset.installed": {
    entry: entry("asset.installed", "asset", id(81), { identifier: "E-101", parent: "N-HL01" }),
    summary: "Elena Brandt recorded E-101 installed on N-HL01 (from a signed-off run)",
  },
  "asset.removed": {
    entry: entry("asset.removed", "asset", id(81), { identifier: "E-101", parent: "N-HL01" }),
    summary: "Elena Brandt recorded E-101 removed from N-HL01 (from a signed-off run)",
  },
  "place.created": {
    entry: entry("place.created", "place", id(82), { name: "Bay 1" }, "Morgan Vale"),
    summary: "Morgan Vale added Bay 1 to the hangar plan",
  },
  "booking.created": {
    entry: entry("booking.created", "booking", id(83), {
      asset: "N-HL01",
      place: "Bay 1",
      startsAt: "2026-12-07T14:00:00Z",
      endsAt: "2026-12-07T18:00:00Z",
    }),
    summary: "Elena Brandt booked N-HL01 in Bay 1",
    details: [
      ["From", "2026-12-07T14:00:00Z"],
      ["To", "2026-12-07T18:00:00Z"],
    ],
  },
  "booking.changed": {
    entry: entry("booking.changed", "booking", id(83), { asset: "N-HL01", from: "Bay 1 morning", to: "Bay 2 morning" }),
    summary: "Elena Brandt moved the booking of N-HL01",
    details: [
      ["Was", "Bay 1 morning"],
      ["Now", "Bay 2 morning"],
    ],
  },
  "booking.cancelled": {
    entry: entry("booking.cancelled", "booking", id(83), { asset: "N-HL01", from: "Bay 1 morning", reason: "Snow" }),
    summary: "Elena Brandt cancelled the booking of N-HL01",
    details: [
      ["Was", "Bay 1 morning"],
      ["Why", "Snow"],
    ],
  },
  "finding.filed": {
    entry: entry("finding.filed", "finding", id(84), { asset: "N-HL01", text: "Crack at the rib" }, "Sam Whitlock"),
    summary: "Sam Whitlock wrote up a finding on N-HL01",
    details: [["Found", "Crack at the rib"]],
  },
  "finding.closed": {
    entry: entry("finding.closed", "finding", id(84), { asset: "N-HL01", decision: "deferred", note: "Until the next term" }),
    summary: "Elena Brandt closed a finding on N-HL01: deferred",
    details: [["Note", "Until the next term"]],
  },
  "tool.created": {
    entry: entry("tool.created", "tool", id(40), { number: "TW-2" }, "Avery Lund"),
    summary: "Avery Lund added the tool TW-2 to the tool room",
  },
  "tool.changed": {
    entry: entry("tool.changed", "tool", id(40), { number: "TW-2" }, "Avery Lund"),
    summary: "Avery Lund changed the details of the tool TW-2",
  },
  "tool.out_of_service": {
    entry: entry("tool.out_of_service", "tool", id(40), { number: "TW-2", reason: "Dropped" }, "Avery Lund"),
    summary: "Avery Lund took the tool TW-2 out of service",
    details: [["Why", "Dropped"]],
  },
  "tool.in_service": {
    entry: entry("tool.in_service", "tool", id(40), {}, "Avery Lund"),
    summary: "Avery Lund put a tool back in service",
  },
  "tool.calibrated": {
    entry: entry(
      "tool.calibrated",
      "tool",
      id(40),
      { number: "TW-1", calibratedOn: "2026-12-01", certificate: "C-9", nextDueOn: "2027-12-01" },
      "Avery Lund",
    ),
    summary: "Avery Lund recorded a calibration of the tool TW-1",
    details: [
      ["Calibrated on", "2026-12-01"],
      ["Certificate", "C-9"],
      ["Next due", "2027-12-01"],
    ],
  },
  "kit.created": {
    entry: entry("kit.created", "kit", id(41), { number: "K-03" }, "Avery Lund"),
    summary: "Avery Lund added the kit K-03 to the tool room",
  },
  "tool.checked_out": {
    entry: entry("tool.checked_out", "checkout", id(42), { studentId: people.jordan, tools: ["T-201", "T-202"] }, "Avery Lund"),
    summary: "Avery Lund lent tools to Jordan Pike",
    details: [["Tools", "T-201, T-202"]],
  },
  "tool.checked_in": {
    entry: entry("tool.checked_in", "checkout", id(42), { studentId: people.jordan, missing: [] }, "Avery Lund"),
    summary: "Avery Lund counted back in every tool lent to Jordan Pike",
  },
  "tool.missing": {
    entry: entry("tool.missing", "checkout", id(42), { studentId: people.jordan, missing: ["T-202"] }, "Avery Lund"),
    summary: "Avery Lund counted in the tools lent to Jordan Pike: 1 tool missing",
    details: [["Missing", "T-202"]],
  },
  "tool.hold_cleared": {
    entry: entry("tool.hold_cleared", "tool_hold", id(43), { studentId: people.jordan, outcome: "lost", note: "Searched the hangar" }),
    summary: "Elena Brandt cleared a missing-tool hold on Jordan Pike's work: the tool was lost",
    details: [["Note", "Searched the hangar"]],
  },
  "session.created": {
    entry: entry("session.created", "class", id(20), { subject: "Riveting practice" }),
    summary: "Elena Brandt planned a session for the class 'AMT Day Cohort 2027'",
    details: [["Subject", "Riveting practice"]],
  },
  "session.closed": {
    entry: entry("session.closed", "class", id(20), { subject: "Riveting practice" }),
    summary: "Elena Brandt closed a session's register for the class 'AMT Day Cohort 2027'",
    details: [["Subject", "Riveting practice"]],
  },
  "attendance.recorded": {
    entry: entry("attendance.recorded", "class", id(20), { subject: "Riveting practice", entries: 3 }),
    summary: "Elena Brandt took attendance for the class 'AMT Day Cohort 2027'",
    details: [
      ["Subject", "Riveting practice"],
      ["Entries", "3"],
    ],
  },
  "attendance.corrected": {
    entry: entry("attendance.corrected", "class", id(20), { subject: "Riveting practice", entries: 1, reason: "Came back after lunch" }),
    summary: "Elena Brandt corrected a closed register of the class 'AMT Day Cohort 2027'",
    details: [
      ["Subject", "Riveting practice"],
      ["Entries", "1"],
      ["Why", "Came back after lunch"],
    ],
  },
  "standard.imported": {
    entry: entry("standard.imported", "standard", null, { imported: 12, updated: 0, refused: 2 }, "Morgan Vale"),
    summary: "Morgan Vale imported the certification standard's elements",
    details: [
      ["New", "12"],
      ["Words updated", "0"],
      ["Rows refused", "2"],
    ],
  },
  "settings.updated": {
    entry: entry("settings.updated", "settings", null, { timeZone: "America/Chicago" }, "Morgan Vale"),
    summary: "Morgan Vale set the school's time zone to America/Chicago",
    details: [["Time zone", "America/Chicago"]],
  },

  "run.bought_off": {
    entry: entry("run.bought_off", "run", id(60), { stepId: id(71) }),
    summary: "Elena Brandt bought off step 2 of Jonas Weber's run of 'Wheel bearing inspection' (version 3)",
  },
  "run.returned": {
    entry: entry("run.returned", "run", id(60), { comment: "Torque is out of limits.\nDo it again.", reopenedSteps: [1, 3] }),
    summary: "Elena Brandt sent Jonas Weber's run of 'Wheel bearing inspection' (version 3) back for rework",
    details: [
      ["Comment", "Torque is out of limits.\nDo it again."],
      ["Steps to do again", "1, 3"],
    ],
  },
  "run.signed_off": {
    entry: entry("run.signed_off", "run", id(60), {
      studentId: people.riley,
      title: "Wheel bearing inspection",
      version: 3,
      revisions: ["HT-20 Trainer Maintenance Manual Rev 4"],
    }),
    summary: "Elena Brandt signed off Jonas Weber's run of 'Wheel bearing inspection' (version 3)",
    details: [["Manual revisions cited", "HT-20 Trainer Maintenance Manual Rev 4"]],
  },
  "run.moved": {
    entry: entry("run.moved", "run", id(60), { fromVersion: 2, toVersion: 3, restartedSteps: [2] }),
    summary: "Elena Brandt moved Jonas Weber's run of 'Wheel bearing inspection' from version 2 to version 3",
    details: [["Steps to do again", "2"]],
  },
};

/** Every action literal the code passes to recordAudit (`action: "x.y"` or `action: a ? "x.y" : "x.z"`). */
function actionsInCode(): string[] {
  const root = path.resolve(import.meta.dirname, "../..");
  const found = new Set<string>();
  for (const folder of ["lib", "app"]) {
    for (const file of readdirSync(path.join(root, folder), { recursive: true, encoding: "utf8" })) {
      if (!/\.tsx?$/.test(file)) continue;
      const text = readFileSync(path.join(root, folder, file), "utf8");
      if (!text.includes("recordAudit(")) continue;
      for (const m of text.matchAll(/action: ([^,\n}]*)/g)) for (const a of m[1]!.matchAll(/"([a-z_]+\.[a-z_]+)"/g)) found.add(a[1]!);
    }
  }
  return [...found].sort();
}

const dottedCode = /\b[a-z]+(?:_[a-z]+)*\.[a-z]+(?:_[a-z]+)*\b/;
const looksLikeJson = /[{}[\]]|":/;

describe("the audit log in words", () => {
  it("words every action the code records", () => {
    const inCode = actionsInCode();
    expect(inCode.length).toBeGreaterThan(25);
    expect(inCode.filter((a) => !describedActions.includes(a))).toEqual([]);
    expect([...describedActions].sort()).toEqual(Object.keys(cases).sort());
  });

  for (const [action, c] of Object.entries(cases)) {
    it(`words ${action}`, () => {
      const out = describeAuditEvent(c.entry, names);
      expect(out.summary).toBe(c.summary);
      expect(out.details.map((l) => [l.label, l.value])).toEqual(c.details ?? []);
      expect(out.summary).not.toMatch(dottedCode);
      for (const line of out.details) expect(`${line.label} ${line.value}`).not.toMatch(looksLikeJson);
    });
  }

  it("words a change of the planned hours (null drops a section's plan)", () => {
    const out = describeAuditEvent(
      entry("settings.updated", "settings", null, { plannedHours: { General: 400, Airframe: null } }, "Morgan Vale"),
      names,
    );
    expect(out.summary).toBe("Morgan Vale changed the school's planned hours");
    expect(out.details.map((l) => [l.label, l.value])).toEqual([["Planned hours", "General 400, Airframe no plan"]]);
  });

  it("still reads as a sentence when the records could not be named", () => {
    expect(describeAuditEvent(cases["run.bought_off"]!.entry, noNames).summary).toBe(
      "Elena Brandt bought off an inspection point of a run",
    );
    expect(describeAuditEvent(cases["run.signed_off"]!.entry, noNames).summary).toBe(
      "Elena Brandt signed off a run of 'Wheel bearing inspection' (version 3)",
    );
    expect(describeAuditEvent(cases["class.member_removed"]!.entry, noNames).summary).toBe("Morgan Vale removed someone from a class");
    expect(describeAuditEvent(cases["account.invitation_resent"]!.entry, noNames).summary).toBe(
      "Morgan Vale sent someone's invitation again",
    );
    expect(describeAuditEvent(entry("card.archived", "task_card", id(99)), names).summary).toBe("Elena Brandt archived a task card");
    expect(describeAuditEvent(entry("card.archived", "task_card", id(30), {}, null), names).summary).toBe(
      "Someone archived the task card 'Wheel bearing inspection'",
    );
  });

  it("words status changes of an account, and many names at once", () => {
    const status = (from: string, to: string) =>
      describeAuditEvent(entry("account.updated", "user", people.riley, { status: [from, to] }, "Morgan Vale"), names).summary;
    expect(status("active", "deactivated")).toBe("Morgan Vale deactivated Riley Amsel's account");
    expect(status("deactivated", "active")).toBe("Morgan Vale reactivated Riley Amsel's account");
    expect(describeAuditEvent(entry("account.updated", "user", people.riley, {}, "Morgan Vale"), names).summary).toBe(
      "Morgan Vale saved Riley Amsel's account without changes",
    );
    const many = describeAuditEvent(
      entry("class.members_added", "class", id(20), { userIds: Object.values(people) }, "Morgan Vale"),
      names,
    );
    expect(many.summary).toBe("Morgan Vale added Elena Brandt, Riley Amsel and 4 others to the class 'AMT Day Cohort 2027'");
    expect(many.details).toEqual([
      { label: "Added", value: "Elena Brandt, Riley Amsel, Jordan Pike, Morgan Vale, Sam Whitlock, Avery Lund" },
    ]);
    expect(listWords(["A"])).toBe("A");
    expect(listWords([])).toBe("");
  });

  it("words an action nobody worded yet without its code, and its details as lines", () => {
    const out = describeAuditEvent(
      entry("card.made_public", "task_card", id(30), {
        reviewedBy: people.morgan,
        steps: [1, 2],
        urgent: false,
        limit: { min: 1, max: 2 },
      }),
      names,
    );
    expect(out.summary).toBe("Elena Brandt: made public (the task card 'Wheel bearing inspection')");
    expect(out.summary).not.toMatch(dottedCode);
    expect(out.details).toEqual([
      { label: "Reviewed by", value: "Morgan Vale" },
      { label: "Steps", value: "1, 2" },
      { label: "Urgent", value: "no" },
      { label: "Limit", value: "min 1; max 2" },
    ]);
    expect(describeAuditEvent(entry("sweep", "job", null, {}, null)).summary).toBe("Someone: changed (a record)");
  });
});
