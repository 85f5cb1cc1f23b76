import { useMutation } from '@tanstack/react-query';
import { api } from '@/lib/api-client';

/** E-mails a fresh confirmation link to the signed-in account's address. */
export function resendVerification(): Promise<{ message: string }> {
  return api.post<{ message: string }>('/api/auth/verify-email/resend');
}

export function useResendVerification() {
  return useMutation({ mutationFn: resendVerification });
}
