import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import type { Me, SignIn } from "@shared/schemas/auth";
import { ApiError, apiFetch } from "./client";
import { queryKeys } from "./queryKeys";

/** The signed-in user, or null when signed out (undefined while loading). */
export function useMe() {
  return useQuery({
    queryKey: queryKeys.me,
    queryFn: async (): Promise<Me | null> => {
      try {
        return await apiFetch<Me>("/auth/me");
      } catch (err) {
        if (err instanceof ApiError && err.status === 401) return null;
        throw err;
      }
    },
    staleTime: 60_000,
  });
}

/** After sign-in or sign-out nothing cached for the previous person may stay on screen. */
function useStartOver() {
  const qc = useQueryClient();
  return (me: Me | null) => {
    qc.clear();
    qc.setQueryData(queryKeys.me, me);
  };
}

export function useSignIn() {
  const startOver = useStartOver();
  return useMutation({
    mutationFn: (body: SignIn) => apiFetch<Me>("/auth/sign-in", { method: "POST", body }),
    onSuccess: (me) => startOver(me),
  });
}

export function useSignOut() {
  const startOver = useStartOver();
  return useMutation({
    mutationFn: () => apiFetch<void>("/auth/sign-out", { method: "POST" }),
    onSuccess: () => startOver(null),
  });
}
