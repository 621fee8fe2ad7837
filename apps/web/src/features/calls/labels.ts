import type { CallStatus, ProposalKind } from './api';

export const STATUS_LABELS: Record<CallStatus, string> = {
  planned: 'Planned',
  open: 'Open',
  closed: 'Closed',
  in_review: 'In review',
  deliberation: 'Deliberation',
  published: 'Published',
  archived: 'Archived',
};

/** What each status means, for the call page and the confirmation before a move. */
export const STATUS_MEANINGS: Record<CallStatus, string> = {
  planned: 'Being prepared by the staff; only staff can see it.',
  open: 'Published; proposals can be submitted from the opening until the deadline.',
  closed: 'The deadline has passed; no more submissions.',
  in_review: 'Technical assessments and referee reviews are under way.',
  deliberation: 'The committee is ranking the proposals and allocating hours.',
  published: 'Outcomes are published to the proposers.',
  archived: 'Finished; kept for the record and no longer changes.',
};

export const KIND_LABELS: Record<ProposalKind, string> = {
  standard: 'Standard',
  large: 'Large',
  target_of_opportunity: 'Target of opportunity',
  discretionary: "Director's discretionary",
};
