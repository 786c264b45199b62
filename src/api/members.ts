import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import type { MemberDto, MemberList } from "@shared/schemas/members";
import type { LabRole } from "@shared/schemas/roles";
import { apiFetch } from "./client";
import { queryKeys } from "./queryKeys";

export function useMembers(labId: string) {
  return useQuery({ queryKey: queryKeys.members(labId), queryFn: () => apiFetch<MemberList>(`/labs/${labId}/members`) });
}

export function useChangeRole(labId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ userId, role }: { userId: string; role: LabRole }) => apiFetch<MemberDto>(`/labs/${labId}/members/${userId}`, { method: "PATCH", body: { role } }),
    // The caller's own role may have changed too: refresh the lab (its `can`) as well.
    onSettled: () => qc.invalidateQueries({ queryKey: queryKeys.lab(labId) }),
  });
}

export function useRemoveMember(labId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (userId: string) => apiFetch<void>(`/labs/${labId}/members/${userId}`, { method: "DELETE" }),
    onSettled: () => qc.invalidateQueries({ queryKey: queryKeys.members(labId) }),
  });
}
