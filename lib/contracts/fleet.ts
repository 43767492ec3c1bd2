// JSON shapes of the fleet and the hangar plan.
import type { AssetKind, AssetStatus, BookingPurpose, FindingDecision, PlaceKind } from "@/lib/domain/fleet/fleet";

export interface AssetDto {
  id: string;
  identifier: string;
  kind: AssetKind;
  model: string;
  serial: string;
  status: AssetStatus;
  statusReason: string;
  location: string;
  spanMetres: number | null;
  /** What it is on now ("E-101 on N-HL01"), when installed. */
  installedOn: { id: string; identifier: string; position: string } | null;
  openFindingCount: number;
}

export interface InstallationDto {
  id: string;
  asset: { id: string; identifier: string; kind: AssetKind };
  parent: { id: string; identifier: string; kind: AssetKind };
  position: string;
  installedAt: string;
  installedByName: string | null;
  installedRun: { id: string; title: string } | null;
  removedAt: string | null;
  removedByName: string | null;
  removedRun: { id: string; title: string } | null;
}

export interface FindingDto {
  id: string;
  assetId: string;
  assetIdentifier: string;
  runId: string | null;
  runTitle: string | null;
  stepId: string | null;
  stepNumber: number | null;
  text: string;
  photoKey: string | null;
  reportedBy: string;
  reportedByName: string;
  foundAt: string;
  receivedAt: string;
  decision: FindingDecision | null;
  decisionNote: string;
  newAssignmentId: string | null;
  closedAt: string | null;
  closedByName: string | null;
}

export interface AssetDetailDto extends AssetDto {
  installed: { id: string; identifier: string; kind: AssetKind; model: string; position: string }[];
  history: InstallationDto[];
  openFindings: FindingDto[];
  /** Closed ones, newest first. */
  closedFindings: FindingDto[];
  applies: {
    manuals: { id: string; title: string; applicability: string[]; general: boolean }[];
    cards: { id: string; title: string; applicability: string[]; general: boolean }[];
  };
  work: { runId: string; title: string; versionNumber: number; studentName: string; status: string; date: string }[];
  bookings: BookingDto[];
}

export interface PlaceDto {
  id: string;
  name: string;
  kind: PlaceKind;
  takes: AssetKind[];
  maxSpanMetres: number | null;
}

export interface BookingDto {
  id: string;
  assetId: string;
  assetIdentifier: string;
  assetKind: AssetKind;
  placeId: string;
  placeName: string;
  classId: string | null;
  className: string | null;
  purpose: BookingPurpose;
  note: string;
  startsAt: string;
  endsAt: string;
  createdByName: string;
  cancelledAt: string | null;
}
