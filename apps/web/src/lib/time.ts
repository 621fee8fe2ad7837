/**
 * Instants are stored and sent in UTC (ISO 8601); people read them in their own zone. Deadlines
 * are shown in both, so that a proposer and the observatory agree on the moment.
 */

type Instant = string | number | Date;

export interface FormatOptions {
  /** IANA zone; defaults to the viewer's. */
  timeZone?: string;
  /** BCP 47 locale; defaults to the viewer's. */
  locale?: string;
}

const toDate = (instant: Instant): Date => {
  const date = instant instanceof Date ? instant : new Date(instant);
  if (Number.isNaN(date.getTime())) throw new RangeError(`Not a valid instant: ${String(instant)}`);
  return date;
};

const dateTimeFormat = ({ timeZone, locale }: FormatOptions) =>
  new Intl.DateTimeFormat(locale, {
    timeZone,
    year: 'numeric',
    month: 'short',
    day: 'numeric',
    hour: '2-digit',
    minute: '2-digit',
    hourCycle: 'h23',
    timeZoneName: 'short',
  });

/** The viewer's IANA zone, e.g. `Europe/Berlin`. */
export const viewerTimeZone = (): string => Intl.DateTimeFormat().resolvedOptions().timeZone;

/** `3 Mar 2027, 14:00 CET`: the instant in the viewer's (or the given) zone, zone named. */
export function formatInstant(instant: Instant, options: FormatOptions = {}): string {
  return dateTimeFormat(options).format(toDate(instant));
}

/** `3 Mar 2027, 13:00 UTC`. */
export function formatUtc(instant: Instant, options: Omit<FormatOptions, 'timeZone'> = {}): string {
  return dateTimeFormat({ ...options, timeZone: 'UTC' }).format(toDate(instant));
}

/** Both readings of one instant, for deadlines and other moments that must not be misread. */
export function formatLocalAndUtc(instant: Instant, options: FormatOptions = {}) {
  return { local: formatInstant(instant, options), utc: formatUtc(instant, options) };
}

const UNITS = [
  ['day', 86_400_000],
  ['hour', 3_600_000],
  ['minute', 60_000],
] as const;

/**
 * Time left until `target` (or passed since it), in its two largest units, rounded down:
 * `2 days 3 hours`, `45 minutes`, `less than a minute`. `past` says on which side of `now` it is.
 * The clock is an argument so that callers tick it and tests fix it.
 */
export function countdown(target: Instant, now: Instant): { past: boolean; text: string } {
  const difference = toDate(target).getTime() - toDate(now).getTime();
  let rest = Math.abs(difference);
  const counts = UNITS.map(([unit, size]) => {
    const count = Math.floor(rest / size);
    rest -= count * size;
    return { unit, count };
  });
  const largest = counts.findIndex(({ count }) => count > 0);
  const text =
    largest === -1
      ? 'less than a minute'
      : counts
          .slice(largest, largest + 2)
          .filter(({ count }) => count > 0)
          .map(({ unit, count }) => `${count} ${unit}${count === 1 ? '' : 's'}`)
          .join(' ');
  return { past: difference < 0, text };
}

/** `in 2 days 3 hours` or `2 days 3 hours ago`. */
export function formatCountdown(target: Instant, now: Instant): string {
  const { past, text } = countdown(target, now);
  return past ? `${text} ago` : `in ${text}`;
}
