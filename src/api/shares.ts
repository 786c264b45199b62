import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import type { CreateShare, CreatedShare, GuestShareDto, ShareDto, ShareItemType, SharedViewDto, Snapshot } from "@shared/schemas/shares";
import type { ImportedBundle } from "@shared/schemas/exports";
import { apiFetch } from "./client";
import { queryKeys } from "./queryKeys";

/** Keys of this resource, under the lab's keys so leaving or deleting a lab drops them too. */
const shareKeys = {
  all: (labId: string) => ["labs", labId, "shares"] as const,
  list: (labId: string, itemType?: ShareItemType, itemId?: string) => ["labs", labId, "shares", itemType ?? "all", itemId ?? "all"] as const,
  /** Under the notebook key: a new run or reconstruction changes what a report shows. */
  report: (labId: string, itemType: ShareItemType, itemId: string) => [...queryKeys.labNotebook(labId), "report", itemType, itemId] as const,
  link: (token: string) => ["shared", token] as const,
  guestList: ["guest-shares"] as const,
  guest: (shareId: string) => ["guest-shares", shareId] as const,
};

/** The lab's shares, or those of one item. */
export function useShares(labId: string, item?: { itemType: ShareItemType; itemId: string }) {
  const search = item ? `?itemType=${item.itemType}&itemId=${item.itemId}` : "";
  return useQuery({
    queryKey: shareKeys.list(labId, item?.itemType, item?.itemId),
    queryFn: ({ signal }) => apiFetch<{ data: ShareDto[] }>(`/labs/${labId}/shares${search}`, { signal }).then((r) => r.data),
  });
}

export function useCreateShare(labId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: CreateShare) => apiFetch<CreatedShare>(`/labs/${labId}/shares`, { method: "POST", body }),
    onSuccess: () => qc.invalidateQueries({ queryKey: shareKeys.all(labId) }),
  });
}

export function useRevokeShare(labId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (shareId: string) => apiFetch<ShareDto>(`/labs/${labId}/shares/${shareId}/revoke`, { method: "POST" }),
    onSettled: () => qc.invalidateQueries({ queryKey: shareKeys.all(labId) }),
  });
}

/** What a share link opens; a POST because the token stays out of URLs the server logs. */
export function useSharedLink(token: string) {
  return useQuery({
    queryKey: shareKeys.link(token),
    queryFn: ({ signal }) => apiFetch<SharedViewDto>("/shared/view", { method: "POST", body: { token }, signal }),
    retry: false,
    staleTime: Infinity,
  });
}

export function useGuestShares(enabled = true) {
  return useQuery({ queryKey: shareKeys.guestList, enabled, queryFn: ({ signal }) => apiFetch<{ data: GuestShareDto[] }>("/guest/shares", { signal }).then((r) => r.data) });
}

export function useGuestShare(shareId: string) {
  return useQuery({ queryKey: shareKeys.guest(shareId), queryFn: ({ signal }) => apiFetch<SharedViewDto>(`/guest/shares/${shareId}`, { signal }), retry: false });
}

/** Everything a printable report shows (the same snapshot a share shows). */
export function useReport(labId: string, itemType: ShareItemType, itemId: string) {
  return useQuery({ queryKey: shareKeys.report(labId, itemType, itemId), queryFn: ({ signal }) => apiFetch<Snapshot>(`/labs/${labId}/reports/${itemType}/${itemId}`, { signal }) });
}

/** Imports a session bundle file as a new session of the lab. */
export function useImportBundle(labId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ file, sourceId }: { file: File; sourceId?: string }) => {
      const form = new FormData();
      form.append("bundle", file);
      if (sourceId) form.append("sourceId", sourceId);
      return apiFetch<ImportedBundle>(`/labs/${labId}/bundles`, { method: "POST", body: form });
    },
    onSuccess: () => qc.invalidateQueries({ queryKey: queryKeys.labNotebook(labId) }),
  });
}
