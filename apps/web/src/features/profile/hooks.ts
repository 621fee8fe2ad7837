import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { sessionKeys } from '@/features/session/api';
import {
  changePassword,
  type PasswordChange,
  type ProfileChange,
  profileKeys,
  profileQueryOptions,
  resendVerification,
  updateProfile,
} from './api';

export const useProfile = () => useQuery(profileQueryOptions());

export function useUpdateProfile() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (change: ProfileChange) => updateProfile(change),
    onSuccess: (profile) => {
      queryClient.setQueryData(profileKeys.me(), profile);
      // The header shows the name from the session.
      queryClient.setQueryData(sessionKeys.me(), profile);
    },
  });
}

export const useChangePassword = () =>
  useMutation({ mutationFn: (change: PasswordChange) => changePassword(change) });

export const useResendVerification = () => useMutation({ mutationFn: resendVerification });
