// The audit log in plain words: who did what to which record, and the details as "label: value"
// lines. Pure: the read query resolves the ids an entry keeps into names (lib/server/audit.ts), this
// only words them. An action nobody wrote words for yet still reads as a sentence, never as its code.
import { assetStatusWords, findingDecisionWords } from "@/lib/domain/fleet/fleet";
import { roleLabels, type Role } from "@/lib/domain/access/permissions";
import { formatBytes } from "@/lib/domain/library/format";

export interface AuditEventFacts {
  action: string;
  /** Null for what Hangarleaf did itself, or for someone who asked without signing in. */
  actorName: string | null;
  subjectType: string;
  subjectId: string | null;
  details: Record<string, unknown>;
}

/** What the read query found for the ids entries keep, by kind: id → name or title. */
export interface AuditNames {
  people: Readonly<Record<string, string>>;
  manuals: Readonly<Record<string, string>>;
  classes: Readonly<Record<string, string>>;
  /** A task card's title: its newest version's. */
  cards: Readonly<Record<string, string>>;
  subjects: Readonly<Record<string, string>>;
  revisions: Readonly<Record<string, { label: string; manualTitle: string }>>;
  runs: Readonly<Record<string, { studentName: string; title: string; version: number; stepIds: readonly string[] }>>;
}

export const noNames: AuditNames = { people: {}, manuals: {}, classes: {}, cards: {}, subjects: {}, revisions: {}, runs: {} };

export interface AuditDetail {
  label: string;
  value: string;
}

export interface AuditDescription {
  summary: string;
  details: AuditDetail[];
}

// Reading details written by older code too: nothing in them is trusted to have a type.
const str = (v: unknown): string | null => (typeof v === "string" && v.trim() ? v : null);
const num = (v: unknown): number | null => (typeof v === "number" && Number.isFinite(v) ? v : null);
const strings = (v: unknown): string[] => (Array.isArray(v) ? v.filter((x): x is string => typeof x === "string") : []);
const numbers = (v: unknown): number[] => (Array.isArray(v) ? v.filter((x): x is number => typeof x === "number") : []);
const pair = (v: unknown): [string, string] | null =>
  Array.isArray(v) && v.length === 2 && v.every((x) => typeof x === "string") ? [v[0] as string, v[1] as string] : null;

const quoted = (title: string) => `'${title}'`;
/** "the tool TW-2", "the kit K-03", or "a tool" when the entry has no number. */
const toolWords = (e: { details: Record<string, unknown> }, kind: "tool" | "kit") => {
  const n = str(e.details.number);
  return n ? `the ${kind} ${n}` : `a ${kind}`;
};
const capitalised = (text: string) => text.charAt(0).toUpperCase() + text.slice(1);
const possessive = (name: string) => `${name}'s`;
const roleWord = (role: unknown) => (typeof role === "string" && role in roleLabels ? roleLabels[role as Role].toLowerCase() : null);
const withArticle = (word: string) => `${/^[aeiou]/i.test(word) ? "an" : "a"} ${word}`;

/** "A", "A and B", "A, B and C"; more than `most` become "A, B and 3 others". */
export function listWords(items: readonly string[], most = 3): string {
  if (items.length > most) return `${items.slice(0, most - 1).join(", ")} and ${items.length - most + 1} others`;
  if (items.length <= 1) return items[0] ?? "";
  return `${items.slice(0, -1).join(", ")} and ${items.at(-1)}`;
}

const plural = (n: number, one: string, many = `${one}s`) => `${n} ${n === 1 ? one : many}`;

/** "sign_off" or "reopenedSteps" → "Sign off", "Reopened steps". */
function labelOf(key: string): string {
  const words = key
    .replace(/([a-z0-9])([A-Z])/g, "$1 $2")
    .replace(/[._-]+/g, " ")
    .trim()
    .toLowerCase();
  return words ? words[0]!.toUpperCase() + words.slice(1) : "Detail";
}

