import { keepPreviousData, queryOptions } from '@tanstack/react-query';
import { api } from '@/lib/api-client';

export const GLOBAL_ROLES = ['staff', 'admin'] as const;
export type GlobalRole = (typeof GLOBAL_ROLES)[number];

/** One account as `GET /api/users` lists it. */
export interface Account {
  id: string;
  email: string;
  name: string;
  affiliation: string;
  country: string;
  orcid: string | null;
  emailVerified: boolean;
  active: boolean;
  globalRoles: GlobalRole[];
  lastSignInAt: string | null;
  createdAt: string;
}

export interface Page<T> {
  items: T[];
  total: number;
  page: number;
  pageSize: number;
}

export type AccountSort =
  'name' | 'email' | 'affiliation' | 'country' | 'createdAt' | 'lastSignInAt';
export type AccountStatus = 'active' | 'unverified' | 'deactivated';

export interface AccountFilters {
  q?: string;
  role?: GlobalRole;
  status?: AccountStatus;
  sort: AccountSort;
  order: 'asc' | 'desc';
  page: number;
  pageSize: number;
}

export interface AccountChange {
  roles?: GlobalRole[];
  active?: boolean;
}

export interface AuditEvent {
  id: string;
  at: string;
  actor: { id: string; name: string; email: string } | null;
  action: string;
  /** The account the entry is about, when it is about one. */
  subject: { id: string; name: string; email: string } | null;
  subjectType: string | null;
  subjectId: string | null;
  details: Record<string, unknown>;
  ip: string | null;
}

export interface AuditFilters {
  /** An action, or a prefix ending in a dot (`user.`). */
  action?: string;
  userId?: string;
  page: number;
  pageSize: number;
}

export const accountKeys = {
  all: ['accounts'] as const,
  lists: () => [...accountKeys.all, 'list'] as const,
  list: (filters: AccountFilters) => [...accountKeys.lists(), filters] as const,
  audits: () => [...accountKeys.all, 'audit'] as const,
  audit: (filters: AuditFilters) => [...accountKeys.audits(), filters] as const,
};

export const accountListQueryOptions = (filters: AccountFilters) =>
  queryOptions({
    queryKey: accountKeys.list(filters),
    queryFn: ({ signal }) => api.get<Page<Account>>('/users', { query: { ...filters }, signal }),
    // Keep the rows on screen while the next page or sort order loads.
    placeholderData: keepPreviousData,
  });

export const auditQueryOptions = (filters: AuditFilters) =>
  queryOptions({
    queryKey: accountKeys.audit(filters),
    queryFn: ({ signal }) => api.get<Page<AuditEvent>>('/audit', { query: { ...filters }, signal }),
    placeholderData: keepPreviousData,
  });

export const updateAccount = (id: string, change: AccountChange) =>
  api.patch<Account>(`/users/${encodeURIComponent(id)}`, change);

export const resendVerification = (id: string) =>
  api.post<void>(`/users/${encodeURIComponent(id)}/resend-verification`);
