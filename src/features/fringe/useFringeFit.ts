import { keepPreviousData, useQuery } from "@tanstack/react-query";
import type { FringeAnalysisDto } from "@shared/schemas/fringe";
import { apiFetch } from "../../api/client";
import { queryKeys } from "../../api/queryKeys";

export type BackgroundChoice =
  | { background: "none" }
  | { background: "accidentals"; windowNs?: number }
  | { background: "rate"; backgroundRate: number; backgroundSigma: number };

/** Visibility fits of a fringe-scan run with the chosen background. */
export function useFringeFit(labId: string, runId: string, choice: BackgroundChoice) {
  const params = new URLSearchParams(Object.entries(choice).filter(([, v]) => v !== undefined).map(([k, v]) => [k, String(v)]));
  return useQuery({
    queryKey: [...queryKeys.labNotebook(labId), "fringe-fit", runId, choice],
    queryFn: ({ signal }) => apiFetch<FringeAnalysisDto>(`/labs/${labId}/runs/${runId}/fringe-fit?${params}`, { signal }),
    placeholderData: keepPreviousData,
  });
}
