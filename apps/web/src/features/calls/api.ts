import { keepPreviousData, queryOptions } from '@tanstack/react-query';
import { api } from '@/lib/api-client';

/** The lifecycle, in order (PRODUCT.md "Workflow"). */
export const CALL_STATUSES = [
  'planned',
  'open',
  'closed',
  'in_review',
  'deliberation',
  'published',
  'archived',
] as const;
export type CallStatus = (typeof CALL_STATUSES)[number];

export const PROPOSAL_KINDS = [
  'standard',
  'large',
  'target_of_opportunity',
  'discretionary',
] as const;
export type ProposalKind = (typeof PROPOSAL_KINDS)[number];

export interface CallCapacity {
  configurationId: string;
  configurationName: string;
  shortestBaselineM: number;
  longestBaselineM: number;
  hours: number;
}

/** One call as `GET /api/calls/:code` answers; instants are UTC ISO strings. */
export interface Call {
  code: string;
  title: string;
  description: string;
  observatory: { id: string; name: string; timeZone: string };
  /** IANA zone the call's dates are announced in. */
  timeZone: string;
  opensAt: string;
  deadlineAt: string;
  reviewDueAt: string;
  /** As of now by the server's clock (an open call past its deadline reads closed). */
  status: CallStatus;
  nextStatus: CallStatus | null;
  acceptingSubmissions: boolean;
  capacity: CallCapacity[];
  totalHours: number;
  scienceCasePageLimit: number;
  scienceCaseMaxMb: number;
  proposalKinds: ProposalKind[];
  maxHoursPerProposal: number;
  scoreMin: number;
  scoreMax: number;
  scoreHigherIsBetter: boolean;
  refereesPerProposal: number;
  anonymousReview: boolean;
  updatedAt: string;
}

export interface CallPage {
  items: Call[];
  total: number;
  page: number;
  pageSize: number;
}

export interface CallFilters {
  status?: readonly CallStatus[];
  page?: number;
  pageSize?: number;
}

/** What staff send to create a call; an edit sends any part of it but code and observatory. */
export interface CallInput {
  code: string;
  observatoryId: string;
  title: string;
  description: string;
  timeZone: string;
  /** ISO 8601 instants with an offset. */
  opensAt: string;
  deadlineAt: string;
  reviewDueAt: string;
  capacity: { configurationId: string; hours: number }[];
  scienceCasePageLimit: number;
  scienceCaseMaxMb: number;
  proposalKinds: ProposalKind[];
  maxHoursPerProposal: number;
  scoreMin: number;
  scoreMax: number;
  scoreHigherIsBetter: boolean;
  refereesPerProposal: number;
  anonymousReview: boolean;
}
export type CallChange = Partial<Omit<CallInput, 'code' | 'observatoryId'>>;

export type CallRoleName = 'chair' | 'referee';

export interface CallRoleHolder {
  id: string;
  email: string;
  /** null while the invitation waits for the address to register. */
  name: string | null;
  role: CallRoleName;
  state: 'active' | 'pending';
  grantedAt: string;
  grantedBy: string | null;
}

/** The arrays a call can offer time on, for the call form (from `GET /api/observatories`). */
export interface CallFormObservatory {
  id: string;
  name: string;
  timeZone: string;
  configurations: {
    id: string;
    name: string;
    shortestBaselineM: number;
    longestBaselineM: number;
  }[];
}

export const callKeys = {
  all: ['calls'] as const,
  lists: () => [...callKeys.all, 'list'] as const,
  list: (filters: CallFilters) => [...callKeys.lists(), filters] as const,
  details: () => [...callKeys.all, 'detail'] as const,
  detail: (code: string) => [...callKeys.details(), code.toUpperCase()] as const,
  roles: (code: string) => [...callKeys.detail(code), 'roles'] as const,
  formChoices: () => [...callKeys.all, 'form-choices'] as const,
};

export const fetchCalls = (filters: CallFilters, signal?: AbortSignal) =>
  api.get<CallPage>('/calls', {
    query: {
      status: filters.status?.length ? filters.status.join(',') : undefined,
      page: filters.page,
      pageSize: filters.pageSize,
    },
    signal,
  });

export const fetchCall = (code: string, signal?: AbortSignal) =>
  api.get<Call>(`/calls/${encodeURIComponent(code)}`, { signal });

export const fetchCallRoles = async (code: string, signal?: AbortSignal) =>
  (
    await api.get<{ items: CallRoleHolder[] }>(`/calls/${encodeURIComponent(code)}/roles`, {
      signal,
    })
  ).items;

export const fetchCallFormChoices = (signal?: AbortSignal) =>
  api.get<CallFormObservatory[]>('/observatories', { signal });

export const callListQueryOptions = (filters: CallFilters) =>
  queryOptions({
    queryKey: callKeys.list(filters),
    queryFn: ({ signal }) => fetchCalls(filters, signal),
    placeholderData: keepPreviousData,
  });

export const callQueryOptions = (code: string) =>
  queryOptions({
    queryKey: callKeys.detail(code),
    queryFn: ({ signal }) => fetchCall(code, signal),
  });

export const callRolesQueryOptions = (code: string) =>
  queryOptions({
    queryKey: callKeys.roles(code),
    queryFn: ({ signal }) => fetchCallRoles(code, signal),
  });

export const callFormChoicesQueryOptions = () =>
  queryOptions({
    queryKey: callKeys.formChoices(),
    queryFn: ({ signal }) => fetchCallFormChoices(signal),
  });

export const createCall = (input: CallInput) => api.post<Call>('/calls', input);

export const updateCall = (code: string, change: CallChange) =>
  api.patch<Call>(`/calls/${encodeURIComponent(code)}`, change);

export const transitionCall = (code: string, to: CallStatus) =>
  api.post<Call>(`/calls/${encodeURIComponent(code)}/transition`, { to });

export const grantCallRole = (code: string, grant: { email: string; role: CallRoleName }) =>
  api.post<CallRoleHolder>(`/calls/${encodeURIComponent(code)}/roles`, grant);

export const revokeCallRole = (code: string, id: string) =>
  api.delete<void>(`/calls/${encodeURIComponent(code)}/roles/${encodeURIComponent(id)}`);
