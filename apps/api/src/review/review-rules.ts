import { effectiveStatus } from '../calls/calls.service.js';
import type { Call } from '../calls/entities/call.entity.js';
import type { FieldIssue } from '../common/errors/app-error.js';
import { utcText } from '../proposals/proposal-checks.js';
import type { ReviewStatus, ReviewValues } from './review-contract.js';

/** Proposal statuses a referee can be put on: submitted, not withdrawn, not yet decided. */
export const REVIEWABLE_PROPOSAL_STATUSES = ['submitted', 'under_review'] as const;

/** Assignments that count towards a proposal's referees and a referee's load. */
export const COUNTING_STATUSES: readonly ReviewStatus[] = ['invited', 'accepted', 'submitted'];

type CallWindow = Pick<Call, 'status' | 'opensAt' | 'deadlineAt' | 'reviewDueAt'>;

/** Referees are placed after the deadline and before deliberation starts. */
export function isAssigning(call: CallWindow, now: Date): boolean {
  const status = effectiveStatus(call, now);
  return status === 'closed' || status === 'in_review';
}

/** A review takes changes while assignments may be made and the due date (server clock) is ahead. */
export function isReviewOpen(call: CallWindow, now: Date): boolean {
  return isAssigning(call, now) && now.getTime() < call.reviewDueAt.getTime();
}

export function reviewClosedMessage(call: Pick<Call, 'code' | 'reviewDueAt'>, now: Date): string {
  return now.getTime() >= call.reviewDueAt.getTime()
    ? `Reviews for call ${call.code} were due ${utcText(call.reviewDueAt)}; they can no longer change`
    : `Call ${call.code} is not in review; its reviews cannot change now`;
}

/**
 * What is wrong with the form's values: the score on the call's scale, and for a submission a
 * score and the expertise. Field paths are the request's.
 */
export function reviewIssues(
  values: ReviewValues,
  scale: { scoreMin: number; scoreMax: number },
  submitting: boolean,
): FieldIssue[] {
  const issues: FieldIssue[] = [];
  const { score } = values;
  if (score !== null && (score < scale.scoreMin || score > scale.scoreMax))
    issues.push({
      path: 'score',
      message: `score must be between ${scale.scoreMin} and ${scale.scoreMax} (the call's scale); ${score} is outside it`,
    });
  if (submitting && score === null)
    issues.push({ path: 'score', message: 'A submitted review needs a score' });
  if (submitting && values.expertise === null)
    issues.push({ path: 'expertise', message: 'A submitted review needs your expertise (1–3)' });
  if (submitting && values.commentToPi.trim() === '')
    issues.push({ path: 'commentToPi', message: 'A submitted review needs a comment to the PI' });
  return issues;
}
