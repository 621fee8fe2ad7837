import { queryOptions } from '@tanstack/react-query';
import { api, isApiError } from '@/lib/api-client';

export type Role = 'proposer' | 'referee' | 'chair' | 'staff' | 'admin';

export interface CallRole {
  callCode: string;
  role: 'chair' | 'referee';
}

/** The signed-in user, as `GET /api/auth/me` answers. */
export interface Session {
  id: string;
  name: string;
  email: string;
  emailVerified: boolean;
  roles: Role[];
  callRoles: CallRole[];
}

export const sessionKeys = {
  all: ['session'] as const,
  me: () => [...sessionKeys.all, 'me'] as const,
};

/** The current user, or `null` when signed out: a 401 here is an answer, not an error. */
export async function fetchSession(signal?: AbortSignal): Promise<Session | null> {
  try {
    return await api.get<Session>('/auth/me', { signal });
  } catch (error) {
    if (isApiError(error, 401)) return null;
    throw error;
  }
}

export const sessionQueryOptions = () =>
  queryOptions({
    queryKey: sessionKeys.me(),
    queryFn: ({ signal }) => fetchSession(signal),
    staleTime: 5 * 60_000,
  });

export const signOut = () => api.post<void>('/auth/logout');