/** A detail's value in words: lists joined, yes/no, nested objects as "key value" parts, never JSON. */
function valueOf(value: unknown, names: AuditNames): string {
  if (value == null || value === "") return "—";
  if (typeof value === "boolean") return value ? "yes" : "no";
  if (typeof value === "number") return String(value);
  if (typeof value === "string") return nameOfId(value, names) ?? value;
  if (Array.isArray(value)) return value.length ? value.map((v) => valueOf(v, names)).join(", ") : "none";
  if (typeof value === "object")
    return (
      Object.entries(value as Record<string, unknown>)
        .map(([k, v]) => `${labelOf(k).toLowerCase()} ${valueOf(v, names)}`)
        .join("; ") || "—"
    );
  return String(value);
}

function nameOfId(id: string, names: AuditNames): string | null {
  return (
    names.people[id] ??
    names.classes[id] ??
    names.manuals[id] ??
    names.cards[id] ??
    names.subjects[id] ??
    (names.revisions[id] ? `${names.revisions[id].manualTitle} ${names.revisions[id].label}` : null)
  );
}

/** The plain words for a kind of record: named ("the class 'X'"), and when it could not be named. */
const recordWords: Record<string, { named: (name: string) => string; unnamed: string }> = {
  user: { named: (name) => name, unnamed: "someone" },
  manual: { named: quoted, unnamed: "a manual" },
  class: { named: (name) => `the class ${quoted(name)}`, unnamed: "a class" },
  task_card: { named: (name) => `the task card ${quoted(name)}`, unnamed: "a task card" },
  subject: { named: (name) => `the curriculum subject ${quoted(name)}`, unnamed: "a curriculum subject" },
};

/** Every action the code records, worded. `subject` is the subject record in words. */
type Wording = (e: AuditEventFacts, ctx: Context) => AuditDescription;
interface Context {
  actor: string;
  names: AuditNames;
  /** The subject in words: a person's name, "'HT-20 manual'", "the class 'X'", "Jonas Weber's run of 'X' (version 3)", or "a class" when unnamed. */
  subject: string;
}

const d = (label: string, value: string | number | null | undefined): AuditDetail[] =>
  value == null || value === "" ? [] : [{ label, value: String(value) }];

const fileSize = (bytes: unknown) => (num(bytes) != null ? formatBytes(num(bytes)!) : null);

