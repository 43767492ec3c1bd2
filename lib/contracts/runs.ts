// JSON shapes of assignments, runs and records shared by the API, the cart and the review screens.
import type { CardVersionDto } from "@/lib/contracts/cards";
import type { RunEvent, RunStatus } from "@/lib/domain/runs/fold";
import type { MeasuredValue } from "@/lib/domain/runs/measured";
import type { RunToolsDto } from "@/lib/contracts/tools";

/** What "my work" shows: the run's status, and overdue when the due date passed before submitting. */
export type WorkStatus = RunStatus | "overdue";

export interface WorkItemDto {
  runId: string;
  assignmentId: string;
  cardId: string;
  title: string;
  versionNumber: number;
  /** A newer published version exists; the run keeps the one it was assigned. */
  newerVersion: number | null;
  subjectName: string | null;
  ataChapter: string;
  dueOn: string | null;
  note: string;
  status: RunStatus;
  workStatus: WorkStatus;
  studentId: string;
  studentName: string;
  lastEventAt: string | null;
  estimatedMinutes: number | null;
}

/** An open run on an older version of its card, and what moving it to the newest version does. */
export interface RunToMoveDto {
  runId: string;
  studentName: string;
  status: RunStatus;
  versionNumber: number;
  dueOn: string | null;
  note: string;
  /** Step numbers in the new version that changed: done again. */
  restartSteps: number[];
  /** Step numbers only the new version has. */
  addedSteps: number[];
  /** How many steps of the old version the new one no longer has. */
  removedSteps: number;
  /** How many steps keep their work. */
  keptSteps: number;
}

/** An inspection point done on a cart and waiting for the instructor's buy-off. */
export interface BuyOffCallDto {
  runId: string;
  studentName: string;
  title: string;
  versionNumber: number;
  /** The assignment's note: often where the aircraft stands. */
  note: string;
  stepId: string;
  stepNumber: number;
  /** When the student called the instructor from the cart; null when done but not called. */
  calledAt: string | null;
  lastEventAt: string | null;
}

/** A cited page as the cart stores it: where it is in the offline packet, and its text for search. */
export interface PacketPageDto {
  manualId: string;
  manualTitle: string;
  revisionId: string;
  revisionLabel: string;
  page: number;
  /** 1-based page of the offline packet PDF. */
  packetPage: number;
  text: string;
}

export interface PhotoDto {
  id: string;
  stepId: string | null;
  contentType: string;
  bytes: number;
}

export interface SignOffDto {
  instructorName: string;
  signedAt: string;
  versionNumber: number;
  revisionsCited: { revisionId: string; manualTitle: string; label: string; pages: number[] }[];
  actualMinutes: number;
  comment: string;
}

export interface RunDetailDto {
  run: WorkItemDto;
  version: CardVersionDto;
  /** In the fold's order; `serverTime` is null for an event the cart has sent but not refreshed since. */
  events: (RunEvent & { userName: string })[];
  /** Ids of the users whose buy-offs, returns and sign-offs count (instructors and admins). */
  reviewers: string[];
  photos: PhotoDto[];
  signOff: SignOffDto | null;
  packet: { url: string; pages: PacketPageDto[] } | null;
  /** Revisions of manuals a librarian marked "keep on carts": carts store the whole file. */
  keepOnCarts: { revisionId: string; manualTitle: string; url: string }[];
  /** The school's time zone: the cart tells times in it, offline too. */
  timeZone: string;
  /** The tools the student has out, the card's tool lines against them, and missing-tool holds on the run. */
  tools: RunToolsDto;
}

export interface EventBatchResultDto {
  stored: number;
  duplicates: number;
  status: RunStatus;
}

export interface AssignmentDto {
  id: string;
  cardId: string;
  title: string;
  versionNumber: number;
  className: string | null;
  dueOn: string | null;
  note: string;
  assignedByName: string | null;
  createdAt: string;
  counts: Record<RunStatus, number>;
  /** Withdrawn assignments leave the students' work; signed-off runs stay in the records. */
  withdrawnAt: string | null;
  withdrawReason: string;
}

/** One assignment with its students, for editing it and for saying what withdrawing it does. */
export interface AssignmentDetailDto extends AssignmentDto {
  students: { runId: string; studentId: string; name: string; status: RunStatus }[];
}

export interface StudentRecordDto {
  student: { id: string; name: string; email: string };
  subjects: {
    subjectName: string;
    signedOff: {
      runId: string;
      title: string;
      versionNumber: number;
      signedAt: string;
      instructorName: string;
      estimatedMinutes: number | null;
      actualMinutes: number;
      /** As the sign-off recorded them: the manual revisions the version cited, with the pages. */
      revisionsCited: SignOffDto["revisionsCited"];
      /** Each measured step of the version with the reading that counts, folded from the run's events. */
      measured: MeasuredValue[];
    }[];
  }[];
  open: WorkItemDto[];
  returned: WorkItemDto[];
  totals: { signedOff: number; estimatedMinutes: number; actualMinutes: number };
}

export interface ClassRecordDto {
  class: { id: string; name: string };
  subjects: string[];
  students: { id: string; name: string; bySubject: Record<string, { signedOff: number; assigned: number }>; overdue: number }[];
}
