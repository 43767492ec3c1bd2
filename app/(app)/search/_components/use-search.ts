"use client";

import { keepPreviousData, useQuery } from "@tanstack/react-query";
import { call } from "@/lib/client/api";
import type { SearchHit, SearchResult } from "@/lib/contracts/search";
import { libraryApi } from "@/lib/contracts/endpoints/library";

export type SearchHitDto = SearchHit;
export type SearchResponseDto = SearchResult & { tookMs: number };

export type SearchInput = { q: string; manual?: string; type?: string; model?: string; ata?: string };

/** Results for a query; the previous results stay on screen while the next ones load. */
export function useSearch(input: SearchInput) {
  return useQuery({
    queryKey: ["search", input],
    queryFn: () => call(libraryApi.search, { query: { ...input, limit: 30 } }),
    enabled: input.q.trim().length > 0,
    placeholderData: keepPreviousData,
    staleTime: 60_000,
  });
}
