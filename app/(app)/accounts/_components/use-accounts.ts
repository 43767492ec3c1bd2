"use client";

import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { call } from "@/lib/client/api";
import type { AccountDto } from "@/lib/contracts/accounts";
import type { CreateAccountInput } from "@/lib/domain/validation/accounts";
import { accountsApi } from "@/lib/contracts/endpoints/accounts";

// Every read and write of accounts from the browser goes through these hooks, under one key.
export const accountsKey = ["accounts"] as const;

export function useAccounts(initialData: AccountDto[]) {
  return useQuery({
    queryKey: accountsKey,
    queryFn: async () => (await call(accountsApi.list)).users,
    initialData,
  });
}

export function useCreateAccount() {
  const client = useQueryClient();
  return useMutation({
    mutationFn: async (input: CreateAccountInput) => (await call(accountsApi.create, { body: input })).user,
    onSuccess: () => client.invalidateQueries({ queryKey: accountsKey }),
  });
}

export function useUpdateAccount() {
  const client = useQueryClient();
  return useMutation({
    mutationFn: async ({ id, ...changes }: { id: string; role?: AccountDto["role"]; status?: "active" | "deactivated" }) =>
      (await call(accountsApi.update, { params: { id }, body: changes })).user,
    onSuccess: () => client.invalidateQueries({ queryKey: accountsKey }),
  });
}

export function useResendInvitation() {
  return useMutation({
    mutationFn: async (id: string) => (await call(accountsApi.resendInvitation, { params: { id } })).user,
  });
}
