import { OPEN_ENDED_DAYS } from '../allocation/lst-pressure.js';

const DAY_MS = 86_400_000;
const toDate = (ms: number) => new Date(ms).toISOString().slice(0, 10);

/**
 * The days of a configuration the call's plan may use, inclusive UTC dates: from its first day in
 * use but never before the day the reviews are due (the same rule as the chair's capacity in the
 * standing, allocation/lst-pressure observableDays), to its last day in use or OPEN_ENDED_DAYS
 * after the start. null when the configuration's use ends before then.
 */
export function planPeriod(
  configuration: { inUseFrom: string; inUseTo: string | null },
  reviewDueAt: Date,
): { start: string; end: string } | null {
  const from = Date.parse(`${configuration.inUseFrom}T00:00:00Z`);
  const due = Date.parse(`${reviewDueAt.toISOString().slice(0, 10)}T00:00:00Z`);
  const start = Math.max(from, due);
  const end =
    configuration.inUseTo === null
      ? start + (OPEN_ENDED_DAYS - 1) * DAY_MS
      : Date.parse(`${configuration.inUseTo}T00:00:00Z`);
  return end < start ? null : { start: toDate(start), end: toDate(end) };
}
