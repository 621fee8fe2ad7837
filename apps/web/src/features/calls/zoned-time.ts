/**
 * A call's dates are entered as wall-clock times in the call's zone (17:00 at the site) and sent
 * to the API as instants. These convert between the two with the browser's own zone rules
 * (Intl), so the app needs no time-zone library.
 */

/** `YYYY-MM-DDTHH:mm`, the value of an `<input type="datetime-local">`. */
export type LocalDateTime = string;

const LOCAL = /^(\d{4})-(\d{2})-(\d{2})T(\d{2}):(\d{2})$/;

const formatters = new Map<string, Intl.DateTimeFormat>();
function partsFormatter(zone: string): Intl.DateTimeFormat {
  let formatter = formatters.get(zone);
  if (!formatter) {
    formatter = new Intl.DateTimeFormat('en-US', {
      timeZone: zone,
      hourCycle: 'h23',
      year: 'numeric',
      month: '2-digit',
      day: '2-digit',
      hour: '2-digit',
      minute: '2-digit',
      second: '2-digit',
    });
    formatters.set(zone, formatter);
  }
  return formatter;
}

/** The wall clock in `zone` at `ms`, as numbers. */
function wallClock(zone: string, ms: number) {
  const parts = Object.fromEntries(
    partsFormatter(zone)
      .formatToParts(new Date(ms))
      .map((p) => [p.type, p.value]),
  ) as Record<string, string>;
  return {
    year: Number(parts.year),
    month: Number(parts.month),
    day: Number(parts.day),
    hour: Number(parts.hour),
    minute: Number(parts.minute),
    second: Number(parts.second),
  };
}

/** The zone's offset from UTC at the instant `ms`, in milliseconds (east positive). */
function offsetAt(zone: string, ms: number): number {
  const w = wallClock(zone, ms);
  const asUtc = Date.UTC(w.year, w.month - 1, w.day, w.hour, w.minute, w.second);
  return asUtc - (ms - (((ms % 1000) + 1000) % 1000));
}

export const isValidZone = (zone: string): boolean => {
  try {
    partsFormatter(zone);
    return true;
  } catch {
    return false;
  }
};

/**
 * The instant at which the wall clock in `zone` reads `local`. A time skipped by a change to
 * summer time is read with the offset before the change (02:30 on the spring-forward night is
 * 03:30 summer time), as luxon does; a time that occurs twice reads as the first.
 * Returns null for a malformed value or an unknown zone.
 */
export function zonedToInstant(local: LocalDateTime, zone: string): Date | null {
  const match = LOCAL.exec(local);
  if (!match || !isValidZone(zone)) return null;
  const [, y, mo, d, h, mi] = match.map(Number) as [number, number, number, number, number, number];
  const wall = Date.UTC(y, mo - 1, d, h, mi);
  const o1 = offsetAt(zone, wall);
  const first = wall - o1;
  const o2 = offsetAt(zone, first);
  if (o1 === o2) return new Date(first);
  const second = first - (o2 - o1);
  const o3 = offsetAt(zone, second);
  if (o2 === o3) return new Date(second);
  // No wall-clock reading matches: the time was skipped. Use the earlier (smaller) offset.
  return new Date(wall - Math.min(o2, o3));
}

/** The wall clock in `zone` at `instant`, as `YYYY-MM-DDTHH:mm`. */
export function instantToZoned(instant: string | Date, zone: string): LocalDateTime {
  const w = wallClock(zone, new Date(instant).getTime());
  const pad = (n: number) => String(n).padStart(2, '0');
  return `${w.year}-${pad(w.month)}-${pad(w.day)}T${pad(w.hour)}:${pad(w.minute)}`;
}
