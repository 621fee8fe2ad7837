import { AppError } from '../common/errors/app-error.js';
import {
  assertOpenForSubmission,
  CALL_STATUSES,
  type CallStatus,
  effectiveStatus,
  isAcceptingSubmissions,
  nextStatus,
  refuseTransition,
} from './call-lifecycle.js';

const now = new Date('2027-01-10T12:00:00Z');
const call = (status: CallStatus, over: Partial<{ opensAt: Date; deadlineAt: Date }> = {}) => ({
  code: 'SP27',
  status,
  opensAt: new Date('2026-12-01T17:00:00Z'),
  deadlineAt: new Date('2027-01-16T01:00:00Z'),
  ...over,
});
const offered = { configurationsOnOffer: 2 };

describe('effective status', () => {
  it('is closed for an open call from the deadline instant on, and open one millisecond before', () => {
    const c = call('open');
    expect(effectiveStatus(c, new Date(c.deadlineAt.getTime() - 1))).toBe('open');
    expect(effectiveStatus(c, c.deadlineAt)).toBe('closed');
  });

  it('leaves every other status as stored, whatever the time', () => {
    for (const status of CALL_STATUSES.filter((s) => s !== 'open'))
      expect(effectiveStatus(call(status), new Date('2030-01-01T00:00:00Z'))).toBe(status);
  });
});

describe('assertOpenForSubmission', () => {
  const code = (fn: () => void) => {
    try {
      fn();
      return null;
    } catch (error) {
      return (error as AppError).code;
    }
  };

  it('lets a submission through while open and before the deadline', () => {
    expect(code(() => assertOpenForSubmission(call('open'), now))).toBeNull();
    expect(isAcceptingSubmissions(call('open'), now)).toBe(true);
  });

  it('refuses at the deadline even though the stored status is still open', () => {
    const c = call('open');
    expect(code(() => assertOpenForSubmission(c, c.deadlineAt))).toBe('CALL_DEADLINE_PASSED');
  });

  it('refuses before the opening, in a planned call and after closing', () => {
    const early = call('open', { opensAt: new Date('2027-01-11T00:00:00Z') });
    expect(code(() => assertOpenForSubmission(early, now))).toBe('CALL_NOT_YET_OPEN');
    expect(isAcceptingSubmissions(early, now)).toBe(false);
    expect(code(() => assertOpenForSubmission(call('planned'), now))).toBe('CALL_NOT_OPEN');
    expect(code(() => assertOpenForSubmission(call('in_review'), now))).toBe(
      'CALL_DEADLINE_PASSED',
    );
  });
});

describe('lifecycle moves', () => {
  it('allows exactly the next step from each status', () => {
    const allowed: [CallStatus, CallStatus][] = [
      ['planned', 'open'],
      ['closed', 'in_review'],
      ['in_review', 'deliberation'],
      ['published', 'archived'],
    ];
    for (const [from, to] of allowed) {
      expect(nextStatus(from)).toBe(to);
      expect(refuseTransition(call(from), to, offered, now)).toBeNull();
    }
    expect(nextStatus('archived')).toBeNull();
  });

  it('leaves publishing to the chair’s publish, which sends the outcomes', () => {
    expect(nextStatus('deliberation')).toBe('published');
    expect(refuseTransition(call('deliberation'), 'published', offered, now)?.code).toBe(
      'CALL_PUBLISHED_BY_CHAIR',
    );
  });

  it('refuses moving back, skipping forward and staying put, with a reason', () => {
    expect(refuseTransition(call('in_review'), 'closed', offered, now)?.code).toBe(
      'CALL_MOVE_BACKWARD',
    );
    expect(refuseTransition(call('planned'), 'closed', offered, now)?.code).toBe('CALL_MOVE_SKIPS');
    expect(refuseTransition(call('closed'), 'published', offered, now)?.message).toMatch(
      /next step is in review/,
    );
    expect(refuseTransition(call('open'), 'open', offered, now)?.code).toBe(
      'CALL_ALREADY_IN_STATUS',
    );
  });

  it('counts an open call past its deadline as closed', () => {
    const late = new Date('2027-01-16T01:00:00Z');
    expect(refuseTransition(call('open'), 'in_review', offered, late)).toBeNull();
    expect(refuseTransition(call('open'), 'open', offered, late)?.code).toBe('CALL_MOVE_BACKWARD');
  });

  it('opens only with a future deadline and hours on offer', () => {
    const past = call('planned', { deadlineAt: new Date('2027-01-10T11:59:59Z') });
    expect(refuseTransition(past, 'open', offered, now)?.code).toBe('CALL_DEADLINE_PASSED');
    expect(refuseTransition(call('planned'), 'open', { configurationsOnOffer: 0 }, now)?.code).toBe(
      'CALL_NOTHING_ON_OFFER',
    );
  });

  it('does not close a call by hand before its deadline', () => {
    expect(refuseTransition(call('open'), 'closed', offered, now)?.code).toBe(
      'CALL_DEADLINE_NOT_REACHED',
    );
  });
});
