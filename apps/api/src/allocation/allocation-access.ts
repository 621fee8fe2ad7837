import { HttpStatus } from '@nestjs/common';
import { assertAllowed, hasCallRole } from '../auth/policy.js';
import type { SessionUser } from '../auth/session-user.js';
import { statusLabel } from '../calls/call-lifecycle.js';
import { AppError, conflict } from '../common/errors/app-error.js';
import type { AllocationCall } from './standing.service.js';

/** Staff may read a standing; only the call's own chair decides grants and publishes. */
export function assertChairOf(user: SessionUser, call: AllocationCall): void {
  assertAllowed(
    hasCallRole(user, call.code, 'chair'),
    `Only the chair of call ${call.code} decides its grants and publishes its outcome`,
  );
}

/**
 * Grants change only while the call is in deliberation: in review the scores are still coming in
 * (the chair reads the standing then, but decides once reviewing has closed), and once published
 * the outcome has been sent to the teams.
 */
export function assertInDeliberation(call: AllocationCall, what: string): void {
  if (call.status === 'deliberation') return;
  if (call.status === 'published' || call.status === 'archived')
    throw conflict(
      'CALL_ALREADY_PUBLISHED',
      `Call ${call.code} is ${statusLabel(call.status)}; ${what} no longer changes`,
    );
  throw conflict(
    'CALL_NOT_IN_DELIBERATION',
    `Call ${call.code} is ${statusLabel(call.status)}; ${what} can change only while it is in deliberation`,
  );
}

/** The 409 of a publish with undecided proposals: the envelope plus their references. */
export class UndecidedProposals extends AppError {
  constructor(references: string[]) {
    super(
      HttpStatus.CONFLICT,
      'UNDECIDED_PROPOSALS',
      `${references.length} proposal(s) have no decision: ${references.join(', ')}. Decide them, or publish with confirm: true to publish them as not allocated`,
    );
    const body = this.getResponse() as Record<string, unknown>;
    body.references = references;
  }
}
