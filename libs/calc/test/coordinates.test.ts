import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  CoordinateParseError,
  formatDeclination,
  formatRightAscension,
  parseDeclination,
  parseRightAscension,
} from '../src/index.js';

const raDeg = (h: number, m: number, s: number): number => 15 * (h + m / 60 + s / 3600);
const decDeg = (d: number, m: number, s: number): number => d + m / 60 + s / 3600;

describe('parseRightAscension', () => {
  it.each([
    ['10:00:24.0', raDeg(10, 0, 24)],
    ['10h00m24.0s', raDeg(10, 0, 24)],
    ['10h 00m 24s', raDeg(10, 0, 24)],
    ['10ʰ00ᵐ24ˢ', raDeg(10, 0, 24)],
    ['10 00 24', raDeg(10, 0, 24)],
    ['  10:00:24  ', raDeg(10, 0, 24)],
    ['10:00.4', raDeg(10, 0.4, 0)],
    ['10h30m', raDeg(10, 30, 0)],
    ['10.5h', 157.5],
    ['150.1', 150.1],
    ['150.1°', 150.1],
    ['150.1d', 150.1],
    ['0', 0],
    ['23:59:59.999', raDeg(23, 59, 59.999)],
  ])('reads %j', (text, expected) => {
    expect(parseRightAscension(text)).toBeCloseTo(expected, 10);
  });

  it.each([
    ['10:60:00', 'minutes', /minutes must be below 60, got 60/],
    ['10:00:60', 'seconds', /seconds must be below 60, got 60/],
    ['24:00:00', 'hours', /hours must be below 24, got 24/],
    ['25h00m00s', 'hours', /hours must be below 24/],
    ['360', 'degrees', /below 360, got 360/],
    ['-10:00:00', 'format', /cannot be negative/],
    ['10:00.5:00', 'minutes', /minutes must be a whole number/],
    ['ten hours', 'format', /must look like/],
    ['', 'format', /must look like/],
  ])('rejects %j, naming the %s', (text, part, message) => {
    let thrown: unknown;
    try {
      parseRightAscension(text);
    } catch (error) {
      thrown = error;
    }
    expect(thrown).toBeInstanceOf(CoordinateParseError);
    expect((thrown as CoordinateParseError).part).toBe(part);
    expect((thrown as CoordinateParseError).message).toMatch(message);
    expect((thrown as CoordinateParseError).message).toContain(`"${text}"`);
  });
});

describe('parseDeclination', () => {
  it.each([
    ['+22:30:00', 22.5],
    ['22:30:00', 22.5],
    ['-05:04:03.2', -decDeg(5, 4, 3.2)],
    ['−05:04:03.2', -decDeg(5, 4, 3.2)],
    ['-00:30:00', -0.5],
    ['- 00 30 00', -0.5],
    ['22d30m00s', 22.5],
    ['22°30′00″', 22.5],
    ['22°30\'00"', 22.5],
    ["-22°30'00''", -22.5],
    ['22°30′', 22.5],
    ['-5.0675', -5.0675],
    ['+90:00:00', 90],
    ['-90', -90],
  ])('reads %j', (text, expected) => {
    expect(parseDeclination(text)).toBeCloseTo(expected, 10);
  });

  it.each([
    ['+22:60:00', 'minutes', /minutes must be below 60, got 60/],
    ['+22:30:61', 'seconds', /seconds must be below 60, got 61/],
    ['+91:00:00', 'degrees', /degrees must be at most 90, got 91/],
    ['+90:00:01', 'degrees', /within ±90°/],
    ['-95.5', 'degrees', /within ±90°/],
    ['22h30m', 'format', /must look like/],
    ['north', 'format', /must look like/],
  ])('rejects %j, naming the %s', (text, part, message) => {
    let thrown: unknown;
    try {
      parseDeclination(text);
    } catch (error) {
      thrown = error;
    }
    expect(thrown).toBeInstanceOf(CoordinateParseError);
    expect((thrown as CoordinateParseError).part).toBe(part);
    expect((thrown as CoordinateParseError).message).toMatch(message);
  });
});

describe('formatting', () => {
  it('formats right ascension as hh:mm:ss.s with carry', () => {
    expect(formatRightAscension(raDeg(10, 0, 24))).toBe('10:00:24.0');
    expect(formatRightAscension(raDeg(10, 0, 59.99))).toBe('10:01:00.0');
    expect(formatRightAscension(raDeg(10, 59, 59.96))).toBe('11:00:00.0');
    expect(formatRightAscension(raDeg(23, 59, 59.99))).toBe('00:00:00.0');
    expect(formatRightAscension(raDeg(1, 2, 3.456), 3)).toBe('01:02:03.456');
    expect(formatRightAscension(raDeg(1, 2, 3.456), 0)).toBe('01:02:03');
    expect(formatRightAscension(-15)).toBe('23:00:00.0');
    expect(formatRightAscension(360)).toBe('00:00:00.0');
  });

  it('formats declination as ±dd:mm:ss with carry', () => {
    expect(formatDeclination(22.5)).toBe('+22:30:00');
    expect(formatDeclination(-decDeg(5, 4, 3.2))).toBe('-05:04:03');
    expect(formatDeclination(-decDeg(5, 4, 3.2), 1)).toBe('-05:04:03.2');
    expect(formatDeclination(decDeg(10, 59, 59.6))).toBe('+11:00:00');
    expect(formatDeclination(-decDeg(0, 0, 0.4))).toBe('+00:00:00');
    expect(formatDeclination(-0.5)).toBe('-00:30:00');
    expect(formatDeclination(90)).toBe('+90:00:00');
    expect(() => formatDeclination(91)).toThrow(/±90/);
    expect(() => formatRightAscension(NaN)).toThrow(/finite/);
  });

  it('round-trips format → parse to the precision of the last digit', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0, max: 360, maxExcluded: true, noNaN: true }),
        fc.integer({ min: 0, max: 4 }),
        (deg, decimals) => {
          const back = parseRightAscension(formatRightAscension(deg, decimals));
          const diff = Math.abs(back - deg);
          // Half a unit of the last digit of a second of time, in degrees; 360° wraps to 0°.
          expect(Math.min(diff, 360 - diff)).toBeLessThanOrEqual(
            (0.5 * 15) / 3600 / 10 ** decimals + 1e-9,
          );
        },
      ),
    );
    fc.assert(
      fc.property(
        fc.double({ min: -90, max: 90, noNaN: true }),
        fc.integer({ min: 0, max: 4 }),
        (deg, decimals) => {
          const back = parseDeclination(formatDeclination(deg, decimals));
          expect(Math.abs(back - deg)).toBeLessThanOrEqual(0.5 / 3600 / 10 ** decimals + 1e-9);
        },
      ),
    );
  });

  it('round-trips parse → format for canonical text', () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 0, max: 23 }),
        fc.integer({ min: 0, max: 59 }),
        fc.integer({ min: 0, max: 599 }),
        (h, m, tenths) => {
          const text = `${String(h).padStart(2, '0')}:${String(m).padStart(2, '0')}:${(tenths / 10).toFixed(1).padStart(4, '0')}`;
          expect(formatRightAscension(parseRightAscension(text))).toBe(text);
        },
      ),
    );
  });
});
