import type { Proposal } from '@/features/proposals/api';

/** On the proposal's page: the outcome (tier, granted hours, referees' comments to the PI) once the call is published. Nothing while there is nothing to show. */
export function ProposalOutcome(_props: { proposal: Proposal }) {
  return null;
}
