import { keepPreviousData, useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import type { CreateRevision, CreateRun, RunDetailDto, RunDto, RunListQuery, RunPage, UpdateRun } from "@shared/schemas/runs";
import { apiFetch } from "./client";
import { toSearch } from "./listParams";
import { queryKeys } from "./queryKeys";

export function useRuns(labId: string, query: Partial<RunListQuery> = {}, enabled = true) {
  return useQuery({
    queryKey: queryKeys.runs(labId, query),
    queryFn: ({ signal }) => apiFetch<RunPage>(`/labs/${labId}/runs${toSearch(query)}`, { signal }),
    placeholderData: keepPreviousData,
    enabled,
  });
}

export function useRun(labId: string, runId: string) {
  return useQuery({
    queryKey: queryKeys.run(labId, runId),
    queryFn: ({ signal }) => apiFetch<RunDetailDto>(`/labs/${labId}/runs/${runId}`, { signal }),
  });
}

/** Saving counts computes linear, maximum-likelihood and Monte Carlo results on the server. */
export function useCreateRun(labId: string, sessionId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: CreateRun) => apiFetch<RunDetailDto>(`/labs/${labId}/sessions/${sessionId}/runs`, { method: "POST", body }),
    onSuccess: (run) => {
      qc.setQueryData(queryKeys.run(labId, run.id), run);
      return qc.invalidateQueries({ queryKey: queryKeys.labNotebook(labId) });
    },
  });
}

/** One CSV file in our run format; the server keeps the file as an attachment. */
export function useUploadRun(labId: string, sessionId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ file, name, notes }: { file: File; name?: string; notes?: string }) => {
      const form = new FormData();
      form.append("file", file);
      if (name) form.append("name", name);
      if (notes) form.append("notes", notes);
      return apiFetch<RunDetailDto>(`/labs/${labId}/sessions/${sessionId}/runs/upload`, { method: "POST", body: form });
    },
    onSuccess: (run) => {
      qc.setQueryData(queryKeys.run(labId, run.id), run);
      return qc.invalidateQueries({ queryKey: queryKeys.labNotebook(labId) });
    },
  });
}

export function useUpdateRun(labId: string, runId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: UpdateRun) => apiFetch<RunDto>(`/labs/${labId}/runs/${runId}`, { method: "PATCH", body }),
    onSuccess: () => qc.invalidateQueries({ queryKey: queryKeys.labNotebook(labId) }),
  });
}

export function useCreateRevision(labId: string, runId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: CreateRevision) => apiFetch<RunDetailDto>(`/labs/${labId}/runs/${runId}/revisions`, { method: "POST", body }),
    onSuccess: (run) => {
      qc.setQueryData(queryKeys.run(labId, run.id), run);
      return qc.invalidateQueries({ queryKey: queryKeys.labNotebook(labId) });
    },
  });
}
