import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { useNavigate } from 'react-router-dom';
import { resetCsrfToken } from '@/lib/api-client';
import { paths } from '@/lib/paths';
import { sessionKeys, sessionQueryOptions, signOut } from './api';

/**
 * The signed-in user. `session` is `null` when signed out and `undefined` while the first
 * answer is on its way.
 */
export function useSession() {
  const query = useQuery(sessionQueryOptions());
  return { ...query, session: query.data };
}

export function useSignOut() {
  const queryClient = useQueryClient();
  const navigate = useNavigate();
  return useMutation({
    mutationFn: signOut,
    onSuccess: async () => {
      resetCsrfToken();
      queryClient.setQueryData(sessionKeys.me(), null);
      await navigate(paths.desk);
      // Nothing fetched for the old user may show to the next one on this browser.
      queryClient.removeQueries({ predicate: (query) => query.queryKey[0] !== sessionKeys.all[0] });
    },
  });
}
