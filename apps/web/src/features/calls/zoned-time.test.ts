import { describe, expect, it } from 'vitest';
import { instantToZoned, zonedToInstant } from './zoned-time';

/**
 * Expected instants are luxon 3.7.2's (the API's time library, IANA tz data):
 * `DateTime.fromISO(local, { zone }).toUTC().toISO()`.
 */
const LUXON: [string, string, string][] = [
  ['2027-01-15T17:00', 'America/Los_Angeles', '2027-01-16T01:00:00.000Z'],
  ['2027-07-15T17:00', 'America/Los_Angeles', '2027-07-16T00:00:00.000Z'],
  // Skipped by the change to summer time (14 March 2027, 02:00 → 03:00).
  ['2027-03-14T02:30', 'America/Los_Angeles', '2027-03-14T10:30:00.000Z'],
  ['2027-03-28T17:00', 'Europe/Berlin', '2027-03-28T15:00:00.000Z'],
  ['2027-01-15T17:00', 'Asia/Kolkata', '2027-01-15T11:30:00.000Z'],
  ['2027-01-15T17:00', 'Pacific/Chatham', '2027-01-15T03:15:00.000Z'],
  ['2027-01-15T17:00', 'UTC', '2027-01-15T17:00:00.000Z'],
];

describe('zoned date-times', () => {
  it.each(LUXON)('reads %s in %s as %s', (local, zone, expected) => {
    expect(zonedToInstant(local, zone)?.toISOString()).toBe(expected);
  });

  it.each(LUXON.filter(([local]) => local !== '2027-03-14T02:30'))(
    'writes the instant back as the same wall-clock time (%s, %s)',
    (local, zone, instant) => {
      expect(instantToZoned(instant, zone)).toBe(local);
    },
  );

  it('reads a time that occurs twice (the autumn change) as the first of the two', () => {
    // 7 November 2027, 01:30 happens at 08:30Z (summer time, UTC−7) and again at 09:30Z.
    expect(zonedToInstant('2027-11-07T01:30', 'America/Los_Angeles')?.toISOString()).toBe(
      '2027-11-07T08:30:00.000Z',
    );
  });

  it('refuses malformed values and unknown zones', () => {
    expect(zonedToInstant('2027-01-15 17:00', 'UTC')).toBeNull();
    expect(zonedToInstant('', 'UTC')).toBeNull();
    expect(zonedToInstant('2027-01-15T17:00', 'Mars/Olympus_Mons')).toBeNull();
  });
});
