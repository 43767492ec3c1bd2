// JSON shapes of the tool room: tools, kits, check-outs and missing-tool holds.
import type { CalibrationState, HoldOutcome, ToolLineStatus, ToolStatus } from "@/lib/domain/tools/tool-room";

export interface ToolDto {
  id: string;
  number: string;
  description: string;
  kitId: string | null;
  kitNumber: string | null;
  calibrated: boolean;
  calibrationIntervalDays: number | null;
  calibrationDueOn: string | null;
  /** On the school's today. */
  calibration: CalibrationState;
  status: ToolStatus;
  outOfServiceReason: string;
  /** The open check-out it is out on (directly or in its kit), and to whom. */
  out: { checkoutId: string; userName: string; dueAt: string } | null;
}

export interface KitDto {
  id: string;
  number: string;
  name: string;
  location: string;
  tools: { id: string; number: string; description: string; status: ToolStatus }[];
  out: { checkoutId: string; userName: string; dueAt: string } | null;
}

export interface CalibrationDto {
  id: string;
  calibratedOn: string;
  calibratedBy: string;
  certificate: string;
  nextDueOn: string;
  recordedByName: string;
  createdAt: string;
}

export interface CheckoutDto {
  id: string;
  kit: { id: string; number: string; name: string } | null;
  tool: { id: string; number: string; description: string } | null;
  /** Every tool lent, as listed when lent: what is counted back in. */
  tools: { id: string; number: string; description: string }[];
  userId: string;
  userName: string;
  teamNote: string;
  runId: string | null;
  runTitle: string | null;
  dueAt: string;
  checkedOutAt: string;
  checkedOutByName: string;
  returnedAt: string | null;
  overdue: boolean;
}

export interface ToolHoldDto {
  id: string;
  checkoutId: string;
  tool: { id: string; number: string; description: string };
  userId: string;
  userName: string;
  runId: string | null;
  runTitle: string | null;
  openedAt: string;
  openedByName: string;
  clearedAt: string | null;
  clearedByName: string | null;
  outcome: HoldOutcome | null;
  note: string;
}

/** What a run's screen shows of tools: what the student has out, the card's lines checked against it, open holds. */
export interface RunToolsDto {
  checkedOut: {
    id: string;
    number: string;
    description: string;
    calibrated: boolean;
    calibrationDueOn: string | null;
    status: ToolStatus;
    kitNumber: string | null;
  }[];
  lines: { text: string; number: string | null; status: ToolLineStatus }[];
  holds: ToolHoldDto[];
}
