import { describe, expect, it } from 'vitest';
import {
  CalcInputError,
  gmstDeg,
  hourAngleAtElevationLimit,
  hoursAboveElevationLimit,
  julianDayFromInstant,
  localSiderealTimeHours,
  lstWindow,
  maxElevationDeg,
  wrapHours,
} from '../src/index.js';

describe('julianDayFromInstant', () => {
  it('reads Dates and ISO instants with Z or an offset', () => {
    const jd = julianDayFromInstant('2026-03-01T21:30:00Z');
    expect(julianDayFromInstant(new Date('2026-03-01T21:30:00Z'))).toBe(jd);
    expect(julianDayFromInstant('2026-03-01T23:30:00+02:00')).toBe(jd);
    expect(julianDayFromInstant('2026-03-01T21:30Z')).toBe(jd);
  });

  it('refuses a date-time without a zone, which JavaScript would read as local time', () => {
    expect(() => julianDayFromInstant('2026-03-01T21:30:00')).toThrow(CalcInputError);
    expect(() => julianDayFromInstant('yesterday')).toThrow(/ISO 8601/);
    expect(() => julianDayFromInstant(new Date(NaN))).toThrow(/not a valid date/);
  });
});

describe('sidereal time', () => {
  it('adds the east longitude and wraps into [0, 24)', () => {
    const julianDay = 2446895.5; // Meeus Example 12.a: GMST 13h10m46.3668s
    const gmstHours = gmstDeg({ julianDay }) / 15;
    expect(localSiderealTimeHours({ julianDay, eastLongitudeDeg: 0 })).toBeCloseTo(gmstHours, 12);
    expect(localSiderealTimeHours({ julianDay, eastLongitudeDeg: -118.9 })).toBeCloseTo(
      gmstHours - 118.9 / 15,
      12,
    );
    expect(localSiderealTimeHours({ julianDay, eastLongitudeDeg: 170 })).toBeCloseTo(
      gmstHours + 170 / 15 - 24,
      12,
    );
  });

  it('wrapHours never returns 24', () => {
    expect(wrapHours(-1e-17)).toBeGreaterThanOrEqual(0);
    expect(wrapHours(-1e-17)).toBeLessThan(24);
    expect(wrapHours(24)).toBe(0);
    expect(wrapHours(-3)).toBe(21);
  });
});

describe('visibility', () => {
  it('culminates at 90° − |φ − δ|', () => {
    expect(maxElevationDeg({ latitudeDeg: 47.3, decDeg: 22.5 })).toBeCloseTo(65.2, 12);
    expect(maxElevationDeg({ latitudeDeg: -30, decDeg: -30 })).toBe(90);
  });

  it('tells never-rises, never-sets and rises-and-sets apart (Meeus 15.1)', () => {
    const site = { latitudeDeg: 47.3, elevationLimitDeg: 15 };
    expect(hourAngleAtElevationLimit({ ...site, decDeg: -60 })).toEqual({
      visibility: 'never-rises',
      hourAngleDeg: 0,
    });
    expect(hourAngleAtElevationLimit({ ...site, decDeg: 80 })).toEqual({
      visibility: 'never-sets',
      hourAngleDeg: 180,
    });
    expect(hourAngleAtElevationLimit({ ...site, decDeg: 0 }).visibility).toBe('rises-and-sets');
    expect(hoursAboveElevationLimit({ ...site, decDeg: 80 })).toBe(24);
    expect(hoursAboveElevationLimit({ ...site, decDeg: -60 })).toBe(0);
  });

  it('on the equator with the horizon as limit every star is up 12 h', () => {
    for (const decDeg of [-60, -10, 0, 35, 80]) {
      expect(
        hoursAboveElevationLimit({ latitudeDeg: 0, decDeg, elevationLimitDeg: 0 }),
      ).toBeCloseTo(12, 10);
    }
  });

  it('handles a site at the pole, where the elevation equals the declination all day', () => {
    const pole = { latitudeDeg: 90, elevationLimitDeg: 15 };
    expect(hourAngleAtElevationLimit({ ...pole, decDeg: 40 }).visibility).toBe('never-sets');
    expect(hourAngleAtElevationLimit({ ...pole, decDeg: 10 }).visibility).toBe('never-rises');
    expect(lstWindow({ ...pole, decDeg: 40, raDeg: 10 })).toEqual({
      visibility: 'never-sets',
      hoursAboveLimit: 24,
      lstRiseHours: null,
      lstSetHours: null,
    });
  });

  it('centres the LST window on the RA', () => {
    const w = lstWindow({ latitudeDeg: 47.3, decDeg: 22.5, elevationLimitDeg: 15, raDeg: 150 });
    expect((w.lstRiseHours! + w.lstSetHours!) / 2).toBeCloseTo(10, 12);
    expect(w.lstSetHours! - w.lstRiseHours!).toBeCloseTo(w.hoursAboveLimit, 12);
  });
});
