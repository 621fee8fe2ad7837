import { useMutation, useQuery, useQueryClient, type QueryClient } from '@tanstack/react-query';
import { useEffect, useState } from 'react';
import { isApiError } from '@/lib/api-client';
import {
  checksQueryOptions,
  comparisonQueryOptions,
  createProposal,
  type ListFilters,
  type NewProposal,
  observatoryQueryOptions,
  openCallsQueryOptions,
  type Proposal,
  proposalKeys,
  proposalListQueryOptions,
  proposalOptionsQueryOptions,
  proposalQueryOptions,
  versionsQueryOptions,
} from './api';

export const useProposals = (filters: ListFilters) => useQuery(proposalListQueryOptions(filters));
export const useProposal = (reference: string) => useQuery(proposalQueryOptions(reference));
export const useProposalOptions = () => useQuery(proposalOptionsQueryOptions());
export const useChecks = (reference: string) => useQuery(checksQueryOptions(reference));
export const useVersions = (reference: string, enabled = true) =>
  useQuery({ ...versionsQueryOptions(reference), enabled });
export const useComparison = (reference: string, from: number | null, to: number | null) =>
  useQuery({
    ...comparisonQueryOptions(reference, from ?? 0, to ?? 0),
    enabled: from !== null && to !== null && from !== to,
  });
export const useObservatory = (id: string) => useQuery(observatoryQueryOptions(id));
export const useOpenCalls = () => useQuery(openCallsQueryOptions());

/** True for the answer to a write made on an out-of-date version. */
export const isStale = (error: unknown) => isApiError(error, 409) && error.code === 'STALE_VERSION';

/**
 * Puts a write's answer in the cache as the proposal (the newest the client holds), and marks
 * what depends on it (its checks, its versions, the list) to be fetched again.
 */
export function storeProposal(queryClient: QueryClient, proposal: Proposal): void {
  queryClient.setQueryData(proposalKeys.detail(proposal.reference), proposal);
  void queryClient.invalidateQueries({ queryKey: proposalKeys.checks(proposal.reference) });
  void queryClient.invalidateQueries({
    queryKey: proposalKeys.versions(proposal.reference),
    exact: true,
  });
  void queryClient.invalidateQueries({ queryKey: proposalKeys.lists() });
}

/**
 * Runs one write with the version of the newest proposal the client holds, and stores the
 * answer. Usable outside a component's life (an autosave flushed as the user leaves).
 */
export async function writeProposal(
  queryClient: QueryClient,
  reference: string,
  write: (version: number) => Promise<Proposal>,
): Promise<Proposal> {
  const current = queryClient.getQueryData<Proposal>(proposalKeys.detail(reference));
  if (!current) throw new Error(`Proposal ${reference} is not loaded.`);
  const proposal = await write(current.version);
  storeProposal(queryClient, proposal);
  return proposal;
}

/** A write to one proposal; `mutate(variables)` sends it with the current version. */
export function useProposalWrite<V>(
  reference: string,
  write: (version: number, variables: V) => Promise<Proposal>,
) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (variables: V) =>
      writeProposal(queryClient, reference, (version) => write(version, variables)),
  });
}

/** Loads someone else's newer version after a 409, so the next try carries it. */
export function useReloadProposal(reference: string) {
  const queryClient = useQueryClient();
  return () =>
    queryClient.refetchQueries({ queryKey: proposalKeys.detail(reference), exact: true });
}

export function useCreateProposal() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ callCode, ...input }: NewProposal & { callCode: string }) =>
      createProposal(callCode, input),
    onSuccess: (proposal) => storeProposal(queryClient, proposal),
  });
}

/** The current time, ticking every `intervalMs`, for countdowns. */
export function useNow(intervalMs = 30_000): Date {
  const [now, setNow] = useState(() => new Date());
  useEffect(() => {
    const timer = window.setInterval(() => setNow(new Date()), intervalMs);
    return () => window.clearInterval(timer);
  }, [intervalMs]);
  return now;
}