const wordings: Record<string, Wording> = {
  "account.created": (e, c) => {
    const role = roleWord(e.details.role);
    return {
      summary: `${c.actor} created ${role ? `${withArticle(role)} account` : "an account"} for ${c.subject}, with a password set`,
      details: [...d("E-mail", str(e.details.email)), ...d("Role", role)],
    };
  },
  "account.invited": (e, c) => {
    const role = roleWord(e.details.role);
    return {
      summary: `${c.actor} invited ${c.subject}${role ? ` as ${withArticle(role)}` : ""}`,
      details: [...d("E-mail", str(e.details.email)), ...d("Role", role)],
    };
  },
  "account.invitation_resent": (_e, c) => ({ summary: `${c.actor} sent ${possessive(c.subject)} invitation again`, details: [] }),
  "account.updated": (e, c) => {
    const name = pair(e.details.name);
    const role = pair(e.details.role);
    const status = pair(e.details.status);
    const details = [
      ...d("Name", name && `${name[0]} → ${name[1]}`),
      ...d("Role", role && `${roleWord(role[0]) ?? role[0]} → ${roleWord(role[1]) ?? role[1]}`),
      ...d("Status", status && `${status[0]} → ${status[1]}`),
    ];
    if (status && !name && !role && status[1] === "deactivated")
      return { summary: `${c.actor} deactivated ${possessive(c.subject)} account`, details };
    if (status && !name && !role && status[0] === "deactivated")
      return { summary: `${c.actor} reactivated ${possessive(c.subject)} account`, details };
    const what = [name && "name", role && "role", status && "status"].filter((w): w is string => !!w);
    return {
      summary: what.length
        ? `${c.actor} changed ${possessive(c.subject)} ${listWords(what)}`
        : `${c.actor} saved ${possessive(c.subject)} account without changes`,
      details,
    };
  },
  "account.password_reset_requested": (_e, c) => ({
    summary: `A password reset link was asked for ${possessive(c.subject)} account`,
    details: [],
  }),
  // The person themselves did these: the actor is the subject.
  "account.invitation_accepted": (e, c) => ({
    summary: `${e.actorName ?? capitalised(c.subject)} accepted the invitation and chose a password`,
    details: [],
  }),
  "account.password_reset": (e, c) => ({
    summary: `${e.actorName ?? capitalised(c.subject)} chose a new password with a reset link`,
    details: [],
  }),

  "manual.uploaded": (e, c) => {
    const title = str(e.details.title);
    const label = str(e.details.revision);
    return {
      summary: `${c.actor} uploaded the manual ${title ? quoted(title) : c.subject}${label ? `, ${label}` : ""}`,
      details: [...d("Revision", label), ...d("File size", fileSize(e.details.bytes))],
    };
  },
  "revision.uploaded": (e, c) => {
    const label = str(e.details.revision);
    return {
      summary: `${c.actor} uploaded ${label ?? "a new revision"} of ${c.subject}`,
      details: [...d("Revision", label), ...d("File size", fileSize(e.details.bytes))],
    };
  },
  "revision.retried": (e, c) => {
    const label = c.names.revisions[str(e.details.revisionId) ?? ""]?.label ?? null;
    return { summary: `${c.actor} asked for ${label ?? "a revision"} of ${c.subject} to be read again`, details: d("Revision", label) };
  },
  "revision.ready": (e, c) => {
    const label = str(e.details.label) ?? c.names.revisions[str(e.details.revisionId) ?? ""]?.label ?? null;
    const pages = num(e.details.pages);
    const current = e.details.current === true;
    return {
      summary: `${c.actor} finished reading ${label ?? "a revision"} of ${c.subject}${pages != null ? ` (${plural(pages, "page")})` : ""}${current ? "; it is now the current revision" : ""}`,
      details: [...d("Revision", label), ...d("Pages", pages), ...d("Current revision", current ? "yes" : "no")],
    };
  },
  "manual.kept_on_carts": (_e, c) => ({ summary: `${c.actor} had ${c.subject} kept whole on the carts`, details: [] }),
  "manual.not_kept_on_carts": (_e, c) => ({ summary: `${c.actor} stopped keeping ${c.subject} whole on the carts`, details: [] }),

  "class.created": (e, c) => {
    const name = str(e.details.name);
    return { summary: `${c.actor} created ${name ? recordWords.class!.named(name) : c.subject}`, details: [] };
  },
  "class.updated": (e, c) => {
    const details = [
      ...d("Name", str(e.details.name)),
      ...d("Description", "description" in e.details ? (str(e.details.description) ?? "(none)") : null),
      ...d("Starts", "startsOn" in e.details ? (str(e.details.startsOn) ?? "(no date)") : null),
      ...d("Ends", "endsOn" in e.details ? (str(e.details.endsOn) ?? "(no date)") : null),
    ];
    return { summary: `${c.actor} changed ${c.subject}`, details };
  },
  "class.members_added": (e, c) => {
    const people = strings(e.details.userIds).map((id) => c.names.people[id] ?? "someone no longer listed");
    return {
      summary: `${c.actor} added ${people.length ? listWords(people) : "nobody"} to ${c.subject}`,
      details: people.length > 3 ? d("Added", people.join(", ")) : [],
    };
  },
  "class.member_removed": (e, c) => ({
    summary: `${c.actor} removed ${c.names.people[str(e.details.userId) ?? ""] ?? "someone"} from ${c.subject}`,
    details: [],
  }),

  "card.created": (e, c) => {
    const title = str(e.details.title);
    return { summary: `${c.actor} created ${title ? recordWords.task_card!.named(title) : c.subject}`, details: [] };
  },
  "card.published": (e, c) => {
    const version = num(e.details.version);
    const title = str(e.details.title);
    return {
      summary: `${c.actor} published ${version != null ? `version ${version}` : "a version"} of ${title ? recordWords.task_card!.named(title) : c.subject}`,
      details: [],
    };
  },
  "card.draft_discarded": (_e, c) => ({ summary: `${c.actor} discarded the draft of ${c.subject}`, details: [] }),
  "card.duplicated": (e, c) => {
    const from = c.names.cards[str(e.details.from) ?? ""];
    const title = str(e.details.title);
    return {
      summary: `${c.actor} duplicated ${from ? recordWords.task_card!.named(from) : "a task card"} as ${title ? quoted(title) : c.subject}`,
      details: [],
    };
  },
  "card.archived": (_e, c) => ({ summary: `${c.actor} archived ${c.subject}`, details: [] }),
  "card.restored": (_e, c) => ({ summary: `${c.actor} brought ${c.subject} back from the archive`, details: [] }),
  "card.coauthors_set": (e, c) => {
    const people = strings(e.details.coauthors).map((id) => c.names.people[id] ?? "someone no longer listed");
    return {
      summary: people.length
        ? `${c.actor} made ${listWords(people)} co-author${people.length === 1 ? "" : "s"} of ${c.subject}`
        : `${c.actor} left ${c.subject} without co-authors`,
      details: people.length > 3 ? d("Co-authors", people.join(", ")) : [],
    };
  },
  "card.rechecked": (e, c) => {
    const n = num(e.details.decisions);
    return {
      summary: `${c.actor} rechecked the cited pages of ${c.subject}${n != null ? ` (${plural(n, "decision")})` : ""}`,
      details: [],
    };
  },
  "subject.created": (e, c) => {
    const name = str(e.details.name);
    return { summary: `${c.actor} added ${name ? recordWords.subject!.named(name) : c.subject}`, details: [] };
  },
  "subject.renamed": (e, c) => {
    const name = str(e.details.name);
    return { summary: `${c.actor} renamed a curriculum subject${name ? ` to ${quoted(name)}` : ""}`, details: [] };
  },

  "assignment.created": (e, c) => {
    const title = str(e.details.title);
    const version = num(e.details.version);
    const className = c.names.classes[str(e.details.classId) ?? ""];
    const students = num(e.details.students);
    const card = `${title ? quoted(title) : "a task card"}${version != null ? ` (version ${version})` : ""}`;
    const to = className ? `the class ${quoted(className)}` : students != null ? plural(students, "student") : "students";
    return {
      summary: `${c.actor} assigned ${card} to ${to}`,
      details: [...d("Students", students), ...d("Due", str(e.details.dueOn) ?? "no due date")],
    };
  },

  "assignment.changed": (e, c) => {
    const change = (v: unknown) => (v && typeof v === "object" ? (v as { from?: unknown; to?: unknown }) : {});
    const due = change(e.details.dueOn);
    const note = change(e.details.note);
    const lines = [
      ...(due.from !== due.to ? d("Due", `${str(due.from) ?? "no due date"} → ${str(due.to) ?? "no due date"}`) : []),
      ...(note.from !== note.to ? d("Aircraft or station", `${str(note.from) ?? "none"} → ${str(note.to) ?? "none"}`) : []),
    ];
    return { summary: `${c.actor} changed ${c.subject}`, details: lines };
  },
  "assignment.withdrawn": (e, c) => {
    const counts = e.details.runs && typeof e.details.runs === "object" ? (e.details.runs as Record<string, unknown>) : {};
    const signed = num(counts.signed_off) ?? 0;
    const all = Object.values(counts).reduce<number>((n, v) => n + (num(v) ?? 0), 0);
    return {
      summary: `${c.actor} withdrew ${c.subject}`,
      details: [
        ...d("Why", str(e.details.reason)),
        ...d("Runs", all ? `${all - signed} taken off the students' work, ${signed} signed off kept` : null),
      ],
    };
  },
  "manual.changed": (e, c) => {
    const labels: Record<string, string> = {
      title: "Title",
      documentType: "Document type",
      applicability: "Applies to",
      ataChapters: "ATA chapters",
    };
    const shown = (v: unknown) => (Array.isArray(v) ? strings(v).join(", ") || "none" : (str(v) ?? "none"));
    return {
      summary: `${c.actor} corrected the details of ${c.subject}`,
      details: Object.entries(e.details)
        .filter(([k, v]) => labels[k] && v && typeof v === "object" && !Array.isArray(v))
        .flatMap(([k, v]) => d(labels[k]!, `${shown((v as { from?: unknown }).from)} → ${shown((v as { to?: unknown }).to)}`)),
    };
  },
  "manual.withdrawn": (e, c) => ({
    summary: `${c.actor} withdrew ${c.subject} from the library`,
    details: d("Why", str(e.details.reason)),
  }),
  "manual.restored": (_e, c) => ({ summary: `${c.actor} restored ${c.subject} to the library`, details: [] }),

  "session.created": (e, c) => ({
    summary: `${c.actor} planned a session for ${c.subject}`,
    details: d("Subject", str(e.details.subject)),
  }),
  "session.closed": (e, c) => ({
    summary: `${c.actor} closed a session's register for ${c.subject}`,
    details: d("Subject", str(e.details.subject)),
  }),
  "attendance.recorded": (e, c) => ({
    summary: `${c.actor} took attendance for ${c.subject}`,
    details: [...d("Subject", str(e.details.subject)), ...d("Entries", num(e.details.entries))],
  }),
  "attendance.corrected": (e, c) => ({
    summary: `${c.actor} corrected a closed register of ${c.subject}`,
    details: [...d("Subject", str(e.details.subject)), ...d("Entries", num(e.details.entries)), ...d("Why", str(e.details.reason))],
  }),
  "standard.imported": (e, c) => ({
    summary: `${c.actor} imported the certification standard's elements`,
    details: [
      ...d("New", num(e.details.imported)),
      ...d("Words updated", num(e.details.updated)),
      ...d("Rows refused", num(e.details.refused)),
    ],
  }),
  "settings.updated": (e, c) => {
    const zone = str(e.details.timeZone);
    const planned =
      e.details.plannedHours && typeof e.details.plannedHours === "object" ? (e.details.plannedHours as Record<string, unknown>) : null;
    const hours = planned
      ? Object.entries(planned)
          .map(([section, h]) => `${section} ${num(h) ?? "no plan"}`)
          .join(", ")
      : null;
    return {
      summary: zone
        ? `${c.actor} set the school's time zone to ${zone}`
        : hours
          ? `${c.actor} changed the school's planned hours`
          : `${c.actor} changed the school's settings`,
      details: [...d("Time zone", zone), ...d("Planned hours", hours)],
    };
  },

  "asset.created": (e, c) => ({
    summary: `${c.actor} added ${str(e.details.identifier) ?? "an asset"} to the fleet`,
    details: [...d("Kind", str(e.details.kind)), ...d("Model", str(e.details.model))],
  }),
  "asset.updated": (e, c) => ({ summary: `${c.actor} changed the details of ${str(e.details.identifier) ?? "an asset"}`, details: [] }),
  "asset.status_changed": (e, c) => ({
    summary: `${c.actor} set ${str(e.details.identifier) ?? "an asset"} to ${(assetStatusWords as Record<string, string>)[str(e.details.to) ?? ""]?.toLowerCase() ?? "another status"}`,
    details: d("Why", str(e.details.reason)),
  }),
  "asset.installed": (e, c) => ({
    summary: `${c.actor} recorded ${str(e.details.identifier) ?? "an asset"} installed on ${str(e.details.parent) ?? "another asset"} (from a signed-off run)`,
    details: [],
  }),
  "asset.removed": (e, c) => ({
    summary: `${c.actor} recorded ${str(e.details.identifier) ?? "an asset"} removed from ${str(e.details.parent) ?? "another asset"} (from a signed-off run)`,
    details: [],
  }),
  "place.created": (e, c) => ({ summary: `${c.actor} added ${str(e.details.name) ?? "a place"} to the hangar plan`, details: [] }),
  "booking.created": (e, c) => ({
    summary: `${c.actor} booked ${str(e.details.asset) ?? "an asset"} in ${str(e.details.place) ?? "a place"}`,
    details: [...d("From", str(e.details.startsAt)), ...d("To", str(e.details.endsAt))],
  }),
  "booking.changed": (e, c) => ({
    summary: `${c.actor} moved the booking of ${str(e.details.asset) ?? "an asset"}`,
    details: [...d("Was", str(e.details.from)), ...d("Now", str(e.details.to))],
  }),
  "booking.cancelled": (e, c) => ({
    summary: `${c.actor} cancelled the booking of ${str(e.details.asset) ?? "an asset"}`,
    details: [...d("Was", str(e.details.from)), ...d("Why", str(e.details.reason))],
  }),
  "finding.filed": (e, c) => ({
    summary: `${c.actor} wrote up a finding on ${str(e.details.asset) ?? "an asset"}`,
    details: d("Found", str(e.details.text)),
  }),
  "finding.closed": (e, c) => ({
    summary: `${c.actor} closed a finding on ${str(e.details.asset) ?? "an asset"}: ${(findingDecisionWords as Record<string, string>)[str(e.details.decision) ?? ""]?.toLowerCase() ?? "decided"}`,
    details: d("Note", str(e.details.note)),
  }),
  "tool.created": (e, c) => ({ summary: `${c.actor} added ${toolWords(e, "tool")} to the tool room`, details: [] }),
  "tool.changed": (e, c) => ({ summary: `${c.actor} changed the details of ${toolWords(e, "tool")}`, details: [] }),
  "tool.out_of_service": (e, c) => ({
    summary: `${c.actor} took ${toolWords(e, "tool")} out of service`,
    details: d("Why", str(e.details.reason)),
  }),
  "tool.in_service": (e, c) => ({ summary: `${c.actor} put ${toolWords(e, "tool")} back in service`, details: [] }),
  "tool.calibrated": (e, c) => ({
    summary: `${c.actor} recorded a calibration of ${toolWords(e, "tool")}`,
    details: [
      ...d("Calibrated on", str(e.details.calibratedOn)),
      ...d("Certificate", str(e.details.certificate)),
      ...d("Next due", str(e.details.nextDueOn)),
    ],
  }),
  "kit.created": (e, c) => ({ summary: `${c.actor} added ${toolWords(e, "kit")} to the tool room`, details: [] }),
  "tool.checked_out": (e, c) => {
    const student = c.names.people[str(e.details.studentId) ?? ""] ?? "a student";
    return { summary: `${c.actor} lent tools to ${student}`, details: d("Tools", strings(e.details.tools).join(", ")) };
  },
  "tool.checked_in": (e, c) => {
    const student = c.names.people[str(e.details.studentId) ?? ""] ?? "a student";
    return { summary: `${c.actor} counted back in every tool lent to ${student}`, details: [] };
  },
  "tool.missing": (e, c) => {
    const student = c.names.people[str(e.details.studentId) ?? ""] ?? "a student";
    const missing = strings(e.details.missing);
    return {
      summary: `${c.actor} counted in the tools lent to ${student}: ${plural(missing.length, "tool")} missing`,
      details: d("Missing", missing.join(", ")),
    };
  },
  "tool.hold_cleared": (e, c) => {
    const student = c.names.people[str(e.details.studentId) ?? ""] ?? "a student";
    const lost = str(e.details.outcome) === "lost";
    return {
      summary: `${c.actor} cleared a missing-tool hold on ${possessive(student)} work: the tool was ${lost ? "lost" : "found"}`,
      details: d("Note", str(e.details.note)),
    };
  },

  "run.bought_off": (e, c) => {
    const stepId = str(e.details.stepId);
    const index = stepId ? (c.names.runs[e.subjectId ?? ""]?.stepIds.indexOf(stepId) ?? -1) : -1;
    return { summary: `${c.actor} bought off ${index >= 0 ? `step ${index + 1}` : "an inspection point"} of ${c.subject}`, details: [] };
  },
  "run.returned": (e, c) => {
    const steps = numbers(e.details.reopenedSteps);
    return {
      summary: `${c.actor} sent ${c.subject} back for rework`,
      details: [...d("Comment", str(e.details.comment)), ...d("Steps to do again", steps.length ? steps.join(", ") : null)],
    };
  },
  "run.signed_off": (e, c) => ({
    summary: `${c.actor} signed off ${c.subject}`,
    details: d("Manual revisions cited", strings(e.details.revisions).join("; ") || "none"),
  }),
  "run.moved": (e, c) => {
    const from = num(e.details.fromVersion);
    const to = num(e.details.toVersion);
    const restarted = numbers(e.details.restartedSteps);
    const student = c.names.runs[e.subjectId ?? ""];
    const whose = student ? `${possessive(student.studentName)} run of ${quoted(student.title)}` : "a run";
    return {
      summary: `${c.actor} moved ${whose}${from != null ? ` from version ${from}` : ""}${to != null ? ` to version ${to}` : ""}`,
      details: d("Steps to do again", restarted.length ? restarted.join(", ") : "none"),
    };
  },
};

