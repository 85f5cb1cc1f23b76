import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { Account, ChangePasswordInput, RequestPasswordResetInput, ResetPasswordInput, SessionInfo, SignInInput, SignUpInput, UpdateAccountInput } from '@shared/schemas/auth';
import { api, setCsrfToken } from '@/lib/api-client';
import { sessionQueryOptions } from './get-session';

function useSessionWriter() {
  const qc = useQueryClient();
  return (info: SessionInfo) => {
    setCsrfToken(info.csrfToken);
    qc.setQueryData(sessionQueryOptions().queryKey, info);
  };
}

export function useSignIn() {
  const write = useSessionWriter();
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: SignInInput) => api.post<SessionInfo>('/api/auth/sign-in', input),
    onSuccess: (info) => {
      // Everything read under another session goes; the outbox (writes waiting on this phone, or
      // refused because the session had expired) stays, so signing in again after an expiry loses
      // nothing. A different account signing in cannot write them into someone else's trial: the
      // server refuses them, and they wait as "not accepted" on their screen.
      qc.getQueryCache().clear();
      write(info);
    },
  });
}

export function useSignUp() {
  const write = useSessionWriter();
  return useMutation({
    mutationFn: (input: SignUpInput) => api.post<SessionInfo>('/api/auth/sign-up', input),
    onSuccess: write,
  });
}

export function useSignOut() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: () => api.post<SessionInfo>('/api/auth/sign-out'),
    onSuccess: (info) => {
      qc.clear();
      setCsrfToken(info.csrfToken);
      qc.setQueryData(sessionQueryOptions().queryKey, info);
    },
  });
}

export function useRequestPasswordReset() {
  return useMutation({
    mutationFn: (input: RequestPasswordResetInput) => api.post<{ message: string }>('/api/auth/password-reset/request', input),
  });
}

export function useResetPassword() {
  return useMutation({
    mutationFn: (input: ResetPasswordInput) => api.post<{ message: string }>('/api/auth/password-reset/confirm', input),
  });
}

export function useVerifyEmail() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (token: string) => api.post<{ message: string }>('/api/auth/verify-email', { token }),
    onSuccess: () => qc.invalidateQueries({ queryKey: sessionQueryOptions().queryKey }),
  });
}

export function useUpdateAccount() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: UpdateAccountInput) => api.patch<Account>('/api/account', input),
    onSuccess: () => qc.invalidateQueries({ queryKey: sessionQueryOptions().queryKey }),
  });
}

export function useChangePassword() {
  const write = useSessionWriter();
  return useMutation({
    mutationFn: (input: ChangePasswordInput) => api.post<SessionInfo>('/api/account/password', input),
    onSuccess: write,
  });
}
