import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import type { ApiTokenDto, CreateApiToken, CreatedApiTokenDto } from "@shared/schemas/apiTokens";
import { apiFetch } from "./client";
import { queryKeys } from "./queryKeys";

export function useApiTokens() {
  return useQuery({ queryKey: queryKeys.apiTokens, queryFn: ({ signal }) => apiFetch<{ data: ApiTokenDto[] }>("/tokens", { signal }).then((r) => r.data) });
}

/** The answer carries the secret, shown once; it is never put in the query cache. */
export function useCreateApiToken() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: CreateApiToken) => apiFetch<CreatedApiTokenDto>("/tokens", { method: "POST", body }),
    onSuccess: () => qc.invalidateQueries({ queryKey: queryKeys.apiTokens }),
  });
}

export function useRevokeApiToken() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (tokenId: string) => apiFetch<ApiTokenDto>(`/tokens/${tokenId}`, { method: "DELETE" }),
    onSuccess: () => qc.invalidateQueries({ queryKey: queryKeys.apiTokens }),
  });
}