/** The actions worded above: what the code records (a unit test checks the code against it). */
export const describedActions: readonly string[] = Object.keys(wordings);

function subjectWords(e: AuditEventFacts, names: AuditNames): string {
  if (e.subjectType === "run") return runWords(e, names);
  if (e.subjectType === "assignment") return "an assignment";
  const byKind: Record<string, Readonly<Record<string, string>>> = {
    user: names.people,
    manual: names.manuals,
    class: names.classes,
    task_card: names.cards,
    subject: names.subjects,
  };
  const words = recordWords[e.subjectType];
  if (!words) return "a record";
  const name = byKind[e.subjectType]?.[e.subjectId ?? ""];
  return name ? words.named(name) : words.unnamed;
}

/** "Jonas Weber's run of 'Wheel bearing inspection' (version 3)". */
function runWords(e: AuditEventFacts, names: AuditNames): string {
  const run = names.runs[e.subjectId ?? ""];
  // A sign-off's details name the card and version it was signed on; a run moved since is on another.
  const title = str(e.details.title) ?? run?.title;
  const version = str(e.details.title) ? num(e.details.version) : (run?.version ?? null);
  const student = run?.studentName ?? names.people[str(e.details.studentId) ?? ""];
  const whose = student ? `${possessive(student)} run` : "a run";
  return title ? `${whose} of ${quoted(title)}${version != null ? ` (version ${version})` : ""}` : whose;
}

/** An action code in words for an action nobody worded yet: "card.made_public" → "made public". */
function actionWords(action: string): string {
  const verb = action.split(".").slice(1).join(" ").replace(/_/g, " ").trim();
  return verb || "changed";
}

/** Who did what to which record, and the details behind it, in words. */
export function describeAuditEvent(e: AuditEventFacts, names: AuditNames = noNames): AuditDescription {
  const actor = e.actorName ?? (e.action === "revision.ready" ? "Hangarleaf" : "Someone");
  const ctx: Context = { actor, names, subject: subjectWords(e, names) };
  const wording = wordings[e.action];
  if (wording) return wording(e, ctx);
  const details = Object.entries(e.details).map(([key, value]) => ({ label: labelOf(key), value: valueOf(value, names) }));
  return { summary: `${actor}: ${actionWords(e.action)} (${ctx.subject})`, details };
}
