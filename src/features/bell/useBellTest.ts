import { keepPreviousData, useQuery } from "@tanstack/react-query";
import type { BellAngles } from "@shared/physics/bell";
import type { BellTestDto } from "@shared/schemas/bell";
import { apiFetch } from "../../api/client";
import { queryKeys } from "../../api/queryKeys";

/** CHSH of a Bell-test run; `angles` undefined lets the server pick the standard ones or the rows'; `reconstructionId` the ρ to compare with. */
export function useBellTest(labId: string, runId: string, angles: BellAngles | undefined, reconstructionId?: string) {
  const params = new URLSearchParams(angles ? Object.entries(angles).map(([k, v]) => [k, String(v)]) : []);
  if (reconstructionId) params.set("reconstructionId", reconstructionId);
  const search = params.size ? `?${params}` : "";
  return useQuery({
    queryKey: [...queryKeys.labNotebook(labId), "bell-test", runId, angles ?? null, reconstructionId ?? null],
    queryFn: ({ signal }) => apiFetch<BellTestDto>(`/labs/${labId}/runs/${runId}/bell-test${search}`, { signal }),
    placeholderData: keepPreviousData,
  });
}
