import { keepPreviousData, useQuery } from "@tanstack/react-query";
import type { TrendDto } from "@shared/schemas/trends";
import { apiFetch } from "../../api/client";
import { queryKeys } from "../../api/queryKeys";

export interface TrendScope {
  sessionId?: string;
  sourceId?: string;
  method: "linear" | "mle" | "projected";
  accidentals: boolean;
}

export function useTrend(labId: string, scope: TrendScope) {
  const params = new URLSearchParams({ method: scope.method, accidentals: String(scope.accidentals) });
  if (scope.sessionId) params.set("sessionId", scope.sessionId);
  if (scope.sourceId) params.set("sourceId", scope.sourceId);
  return useQuery({
    queryKey: [...queryKeys.labNotebook(labId), "trends", scope],
    queryFn: ({ signal }) => apiFetch<TrendDto>(`/labs/${labId}/trends?${params}`, { signal }),
    placeholderData: keepPreviousData,
  });
}
