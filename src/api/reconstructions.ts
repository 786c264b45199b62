import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import type { CompareDto } from "@shared/schemas/compare";
import type { CreateReconstruction, ReconstructionDto, ReconstructionMethod } from "@shared/schemas/reconstructions";
import { apiFetch } from "./client";
import { toSearch } from "./listParams";
import { queryKeys } from "./queryKeys";

/** A new reconstruction of a run's current counts (another method or other corrections). */
export function useCreateReconstruction(labId: string, runId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: CreateReconstruction) => apiFetch<ReconstructionDto>(`/labs/${labId}/runs/${runId}/reconstructions`, { method: "POST", body }),
    onSuccess: () => qc.invalidateQueries({ queryKey: queryKeys.labNotebook(labId) }),
  });
}

export function useCompare(labId: string, runIds: string[], method: ReconstructionMethod) {
  return useQuery({
    queryKey: queryKeys.compare(labId, runIds, method),
    queryFn: ({ signal }) => apiFetch<CompareDto>(`/labs/${labId}/compare${toSearch({ runs: runIds.join(","), method })}`, { signal }),
    enabled: runIds.length >= 2,
  });
}
