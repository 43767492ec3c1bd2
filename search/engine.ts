// The one search interface. The PostgreSQL engine (search/postgres.ts) is the default and needs
// nothing extra; the Meilisearch engine (search/meilisearch.ts) is chosen with MEILI_URL.
import type { SearchFilters, SearchResult } from "@/lib/contracts/search";
import type { ParsedQuery } from "./query";

export type { SearchFilters, SearchHit, SearchResult } from "@/lib/contracts/search";

export interface SearchEngine {
  readonly name: "postgres" | "meilisearch";
  /** Makes a ready revision's pages findable (called once its ingest is done). */
  indexRevision(revisionId: string): Promise<void>;
  /** Forgets a revision's pages. */
  removeRevision(revisionId: string): Promise<void>;
  /** Tells the engine which revision of a manual is now current. */
  setCurrentRevision(manualId: string, revisionId: string): Promise<void>;
  search(query: ParsedQuery, filters: SearchFilters, page: { limit: number; offset: number }): Promise<SearchResult>;
}

/** Matches are counted up to this many; past it the answer is "more than". */
export const totalLimit = 200;
