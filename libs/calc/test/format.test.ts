import { describe, expect, it } from 'vitest';
import { formatFixed, formatNumber } from '../src/format.js';

describe('formatNumber (the numbers in check messages)', () => {
  it.each([
    [14.322488, 3, '14.3'],
    [14.322488, 6, '14.3225'],
    [4.1026, 3, '4.1'],
    [51.99, 3, '52'],
    [9.9996, 3, '10'],
    [123456.7, 3, '123457'],
    [0.0012345, 3, '0.00123'],
    [0.001, 3, '0.001'],
    [1.4, 6, '1.4'],
    [0.946937, 6, '0.946937'],
    [-17.3, 3, '-17.3'],
    [-0.0004, 3, '-4e-4'],
    [6.25e64, 3, '6.25e64'],
    [1e-7, 3, '1e-7'],
    [0, 3, '0'],
  ])('%d to %d digits is %s', (x, digits, text) => {
    expect(formatNumber(x, digits)).toBe(text);
  });

  it('agrees with toPrecision for values in [1e-3, 1e6)', () => {
    for (let i = 0; i < 2000; i++) {
      const x = 10 ** (-3 + (9 * i) / 2000) * (i % 2 ? 1 : -1);
      for (const digits of [3, 4, 6]) {
        const reference = Number(x.toPrecision(digits));
        // Whole digits are kept, so compare with toPrecision only where it keeps them too.
        if (Math.abs(x) < 10 ** digits)
          expect(Number(formatNumber(x, digits))).toBeCloseTo(reference, 9);
      }
    }
  });

  it('formats angles with fixed decimals and no negative zero', () => {
    expect(formatFixed(47.3, 1)).toBe('47.3');
    expect(formatFixed(15, 1)).toBe('15');
    expect(formatFixed(-0.04, 1)).toBe('0');
    expect(formatFixed(-17.35, 1)).toBe('-17.4');
  });
});
