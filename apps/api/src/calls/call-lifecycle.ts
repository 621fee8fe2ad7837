import { conflict } from '../common/errors/app-error.js';

/** The call's lifecycle, in order (PRODUCT.md "Workflow"). */
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

const LABELS: Record<CallStatus, string> = {
  planned: 'planned',
  open: 'open',
  closed: 'closed',
  in_review: 'in review',
  deliberation: 'deliberation',
  published: 'published',
  archived: 'archived',
};
export const statusLabel = (s: CallStatus): string => LABELS[s];

/** What the lifecycle rules need to know about a call. */
export interface CallTimes {
  code: string;
  status: CallStatus;
  opensAt: Date;
  deadlineAt: Date;
}

/**
 * The status as of `now`: an open call whose deadline has passed is closed, whether or not the
 * deadline job has run yet. Every rule about time goes through this, never the stored status.
 */
export function effectiveStatus(
  call: Pick<CallTimes, 'status' | 'deadlineAt'>,
  now: Date,
): CallStatus {
  return call.status === 'open' && now.getTime() >= call.deadlineAt.getTime()
    ? 'closed'
    : call.status;
}

/** Whether proposals may be submitted now: open, past its opening and before its deadline. */
export function isAcceptingSubmissions(call: CallTimes, now: Date): boolean {
  return effectiveStatus(call, now) === 'open' && now.getTime() >= call.opensAt.getTime();
}

/**
 * Refuses (409) a submission, or any change to a proposal that only an open call allows, unless
 * the call takes submissions at `now` by the server's clock.
 */
export function assertOpenForSubmission(call: CallTimes, now: Date): void {
  const status = effectiveStatus(call, now);
  if (status === 'planned')
    throw conflict('CALL_NOT_OPEN', `Call ${call.code} is not open for submissions yet`);
  if (status !== 'open')
    throw conflict(
      'CALL_DEADLINE_PASSED',
      `The deadline of call ${call.code} passed at ${call.deadlineAt.toISOString()}; submissions are closed`,
    );
  if (now.getTime() < call.opensAt.getTime())
    throw conflict(
      'CALL_NOT_YET_OPEN',
      `Call ${call.code} opens for submissions at ${call.opensAt.toISOString()}`,
    );
}

/** The one status a call may move to next, or null at the end. */
export function nextStatus(status: CallStatus): CallStatus | null {
  return CALL_STATUSES[CALL_STATUSES.indexOf(status) + 1] ?? null;
}

/** What a lifecycle move needs besides the call: how many configurations have hours on offer. */
export interface TransitionFacts {
  configurationsOnOffer: number;
}

/**
 * Why the call may not move from its effective status to `to`, or null when it may. Moves go one
 * step forward only; opening needs a future deadline and hours on offer; closing happens at the
 * deadline, not before; publishing only through the allocation module's publish, which sets the
 * outcomes and sends them.
 */
export function refuseTransition(
  call: CallTimes,
  to: CallStatus,
  facts: TransitionFacts,
  now: Date,
): { code: string; message: string } | null {
  const from = effectiveStatus(call, now);
  const fromIndex = CALL_STATUSES.indexOf(from);
  const toIndex = CALL_STATUSES.indexOf(to);
  if (toIndex === fromIndex)
    return {
      code: 'CALL_ALREADY_IN_STATUS',
      message: `Call ${call.code} is already ${statusLabel(to)}`,
    };
  if (toIndex < fromIndex)
    return {
      code: 'CALL_MOVE_BACKWARD',
      message: `Call ${call.code} is ${statusLabel(from)} and cannot move back to ${statusLabel(to)}`,
    };
  if (toIndex > fromIndex + 1)
    return {
      code: 'CALL_MOVE_SKIPS',
      message: `Call ${call.code} is ${statusLabel(from)}; its next step is ${statusLabel(nextStatus(from) as CallStatus)}, not ${statusLabel(to)}`,
    };
  if (to === 'open') {
    if (call.deadlineAt.getTime() <= now.getTime())
      return {
        code: 'CALL_DEADLINE_PASSED',
        message: `Call ${call.code} cannot open: its deadline ${call.deadlineAt.toISOString()} has passed; move the deadline first`,
      };
    if (facts.configurationsOnOffer === 0)
      return {
        code: 'CALL_NOTHING_ON_OFFER',
        message: `Call ${call.code} cannot open: no configuration has hours on offer`,
      };
  }
  if (to === 'published')
    return {
      code: 'CALL_PUBLISHED_BY_CHAIR',
      message: `Call ${call.code} is published by its chair from the standing (POST /api/calls/${call.code}/publish), which sends the outcomes`,
    };
  if (to === 'closed')
    return {
      code: 'CALL_DEADLINE_NOT_REACHED',
      message: `Call ${call.code} closes by itself at its deadline ${call.deadlineAt.toISOString()}; move the deadline to close it sooner`,
    };
  return null;
}

/** Throws the 409 for a refused move. */
export function assertTransition(
  call: CallTimes,
  to: CallStatus,
  facts: TransitionFacts,
  now: Date,
): void {
  const refusal = refuseTransition(call, to, facts, now);
  if (refusal) throw conflict(refusal.code, refusal.message);
}
