// The tool room's rules (pure): what a scanned code names, whether a precision tool is within
// calibration on the day a reading was taken, and which of a card's listed tools a student has.
import { offlineHours } from "@/lib/domain/runs/hours";
import { dayIn } from "@/lib/domain/time";

export const toolStatuses = ["in_service", "out_of_service"] as const;
export type ToolStatus = (typeof toolStatuses)[number];
export const holdOutcomes = ["found", "lost"] as const;
export type HoldOutcome = (typeof holdOutcomes)[number];

/**
 * A tool's or a kit's number: letters, a dash, digits ("T-104", "TW-2", "K-03"). It is what the
 * label's QR code holds and what a USB scanner types, so it is kept short and upper case.
 */
export const toolNumberPattern = /^[A-Z][A-Z0-9]{0,5}-\d{1,6}$/;

/**
 * What a scan or a typed code names, as a number: scanners add a newline or a prefix the label
 * printer put there, people type lower case. Null when it cannot be a number.
 */
export function readCode(scanned: string): string | null {
  const code = scanned
    .trim()
    .toUpperCase()
    .replace(/^HL[:-]?(TOOL|KIT)?[:-]?\s*/, "")
    .replace(/\s+/g, "");
  return toolNumberPattern.test(code) ? code : null;
}

/** Tools due within this many days are listed for the tool room (the 30 days). */
export const calibrationSoonDays = 30;

export type CalibrationState = "not_calibrated" | "in" | "due_soon" | "past" | "no_date";

const dayMs = 86_400_000;
const dayNumber = (day: string) => Math.round(Date.parse(`${day}T00:00:00Z`) / dayMs);

/** Whole days from `from` to `to` (both YYYY-MM-DD). */
export function daysBetween(from: string, to: string): number {
  return dayNumber(to) - dayNumber(from);
}

/** The day `days` after `day`. */
export function addDays(day: string, days: number): string {
  return new Date((dayNumber(day) + days) * dayMs).toISOString().slice(0, 10);
}

/**
 * A precision tool may be used through its due date and not after (common practice: the label
 * reads "calibration due", the last day the certificate covers). One with no date recorded yet is
 * treated as past: nothing says it was ever checked.
 */
export function calibrationState(tool: { calibrated: boolean; calibrationDueOn: string | null }, today: string): CalibrationState {
  if (!tool.calibrated) return "not_calibrated";
  if (!tool.calibrationDueOn) return "no_date";
  const left = daysBetween(today, tool.calibrationDueOn);
  if (left < 0) return "past";
  return left <= calibrationSoonDays ? "due_soon" : "in";
}

/**
 * The day a reading counts as taken, on the school's clock. The cart's stamp is believed only
 * inside what the server saw, as for working time (lib/domain/runs/hours.ts): not after its
 * receipt and not more than one offline session before it, so a cart clock set back cannot bring
 * an expired wrench back into calibration.
 */
export function readingDay(zone: string, clientTime: string, serverTime: string | Date | null): string {
  const stamp = Date.parse(clientTime);
  if (!serverTime) return dayIn(zone, new Date(Number.isFinite(stamp) ? stamp : Date.now()));
  const received = typeof serverTime === "string" ? Date.parse(serverTime) : serverTime.getTime();
  const at = Number.isFinite(stamp) ? Math.min(Math.max(stamp, received - offlineHours * 3_600_000), received) : received;
  return dayIn(zone, new Date(at));
}

export interface ToolForReading {
  number: string;
  description: string;
  calibrated: boolean;
  calibrationDueOn: string | null;
  status: ToolStatus;
}

/** Why a reading taken with this tool on `day` cannot be recorded, naming the tool; null when it can. */
export function toolRefusal(tool: ToolForReading, day: string): string | null {
  const name = `${tool.description} ${tool.number}`;
  if (tool.status === "out_of_service") return `${name} is out of service: a reading taken with it cannot be recorded. Use another one.`;
  if (!tool.calibrated) return `${name} is not a calibrated tool: this step needs one that is.`;
  if (!tool.calibrationDueOn) return `${name} has no calibration on record: a reading taken with it cannot be recorded.`;
  if (day > tool.calibrationDueOn)
    return `${name} was due for calibration on ${tool.calibrationDueOn}: a reading taken with it on ${day} cannot be recorded. Take one within calibration from the tool room.`;
  return null;
}

/** A card's tool line: free text, or starting with a tool-room number (a tool or a kit), "T-104 Torque wrench". */
export function toolLineNumber(line: string): string | null {
  const first = line.trim().split(/\s+/, 1)[0] ?? "";
  const number = first.toUpperCase().replace(/[:,;.]$/, "");
  return toolNumberPattern.test(number) ? number : null;
}

export type ToolLineStatus = "have" | "missing" | "free_text";

/**
 * For each of a card's tool lines, whether the student has it: a line naming a tool-room number
 * is "have" when that tool, or the kit it names, or the kit the tool is kept in, is checked out to
 * the student; "missing" otherwise; a line without a number is free text the tool room cannot check.
 */
export function toolLineStatuses(
  lines: readonly string[],
  held: { toolNumbers: ReadonlySet<string>; kitNumbers: ReadonlySet<string> },
): { text: string; number: string | null; status: ToolLineStatus }[] {
  return lines.map((text) => {
    const number = toolLineNumber(text);
    if (!number) return { text, number, status: "free_text" as const };
    const have = held.toolNumbers.has(number) || held.kitNumbers.has(number);
    return { text, number, status: have ? ("have" as const) : ("missing" as const) };
  });
}

/** A check-out not counted back in by its due time. */
export function isOverdue(checkout: { dueAt: string | Date; returnedAt: string | Date | null }, now: Date = new Date()): boolean {
  if (checkout.returnedAt) return false;
  const due = typeof checkout.dueAt === "string" ? Date.parse(checkout.dueAt) : checkout.dueAt.getTime();
  return due < now.getTime();
}

/** How long a check-out lasts when the desk does not say: a school day (common practice; our bound, as for offline work). */
export const defaultLoanHours = offlineHours;

/** A precision tool's calibration in the tool room's words. */
export function calibrationWords(state: CalibrationState, dueOn: string | null): string {
  switch (state) {
    case "not_calibrated":
      return "—";
    case "no_date":
      return "No calibration on record: not usable for readings";
    case "past":
      return `PAST DUE since ${dueOn}: not usable for readings`;
    case "due_soon":
      return `Due ${dueOn} (within ${calibrationSoonDays} days)`;
    case "in":
      return `Due ${dueOn}`;
  }
}
