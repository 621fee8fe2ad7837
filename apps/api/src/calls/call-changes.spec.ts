import { DateTime } from 'luxon';
import { changedFields, formatInstant, lockedFields, type CallValues } from './call-changes.js';

const base: CallValues = {
  title: 'Spring',
  description: '',
  timeZone: 'America/Los_Angeles',
  opensAt: new Date('2026-12-01T17:00:00Z'),
  deadlineAt: new Date('2027-01-16T01:00:00Z'),
  reviewDueAt: new Date('2027-02-20T01:00:00Z'),
  capacity: [
    { configurationId: 'a', hours: 100 },
    { configurationId: 'b', hours: 50 },
  ],
  scienceCasePageLimit: 4,
  scienceCaseMaxMb: 10,
  proposalKinds: ['standard', 'large'],
  maxHoursPerProposal: 100,
  scoreMin: 1,
  scoreMax: 10,
  scoreHigherIsBetter: true,
  refereesPerProposal: 3,
  anonymousReview: false,
};

describe('call changes', () => {
  it('ignores values that are equal in another form (same instant, sets in another order)', () => {
    const same: CallValues = {
      ...base,
      deadlineAt: new Date(DateTime.fromISO('2027-01-15T17:00:00-08:00').toMillis()),
      capacity: [...base.capacity].reverse(),
      proposalKinds: ['large', 'standard'],
    };
    expect(changedFields(base, same)).toEqual([]);
    expect(changedFields(base, { ...base, scienceCasePageLimit: 5 })).toEqual([
      'scienceCasePageLimit',
    ]);
  });

  it('freezes the proposers’ rules at closing and the review settings when review starts', () => {
    expect(lockedFields(['deadlineAt', 'scoreMax', 'title'], 'open')).toEqual([]);
    expect(lockedFields(['deadlineAt', 'scoreMax', 'title'], 'closed')).toEqual(['deadlineAt']);
    expect(lockedFields(['deadlineAt', 'scoreMax', 'title'], 'in_review')).toEqual([
      'deadlineAt',
      'scoreMax',
    ]);
    expect(lockedFields(['title', 'capacity'], 'archived')).toEqual(['title', 'capacity']);
  });

  it('writes an instant in the call’s zone and in UTC (luxon 3.7.2 zone rules)', () => {
    // 17:00 PST (UTC−8) on 15 January is 01:00 UTC on the 16th.
    expect(formatInstant(base.deadlineAt, 'America/Los_Angeles')).toBe(
      'Fri 15 Jan 2027, 17:00 PST (01:00 UTC, Sat 16 Jan 2027)',
    );
    expect(formatInstant(new Date('2027-01-15T12:00:00Z'), 'Europe/London')).toBe(
      'Fri 15 Jan 2027, 12:00 GMT (12:00 UTC)',
    );
  });
});
