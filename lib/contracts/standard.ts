// JSON shapes of the certification standard and a student's coverage of it.
import type { CoverageStatus, ElementKind } from "@/lib/domain/standard/elements";

export interface ElementDto {
  code: string;
  kind: ElementKind;
  title: string;
  section: string;
  area: string;
}

export interface CoverageDto {
  student: { id: string; name: string };
  excerpt: boolean;
  elements: (ElementDto & {
    status: CoverageStatus;
    runId: string | null;
    run: { title: string; versionNumber: number; signedAt: string | null; instructorName: string | null; revisions: string[] } | null;
  })[];
  totals: Record<string, Record<ElementKind, Record<CoverageStatus, number>>>;
}

export interface ClassCoverageDto {
  class: { id: string; name: string };
  excerpt: boolean;
  kind: ElementKind;
  elements: ElementDto[];
  students: {
    id: string;
    name: string;
    statuses: Record<string, CoverageStatus>;
    demonstrated: number;
    practised: number;
    missing: number;
  }[];
  /** Codes no student of the class has demonstrated. */
  gaps: string[];
}
