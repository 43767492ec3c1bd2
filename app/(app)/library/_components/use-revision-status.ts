"use client";

import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { call } from "@/lib/client/api";
import { libraryApi } from "@/lib/contracts/endpoints/library";

export const revisionKey = (id: string) => ["revision", id] as const;

/** Polls a revision while it is being read; stops once it is ready or failed. */
export function useRevisionStatus(id: string | null) {
  return useQuery({
    queryKey: revisionKey(id ?? "none"),
    queryFn: () => call(libraryApi.getRevision, { params: { id: id! } }),
    enabled: !!id,
    refetchInterval: (query) => {
      const status = query.state.data?.status;
      return status === "ready" || status === "failed" ? false : 1000;
    },
  });
}

export function useRetryRevision() {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (id: string) => call(libraryApi.retryRevision, { params: { id } }),
    onSuccess: (_data, id) => client.invalidateQueries({ queryKey: revisionKey(id) }),
  });
}
