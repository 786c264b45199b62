import { useQuery } from "@tanstack/react-query";
import type { CaughtMailDto } from "@shared/schemas/devOutbox";
import { apiFetch } from "./client";
import { queryKeys } from "./queryKeys";

/** Mail caught by the local fake SMTP server; a 404 means real mail is in use. */
export function useDevOutbox() {
  return useQuery({ queryKey: queryKeys.devOutbox, queryFn: () => apiFetch<{ data: CaughtMailDto[] }>("/dev/outbox").then((r) => r.data), refetchInterval: (q) => (q.state.status === "success" ? 3000 : false) });
}
