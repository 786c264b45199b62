import { useEffect } from "react";
import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import type { BatchDto, BatchSummaryDto } from "@shared/schemas/batches";
import { apiFetch } from "./client";
import { queryKeys } from "./queryKeys";

/** How often a running batch is asked for its progress. */
const POLL_MS = 1000;

export function useBatches(labId: string, sessionId?: string) {
  return useQuery({
    queryKey: queryKeys.batches(labId, sessionId),
    queryFn: ({ signal }) => apiFetch<{ data: BatchSummaryDto[] }>(`/labs/${labId}/batches${sessionId ? `?sessionId=${sessionId}` : ""}`, { signal }).then((r) => r.data),
    // Keep the list's counts moving while any batch in it still runs.
    refetchInterval: (q) => (q.state.data?.some((b) => !b.done) ? POLL_MS * 3 : false),
  });
}

/** A batch and its files, polled every second until every file is finished. */
export function useBatch(labId: string, batchId: string) {
  const qc = useQueryClient();
  const query = useQuery({
    queryKey: queryKeys.batch(labId, batchId),
    queryFn: ({ signal }) => apiFetch<BatchDto>(`/labs/${labId}/batches/${batchId}`, { signal }),
    refetchInterval: (q) => (q.state.data?.done ? false : POLL_MS),
  });
  const done = query.data?.done;
  useEffect(() => {
    // New runs appeared: the session's run list, the lab home and trends are out of date.
    if (done) void qc.invalidateQueries({ queryKey: queryKeys.labNotebook(labId) });
  }, [done, labId, qc]);
  return query;
}

export function useUploadBatch(labId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ sessionId, files }: { sessionId: string; files: File[] }) => {
      const form = new FormData();
      for (const f of files) form.append("files", f, f.name);
      return apiFetch<BatchDto>(`/labs/${labId}/sessions/${sessionId}/batches`, { method: "POST", body: form });
    },
    onSuccess: (batch) => {
      qc.setQueryData(queryKeys.batch(labId, batch.id), batch);
      void qc.invalidateQueries({ queryKey: queryKeys.batches(labId) });
    },
  });
}
