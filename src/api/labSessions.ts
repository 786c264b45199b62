import { keepPreviousData, useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import type { CreateLabSession, LabSessionDto, LabSessionListQuery, LabSessionPage, UpdateLabSession } from "@shared/schemas/labSessions";
import type { LabHomeDto } from "@shared/schemas/labHome";
import { apiFetch } from "./client";
import { toSearch } from "./listParams";
import { queryKeys } from "./queryKeys";

export function useLabHome(labId: string) {
  return useQuery({
    queryKey: queryKeys.labHome(labId),
    queryFn: ({ signal }) => apiFetch<LabHomeDto>(`/labs/${labId}/home`, { signal }),
  });
}

export function useLabSessions(labId: string, query: Partial<LabSessionListQuery> = {}) {
  return useQuery({
    queryKey: queryKeys.labSessions(labId, query),
    queryFn: ({ signal }) => apiFetch<LabSessionPage>(`/labs/${labId}/sessions${toSearch(query)}`, { signal }),
    placeholderData: keepPreviousData,
  });
}

export function useLabSession(labId: string, sessionId: string) {
  return useQuery({
    queryKey: queryKeys.labSession(labId, sessionId),
    queryFn: ({ signal }) => apiFetch<LabSessionDto>(`/labs/${labId}/sessions/${sessionId}`, { signal }),
    enabled: !!sessionId,
  });
}

export function useCreateLabSession(labId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: CreateLabSession) => apiFetch<LabSessionDto>(`/labs/${labId}/sessions`, { method: "POST", body }),
    onSuccess: () => qc.invalidateQueries({ queryKey: queryKeys.labNotebook(labId) }),
  });
}

export function useUpdateLabSession(labId: string, sessionId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: UpdateLabSession) => apiFetch<LabSessionDto>(`/labs/${labId}/sessions/${sessionId}`, { method: "PATCH", body }),
    onSuccess: () => qc.invalidateQueries({ queryKey: queryKeys.labNotebook(labId) }),
  });
}
