import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import type { ChangePassword, EmailOnly, Me, Notice, ResetPassword, SignIn, SignUp, SignUpResult, UpdateAccount } from "@shared/schemas/auth";
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

export function useSignUp() {
  return useMutation({ mutationFn: (body: SignUp) => apiFetch<SignUpResult>("/auth/sign-up", { method: "POST", body }) });
}

/** Opening the e-mailed link confirms the address and signs in. */
export function useVerifyEmail() {
  const startOver = useStartOver();
  return useMutation({
    mutationFn: (token: string) => apiFetch<Me>("/auth/verify-email", { method: "POST", body: { token } }),
    onSuccess: (me) => startOver(me),
  });
}

export function useResendVerification() {
  return useMutation({ mutationFn: (body: EmailOnly) => apiFetch<Notice>("/auth/resend-verification", { method: "POST", body }) });
}

export function useRequestPasswordReset() {
  return useMutation({ mutationFn: (body: EmailOnly) => apiFetch<Notice>("/auth/password-reset", { method: "POST", body }) });
}

export function useResetPassword() {
  const startOver = useStartOver();
  return useMutation({
    mutationFn: (body: ResetPassword) => apiFetch<Me>("/auth/password-reset/confirm", { method: "POST", body }),
    onSuccess: (me) => startOver(me),
  });
}

export function useUpdateAccount() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: UpdateAccount) => apiFetch<Me>("/account", { method: "PATCH", body }),
    onSuccess: (me) => qc.setQueryData(queryKeys.me, me),
  });
}

export function useChangePassword() {
  return useMutation({ mutationFn: (body: ChangePassword) => apiFetch<void>("/account/password", { method: "POST", body }) });
}
