import { describe, expect, it } from 'vitest';
import { countdown, formatCountdown, formatInstant, formatLocalAndUtc, formatUtc } from './time';

const deadline = '2027-03-03T13:00:00Z';

describe('formatting an instant', () => {
  it('names the zone it is shown in', () => {
    expect(formatInstant(deadline, { timeZone: 'Europe/Berlin', locale: 'en-GB' })).toBe(
      '3 Mar 2027, 14:00 CET',
    );
    expect(
      formatInstant('2027-07-03T13:00:00Z', { timeZone: 'Europe/Berlin', locale: 'en-GB' }),
    ).toBe('3 Jul 2027, 15:00 CEST');
    expect(formatInstant(deadline, { timeZone: 'America/Los_Angeles', locale: 'en-US' })).toBe(
      'Mar 3, 2027, 05:00 PST',
    );
  });

  it('gives UTC alongside the local reading', () => {
    expect(formatUtc(deadline, { locale: 'en-GB' })).toBe('3 Mar 2027, 13:00 UTC');
    expect(formatLocalAndUtc(deadline, { timeZone: 'Asia/Tokyo', locale: 'en-GB' })).toEqual({
      local: '3 Mar 2027, 22:00 GMT+9',
      utc: '3 Mar 2027, 13:00 UTC',
    });
  });

  it('uses the viewer’s zone when none is given', () => {
    const zone = Intl.DateTimeFormat().resolvedOptions().timeZone;
    expect(formatInstant(deadline, { locale: 'en-GB' })).toBe(
      formatInstant(deadline, { locale: 'en-GB', timeZone: zone }),
    );
  });

  it('refuses something that is not an instant', () => {
    expect(() => formatInstant('next Tuesday')).toThrow(RangeError);
  });
});

describe('countdown', () => {
  const now = '2027-03-01T10:30:00Z';

  it.each([
    ['2027-03-03T13:45:00Z', '2 days 3 hours'],
    ['2027-03-02T10:30:00Z', '1 day'],
    ['2027-03-03T10:35:00Z', '2 days'],
    ['2027-03-01T12:00:00Z', '1 hour 30 minutes'],
    ['2027-03-01T10:31:59Z', '1 minute'],
    ['2027-03-01T10:30:40Z', 'less than a minute'],
  ])('to %s reads "%s"', (target, text) => {
    expect(countdown(target, now)).toEqual({ past: false, text });
  });

  it('says when the moment has passed', () => {
    expect(countdown('2027-03-01T08:00:00Z', now)).toEqual({
      past: true,
      text: '2 hours 30 minutes',
    });
    expect(formatCountdown('2027-03-01T08:00:00Z', now)).toBe('2 hours 30 minutes ago');
    expect(formatCountdown('2027-03-03T13:45:00Z', now)).toBe('in 2 days 3 hours');
  });
});
