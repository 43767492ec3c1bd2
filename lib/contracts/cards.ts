// JSON shapes of task cards shared by the API and the client components.
import type { CalculatorSlug } from "@/lib/domain/calc";
import type { Measurement, NoticeKind } from "@/lib/domain/validation/cards";

export interface ReferenceDto {
  manualId: string;
  manualTitle: string;
  revisionId: string;
  revisionLabel: string;
  /** False when a newer revision of the manual is current: the card cites superseded data. */
  current: boolean;
  page: number;
  quote: string;
}

export interface StepDto {
  id: string;
  text: string;
  notices: { kind: NoticeKind; text: string }[];
  references: ReferenceDto[];
  measurement: Measurement | null;
  calculator: CalculatorSlug | null;
  inspectionPoint: boolean;
  /** Codes of the certification standard's elements the step shows. */
  elements: string[];
  /** The reading is taken with a precision tool within calibration, named by its tool-room number. */
  calibratedTool: boolean;
  timerMinutes: number | null;
  /** A newer revision changed, moved or removed a page this step cites, and nobody rechecked it yet. */
  underRecheck: boolean;
}

export interface CardVersionDto {
  id: string;
  cardId: string;
  number: number;
  status: "draft" | "published";
  title: string;
  applicability: string[];
  ataChapter: string;
  subjectId: string | null;
  subjectName: string | null;
  estimatedMinutes: number | null;
  tools: string[];
  consumables: string[];
  protectiveEquipment: string[];
  steps: StepDto[];
  /** What a draft still needs before it can be published (always [] for a published version). */
  problems: { field: string; message: string }[];
  editCount: number;
  publishedAt: string | null;
  publishedByName: string | null;
  updatedAt: string;
}

export interface CardDto {
  id: string;
  ownerId: string | null;
  ownerName: string | null;
  /** Who else may edit, publish and archive it (authors see this; students get []). */
  coauthors: { id: string; name: string }[];
  /** Whether the one asking may change it: owner, co-author or admin. */
  canEdit: boolean;
  archivedAt: string | null;
  /** Citations a new revision touched that wait for the author's recheck. */
  openRechecks: number;
  versions: { number: number; status: "draft" | "published"; publishedAt: string | null; updatedAt: string }[];
  /** The open draft (authors only), and the newest published version. */
  draft: CardVersionDto | null;
  published: CardVersionDto | null;
}

export type CardListStatus = "draft" | "published" | "archived";

export interface CardSummaryDto {
  id: string;
  title: string;
  status: CardListStatus;
  /** A published card with an open draft says so in the list. */
  hasDraft: boolean;
  latestNumber: number;
  publishedNumber: number | null;
  subjectId: string | null;
  subjectName: string | null;
  ataChapter: string;
  applicability: string[];
  ownerName: string | null;
  stepCount: number;
  openRechecks: number;
  updatedAt: string;
}

export interface SubjectDto {
  id: string;
  name: string;
}

/** A citation a new revision touched, with its old page and the suggested new one. */
export interface RecheckDto {
  id: string;
  stepId: string;
  stepNumber: number;
  stepText: string;
  status: "changed" | "moved" | "removed";
  manualId: string;
  manualTitle: string;
  old: { revisionId: string; label: string; page: number; text: string };
  suggested: { revisionId: string; label: string; page: number | null; similarity: number; text: string | null; pageCount: number | null };
}

/** A card of 100 long steps is larger than the 64 KiB other bodies get. */
export const cardBodyLimit = 512 * 1024;
