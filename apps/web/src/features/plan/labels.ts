import type { LostReason, PlanTier, RunStatus, UnplacedReason } from './api';

export const TIER_LABELS: Record<PlanTier, string> = {
  tier1: 'Tier 1',
  tier2: 'Tier 2',
  tier3: 'Tier 3',
};

export const RUN_STATUS_LABELS: Record<RunStatus, string> = {
  planned: 'Planned',
  observed: 'Observed',
  lost: 'Lost',
};

export const LOST_REASON_LABELS: Record<LostReason, string> = {
  weather: 'weather',
  fault: 'fault',
};

export const UNPLACED_LABELS: Record<UnplacedReason, string> = {
  never_rises: 'The target never rises above the elevation limit',
  no_lst_window: 'Its LST window never falls in the period',
  maintenance: 'Its LST window falls only in maintenance',
  reserve: 'The weather reserve holds back the time left',
  no_room: 'No free time left in its LST window',
};

export const hoursText = (h: number) => `${Math.round(h * 100) / 100} h`;

/** `21:05` from LST hours. */
export function lstText(hours: number): string {
  const minutes = Math.round(hours * 60) % 1440;
  return `${String(Math.floor(minutes / 60)).padStart(2, '0')}:${String(minutes % 60).padStart(2, '0')}`;
}

/** `3 Mar, 21:05` in a zone, with the zone's short name. */
export function zonedText(iso: string, timeZone: string): string {
  return new Intl.DateTimeFormat(undefined, {
    timeZone,
    month: 'short',
    day: 'numeric',
    hour: '2-digit',
    minute: '2-digit',
    hourCycle: 'h23',
    timeZoneName: 'short',
  }).format(new Date(iso));
}

/** `2027-03-03` — the day of an instant in a zone (for grouping runs by day). */
export function zonedDay(iso: string, timeZone: string): string {
  return new Intl.DateTimeFormat('en-CA', {
    timeZone,
    year: 'numeric',
    month: '2-digit',
    day: '2-digit',
  }).format(new Date(iso));
}
