import { queryOptions } from '@tanstack/react-query';
import type { Session } from '@/features/session/api';
import { api } from '@/lib/api-client';

/** The signed-in user's own details, as `GET /api/auth/me` answers them in full. */
export interface Profile extends Session {
  affiliation: string;
  country: string;
  orcid: string | null;
}

export type ProfileChange = Partial<Pick<Profile, 'name' | 'affiliation' | 'country' | 'orcid'>>;

export interface PasswordChange {
  currentPassword: string;
  newPassword: string;
}

export const profileKeys = {
  all: ['profile'] as const,
  me: () => [...profileKeys.all, 'me'] as const,
};

export const profileQueryOptions = () =>
  queryOptions({
    queryKey: profileKeys.me(),
    queryFn: ({ signal }) => api.get<Profile>('/auth/me', { signal }),
  });

export const updateProfile = (change: ProfileChange) => api.patch<Profile>('/auth/me', change);

export const changePassword = (change: PasswordChange) => api.post<void>('/auth/password', change);

export const resendVerification = () => api.post<void>('/auth/verify/resend');
