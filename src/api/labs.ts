import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import type { CreateLab, LabDto, UpdateLab } from "@shared/schemas/labs";
import { apiFetch } from "./client";
import { queryKeys } from "./queryKeys";

export function useLabs(enabled = true) {
  return useQuery({ queryKey: queryKeys.labs, queryFn: () => apiFetch<{ data: LabDto[] }>("/labs").then((r) => r.data), enabled });
}

export function useLab(labId: string) {
  return useQuery({ queryKey: queryKeys.lab(labId), queryFn: () => apiFetch<LabDto>(`/labs/${labId}`) });
}

export function useCreateLab() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: CreateLab) => apiFetch<LabDto>("/labs", { method: "POST", body }),
    onSuccess: () => qc.invalidateQueries({ queryKey: queryKeys.labs }),
  });
}

export function useUpdateLab(labId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: UpdateLab) => apiFetch<LabDto>(`/labs/${labId}`, { method: "PATCH", body }),
    onSuccess: (lab) => {
      qc.setQueryData(queryKeys.lab(labId), lab);
      void qc.invalidateQueries({ queryKey: queryKeys.labs, exact: true });
    },
  });
}

export function useDeleteLab(labId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: () => apiFetch<void>(`/labs/${labId}`, { method: "DELETE" }),
    onSuccess: () => {
      qc.removeQueries({ queryKey: queryKeys.lab(labId) });
      void qc.invalidateQueries({ queryKey: queryKeys.labs, exact: true });
    },
  });
}
