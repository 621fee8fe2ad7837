import { useMutation, useQueryClient } from '@tanstack/react-query';
import { sessionKeys } from '@/features/session/api';
import { resetCsrfToken } from '@/lib/api-client';
import {
  type Credentials,
  confirmPasswordReset,
  register,
  type Registration,
  requestPasswordReset,
  signIn,
  verifyEmail,
} from './api';

export function useSignIn() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (credentials: Credentials) => signIn(credentials),
    onSuccess: ({ csrfToken: _token, ...session }) => {
      // The server regenerated the session: the old CSRF token is dead, and nothing cached for
      // whoever used this browser before may show to this user.
      resetCsrfToken();
      queryClient.removeQueries({ predicate: (query) => query.queryKey[0] !== sessionKeys.all[0] });
      queryClient.setQueryData(sessionKeys.me(), session);
    },
  });
}

export const useRegister = () =>
  useMutation({ mutationFn: (registration: Registration) => register(registration) });

export function useVerifyEmail() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (token: string) => verifyEmail(token),
    // If this browser is signed in as the account, its roles just changed.
    onSuccess: () => queryClient.invalidateQueries({ queryKey: sessionKeys.all }),
  });
}

export const useRequestPasswordReset = () =>
  useMutation({ mutationFn: (email: string) => requestPasswordReset(email) });

export function useConfirmPasswordReset() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ token, password }: { token: string; password: string }) =>
      confirmPasswordReset(token, password),
    // Every session of the account has ended, this browser's too if it was signed in as it.
    onSuccess: () => queryClient.invalidateQueries({ queryKey: sessionKeys.all }),
  });
}
