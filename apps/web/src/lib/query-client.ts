import { QueryCache, QueryClient } from '@tanstack/react-query';
import { isApiError, type ApiError } from './api-client';

export interface QueryClientOptions {
  /**
   * Called when a query is refused with 401: the session has ended. The app sends the user to
   * sign in. Mutations are left out on purpose: a form that failed to save keeps its input on
   * screen, and the form shows the error instead.
   */
  onUnauthorized?: (error: ApiError) => void;
}

// Asking again cannot fix a refusal (4xx); it can fix a flaky network or a restarting server.
const shouldRetry = (failureCount: number, error: unknown) =>
  failureCount < 2 && !(isApiError(error) && error.status >= 400 && error.status < 500);

export function createQueryClient({ onUnauthorized }: QueryClientOptions = {}): QueryClient {
  return new QueryClient({
    queryCache: new QueryCache({
      onError: (error) => {
        if (isApiError(error, 401)) onUnauthorized?.(error);
      },
    }),
    defaultOptions: {
      queries: {
        staleTime: 30_000,
        retry: shouldRetry,
        refetchOnWindowFocus: true,
      },
      mutations: { retry: false },
    },
  });
}
