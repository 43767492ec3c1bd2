// What a search answers, as the API sends it and the search screen reads it.
export interface SearchFilters {
  manualId?: string;
  documentType?: string;
  model?: string;
  ata?: string;
  /** One revision, current or not. */
  revisionId?: string;
  /** Also pages of superseded (ready) revisions. */
  includeSuperseded?: boolean;
}

export interface SearchHit {
  manualId: string;
  revisionId: string;
  manualTitle: string;
  revisionLabel: string;
  current: boolean;
  page: number;
  /** HTML-escaped text with the matched words in <mark>. */
  snippet: string;
  score: number;
}

export interface SearchResult {
  hits: SearchHit[];
  /** Matches counted up to `totalLimit`; `totalCapped` when there are more. */
  total: number;
  totalCapped: boolean;
}
