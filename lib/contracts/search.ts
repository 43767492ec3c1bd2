// What a search answers, as the API sends it and the search screen reads it.
export interface SearchFilters {
  manualId?: string;
  documentType?: string;
  model?: string;
  /** Two digits ("05"). */
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
  /** The searched words (or "phrases") this page does not have: empty unless the answer is `partial`. */
  missing: string[];
}

/** Where an ATA code typed as a search goes: the first page of that section in one manual's revision. */
export interface SearchJump {
  /** As searched, with a two-digit chapter: "32-10-00", "05-10". */
  code: string;
  manualId: string;
  manualTitle: string;
  revisionId: string;
  revisionLabel: string;
  current: boolean;
  page: number;
  /** The page's heading as read ("32-10-00 MAIN LANDING GEAR - INSPECTION - DESCRIPTION"). */
  heading: string;
}

export interface SearchResult {
  hits: SearchHit[];
  /** Matches counted up to `totalLimit`; `totalCapped` when there are more. */
  total: number;
  totalCapped: boolean;
  /**
   * Fewer pages than asked for have every word, so the hits go on with pages that have most of
   * them (those with every word first); each hit names the words it lacks.
   */
  partial: boolean;
  /** Searched words (or "phrases") that no page in scope has. */
  missing: string[];
  /** For an ATA code among the words: that section in each manual that has it. */
  goesTo: SearchJump[];
}
