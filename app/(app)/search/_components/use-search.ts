"use client";

import { keepPreviousData, useQuery } from "@tanstack/react-query";
import { callApi } from "@/lib/client/api";
import type { SearchHit, SearchResult } from "@/lib/contracts/search";

export type SearchHitDto = SearchHit;
export type SearchResponseDto = SearchResult & { tookMs: number };

export type SearchInput = { q: string; manual?: string; type?: string; model?: string; ata?: string };

/** Results for a query; the previous results stay on screen while the next ones load. */
export function useSearch(input: SearchInput) {
  const params = new URLSearchParams(Object.entries(input).filter(([, v]) => v) as [string, string][]);
  params.set("limit", "30");
  return useQuery({
    queryKey: ["search", input],
    queryFn: () => callApi<SearchResponseDto>("GET", `/api/search?${params.toString()}`),
    enabled: input.q.trim().length > 0,
    placeholderData: keepPreviousData,
    staleTime: 60_000,
  });
}
