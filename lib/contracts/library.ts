import type { PageChange, PageStatus } from "@/lib/domain/revisions/compare";
// JSON shapes of the library shared by the API and the client components.
export interface RevisionStatusDto {
  id: string;
  manualId: string;
  label: string;
  date: string;
  status: "queued" | "processing" | "ready" | "failed";
  pagesDone: number;
  pageCount: number | null;
  error: string | null;
  current: boolean;
  supersededAt: string | null;
}

/** A revision compared page by page with the ready one before it. */
export interface ComparisonDto {
  revisionId: string;
  previousRevisionId: string | null;
  pages: PageChange[];
  summary: Record<PageStatus, number>;
}
