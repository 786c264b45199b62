import { keepPreviousData, useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import type { CreateSource, SourceDto, SourceListQuery, SourcePage, UpdateSource } from "@shared/schemas/sources";
import { apiFetch } from "./client";
import { toSearch } from "./listParams";
import { queryKeys } from "./queryKeys";

export function useSources(labId: string, query: Partial<SourceListQuery> = {}) {
  return useQuery({
    queryKey: queryKeys.sources(labId, query),
    queryFn: ({ signal }) => apiFetch<SourcePage>(`/labs/${labId}/sources${toSearch(query)}`, { signal }),
    placeholderData: keepPreviousData,
  });
}

export function useSource(labId: string, sourceId: string | undefined) {
  return useQuery({
    queryKey: queryKeys.source(labId, sourceId ?? ""),
    queryFn: ({ signal }) => apiFetch<SourceDto>(`/labs/${labId}/sources/${sourceId}`, { signal }),
    enabled: !!sourceId,
  });
}

export function useCreateSource(labId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: CreateSource) => apiFetch<SourceDto>(`/labs/${labId}/sources`, { method: "POST", body }),
    onSuccess: () => qc.invalidateQueries({ queryKey: queryKeys.labNotebook(labId) }),
  });
}

export function useUpdateSource(labId: string, sourceId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: UpdateSource) => apiFetch<SourceDto>(`/labs/${labId}/sources/${sourceId}`, { method: "PATCH", body }),
    onSuccess: () => qc.invalidateQueries({ queryKey: queryKeys.labNotebook(labId) }),
  });
}
