// Attendance and hours (pure): the entry that counts for a student in a session (the newest: a
// correction is a new entry, never an edit), what an entry may say against the session's length,
// and hours per section of the standard.
import { sections } from "@/lib/domain/standard/elements";

export const attendanceStatuses = ["present", "late", "absent", "excused"] as const;
export type AttendanceStatus = (typeof attendanceStatuses)[number];
export const attendanceWords: Record<AttendanceStatus, string> = { present: "Present", late: "Late", absent: "Absent", excused: "Excused" };
export const sectionNames = Object.values(sections);
export type SectionName = (typeof sectionNames)[number];

export interface EntryLike {
  userId: string;
  status: AttendanceStatus;
  minutes: number;
  recordedAt: string;
}

/** The newest entry per student: what the register says now. */
export function currentEntries<E extends EntryLike>(entries: readonly E[]): Map<string, E> {
  const out = new Map<string, E>();
  for (const e of entries) {
    const known = out.get(e.userId);
    if (!known || e.recordedAt > known.recordedAt) out.set(e.userId, e);
  }
  return out;
}

/** Why an entry cannot stand for a session of `sessionMinutes`; null when it can. */
export function entryProblem(entry: { status: AttendanceStatus; minutes: number }, sessionMinutes: number): string | null {
  if (entry.minutes > sessionMinutes) return `The session lasts ${sessionMinutes} minutes: no one attends more.`;
  if ((entry.status === "absent" || entry.status === "excused") && entry.minutes > 0)
    return "Someone absent or excused attended 0 minutes.";
  if (entry.status === "late" && entry.minutes >= sessionMinutes) return "Late means fewer minutes than the session's.";
  if (entry.status === "present" && entry.minutes === 0) return "Present for 0 minutes is absent.";
  return null;
}

/** Minutes attended per section, from each session's current entry for the student. */
export function minutesBySection(
  sessions: readonly { id: string; section: string }[],
  current: ReadonlyMap<string, { minutes: number }>,
): Record<SectionName, number> {
  const out = Object.fromEntries(sectionNames.map((s) => [s, 0])) as Record<SectionName, number>;
  for (const s of sessions) {
    const e = current.get(s.id);
    if (e && s.section in out) out[s.section as SectionName] += e.minutes;
  }
  return out;
}
