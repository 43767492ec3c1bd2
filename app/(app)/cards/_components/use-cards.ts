"use client";

import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { call } from "@/lib/client/api";
import type { CardListStatus, CardSummaryDto, SubjectDto } from "@/lib/contracts/cards";
import type { CardContentInput } from "@/lib/domain/validation/cards";
import { cardsApi } from "@/lib/contracts/endpoints/cards";

// Every read and write of task cards from the browser goes through these hooks, under one key.
export const cardsKey = ["cards"] as const;

export function useCardList(status: CardListStatus | "", initialData?: CardSummaryDto[]) {
  return useQuery({
    queryKey: [...cardsKey, "list", status],
    queryFn: async () => (await call(cardsApi.list, { query: { status } })).cards,
    initialData: status === "" ? initialData : undefined,
  });
}

export function useCard(id: string | null) {
  return useQuery({
    queryKey: [...cardsKey, "card", id],
    queryFn: async () => (await call(cardsApi.get, { params: { id: id! } })).card,
    enabled: !!id,
  });
}

export function useCreateCard() {
  const client = useQueryClient();
  return useMutation({
    mutationFn: async (content: CardContentInput) => (await call(cardsApi.create, { body: { content } })).card,
    onSuccess: () => client.invalidateQueries({ queryKey: cardsKey }),
  });
}

export function useSaveDraft(cardId: string) {
  return useMutation({
    mutationFn: async ({ content, editCount }: { content: CardContentInput; editCount: number }) =>
      (await call(cardsApi.saveDraft, { params: { id: cardId }, body: { content, editCount } })).version,
  });
}

export function useCardAction(cardId: string) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: async (action: "publish" | "duplicate" | "archive" | "restore" | "discard") => {
      if (action === "publish") return call(cardsApi.publish, { params: { id: cardId } });
      if (action === "duplicate") return call(cardsApi.duplicate, { params: { id: cardId } });
      if (action === "discard") return call(cardsApi.discardDraft, { params: { id: cardId } });
      return call(cardsApi.archive, { params: { id: cardId }, body: { archived: action === "archive" } });
    },
    onSuccess: () => client.invalidateQueries({ queryKey: cardsKey }),
  });
}

export function useCitePage(cardId: string) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: async (input: { stepId: string; revisionId: string; page: number; quote: string }) =>
      (await call(cardsApi.citePage, { params: { id: cardId }, body: input })).citation,
    onSuccess: () => client.invalidateQueries({ queryKey: [...cardsKey, "card", cardId] }),
  });
}

export function useSubjects(initialData: SubjectDto[]) {
  return useQuery({
    queryKey: ["subjects"],
    queryFn: async () => (await call(cardsApi.listSubjects)).subjects,
    initialData,
  });
}

export function useSaveSubject() {
  const client = useQueryClient();
  return useMutation({
    mutationFn: async ({ id, name }: { id?: string; name: string }) =>
      (await (id ? call(cardsApi.renameSubject, { params: { id }, body: { name } }) : call(cardsApi.createSubject, { body: { name } })))
        .subject,
    onSuccess: () => client.invalidateQueries({ queryKey: ["subjects"] }),
  });
}

export function useSetCoauthors(cardId: string) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: async (userIds: string[]) => (await call(cardsApi.setCoauthors, { params: { id: cardId }, body: { userIds } })).coauthors,
    onSuccess: () => client.invalidateQueries({ queryKey: cardsKey }),
  });
}
