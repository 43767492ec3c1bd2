"use client";

import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { callApi } from "@/lib/client/api";
import type { CardDto, CardListStatus, CardSummaryDto, CardVersionDto, SubjectDto } from "@/lib/contracts/cards";
import type { CardContentInput } from "@/lib/domain/validation/cards";

// Every read and write of task cards from the browser goes through these hooks, under one key.
export const cardsKey = ["cards"] as const;

export function useCardList(status: CardListStatus | "", initialData?: CardSummaryDto[]) {
  return useQuery({
    queryKey: [...cardsKey, "list", status],
    queryFn: async () => (await callApi<{ cards: CardSummaryDto[] }>("GET", `/api/cards${status ? `?status=${status}` : ""}`)).cards,
    initialData: status === "" ? initialData : undefined,
  });
}

export function useCard(id: string | null) {
  return useQuery({
    queryKey: [...cardsKey, "card", id],
    queryFn: async () => (await callApi<{ card: CardDto }>("GET", `/api/cards/${id}`)).card,
    enabled: !!id,
  });
}

export function useCreateCard() {
  const client = useQueryClient();
  return useMutation({
    mutationFn: async (content: CardContentInput) => (await callApi<{ card: CardDto }>("POST", "/api/cards", { content })).card,
    onSuccess: () => client.invalidateQueries({ queryKey: cardsKey }),
  });
}

export function useSaveDraft(cardId: string) {
  return useMutation({
    mutationFn: async ({ content, editCount }: { content: CardContentInput; editCount: number }) =>
      (await callApi<{ version: CardVersionDto }>("PUT", `/api/cards/${cardId}/draft`, { content, editCount })).version,
  });
}

export function useCardAction(cardId: string) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: async (action: "publish" | "duplicate" | "archive" | "restore" | "discard") => {
      if (action === "publish") return callApi<{ version: CardVersionDto }>("POST", `/api/cards/${cardId}/publish`);
      if (action === "duplicate") return callApi<{ card: CardDto }>("POST", `/api/cards/${cardId}/duplicate`);
      if (action === "discard") return callApi<null>("DELETE", `/api/cards/${cardId}/draft`);
      return callApi<{ card: CardDto }>("POST", `/api/cards/${cardId}/archive`, { archived: action === "archive" });
    },
    onSuccess: () => client.invalidateQueries({ queryKey: cardsKey }),
  });
}

export function useCitePage(cardId: string) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: async (input: { stepId: string; revisionId: string; page: number; quote: string }) =>
      (await callApi<{ citation: { versionNumber: number; stepNumber: number; added: boolean } }>("POST", `/api/cards/${cardId}/draft/citations`, input)).citation,
    onSuccess: () => client.invalidateQueries({ queryKey: [...cardsKey, "card", cardId] }),
  });
}

export function useSubjects(initialData: SubjectDto[]) {
  return useQuery({
    queryKey: ["subjects"],
    queryFn: async () => (await callApi<{ subjects: SubjectDto[] }>("GET", "/api/subjects")).subjects,
    initialData,
  });
}

export function useSaveSubject() {
  const client = useQueryClient();
  return useMutation({
    mutationFn: async ({ id, name }: { id?: string; name: string }) =>
      (await callApi<{ subject: SubjectDto }>(id ? "PATCH" : "POST", id ? `/api/subjects/${id}` : "/api/subjects", { name })).subject,
    onSuccess: () => client.invalidateQueries({ queryKey: ["subjects"] }),
  });
}

export function useSetCoauthors(cardId: string) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: async (userIds: string[]) => (await callApi<{ coauthors: { id: string; name: string }[] }>("PUT", `/api/cards/${cardId}/coauthors`, { userIds })).coauthors,
    onSuccess: () => client.invalidateQueries({ queryKey: cardsKey }),
  });
}
