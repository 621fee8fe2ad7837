import { queryOptions } from '@tanstack/react-query';
import { api, isApiError } from '@/lib/api-client';

/** What `GET /api/health` answers, with 200 when all is well and 503 when a part is down. */
export interface Health {
  status: 'ok' | 'degraded';
  database: 'up' | 'down';
  mail: 'up' | 'down';
  version: string;
}

export const healthKeys = {
  all: ['health'] as const,
};

const isHealth = (body: unknown): body is Health =>
  typeof body === 'object' &&
  body !== null &&
  'status' in body &&
  'database' in body &&
  'mail' in body;

/** The API answers 503 with the same body when a part is down: that is still a health report. */
export async function fetchHealth(signal?: AbortSignal): Promise<Health> {
  try {
    return await api.get<Health>('/health', { signal });
  } catch (error) {
    if (isApiError(error, 503) && isHealth(error.body)) return error.body;
    throw error;
  }
}

export const healthQueryOptions = () =>
  queryOptions({
    queryKey: healthKeys.all,
    queryFn: ({ signal }) => fetchHealth(signal),
    refetchInterval: 60_000,
  });
