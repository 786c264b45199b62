import { useQuery } from "@tanstack/react-query";
import { HealthSchema, type Health } from "@shared/schemas/health";
import { ApiError, apiFetch } from "./client";
import { queryKeys } from "./queryKeys";

/** API and database health; a 503 still carries the body that says what is down. */
export function useHealth() {
  return useQuery({
    queryKey: queryKeys.health,
    queryFn: async (): Promise<Health> => {
      try {
        return await apiFetch<Health>("/health");
      } catch (err) {
        const report = err instanceof ApiError && err.status === 503 ? HealthSchema.safeParse(err.details) : undefined;
        if (report?.success) return report.data;
        throw err;
      }
    },
    refetchInterval: 10_000,
  });
}
