import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import type { AcceptInvitation, CreateInvitation, CreatedInvitation, InvitationDto, InvitationPreview } from "@shared/schemas/invitations";
import type { LabDto } from "@shared/schemas/labs";
import { apiFetch } from "./client";
import { queryKeys } from "./queryKeys";

export function useInvitations(labId: string, enabled: boolean) {
  return useQuery({ queryKey: queryKeys.invitations(labId), queryFn: () => apiFetch<{ data: InvitationDto[] }>(`/labs/${labId}/invitations`).then((r) => r.data), enabled });
}

export function useCreateInvitation(labId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: CreateInvitation) => apiFetch<CreatedInvitation>(`/labs/${labId}/invitations`, { method: "POST", body }),
    onSuccess: () => qc.invalidateQueries({ queryKey: queryKeys.invitations(labId) }),
  });
}

export function useRevokeInvitation(labId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (invitationId: string) => apiFetch<void>(`/labs/${labId}/invitations/${invitationId}`, { method: "DELETE" }),
    onSettled: () => qc.invalidateQueries({ queryKey: queryKeys.invitations(labId) }),
  });
}

/** What the link offers; a POST because the token stays out of URLs the server logs. */
export function useInvitationPreview(token: string) {
  return useQuery({
    queryKey: queryKeys.invitation(token),
    queryFn: () => apiFetch<InvitationPreview>("/invitations/preview", { method: "POST", body: { token } }),
    enabled: token.length > 0,
    staleTime: Infinity,
  });
}

export function useAcceptInvitation() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: AcceptInvitation) => apiFetch<{ lab: LabDto }>("/invitations/accept", { method: "POST", body }),
    // Accepting may have created the account and signed in: refresh everything except the
    // invitation itself, which is now used up (refetching it would only answer 410).
    onSuccess: () => qc.invalidateQueries({ predicate: (q) => q.queryKey[0] !== "invitation" }),
  });
}
