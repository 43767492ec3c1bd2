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
