import { describe, expect, it } from 'vitest';
import { calculate, parseNumber } from './calculate';
import { formatLst, formatNumber } from './format';
import {
  DEFAULT_VALUES,
  valuesFromSearch,
  valuesToSearch,
  type CalculatorValues,
} from './form-values';

const C = 299_792_458; // m/s, exact (SI)
const custom = (changes: Partial<CalculatorValues> = {}): CalculatorValues => ({
  ...DEFAULT_VALUES,
  setup: 'custom',
  ...changes,
});

const ready = (values: CalculatorValues) => {
  const calculation = calculate(values, null);
  if (calculation.status !== 'ready') throw new Error(JSON.stringify(calculation));
  return calculation;
};

describe('calculate', () => {
  it('puts each unit choice into the library’s units', () => {
    const base = ready(custom()).input;
    // 1 GHz = 1000 MHz, 1 arcmin = 60 arcsec, 1 mJy = 1000 µJy, 1 h = 60 min.
    const scaled = ready(
      custom({
        frequency: '1400',
        frequencyUnit: 'MHz',
        extent: '2',
        extentUnit: 'arcmin',
        resolutionGoal: '0.5',
        resolutionUnit: 'arcmin',
        rmsGoal: '0.01',
        rmsUnit: 'mJy',
        time: '120',
        timeUnit: 'min',
      }),
    ).input;
    expect(scaled).toEqual({
      ...base,
      frequencyGHz: 1.4,
      target: { ...base.target, extentArcsec: 120, resolutionGoalArcsec: 30 },
      rmsGoalMicroJy: 10,
      onSourceHours: 2,
    });
    expect(base.array.overheadFraction).toBe(0.2);
  });

  it('computes a line’s sky frequency, ν = ν0(1 − v/c) in the radio convention', () => {
    const { result } = ready(
      custom({
        frequencyMode: 'line',
        restFrequency: '1.420405751768',
        restUnit: 'GHz',
        velocity: '1500',
        convention: 'radio',
      }),
    );
    expect(result.skyFrequencyGHz).toBeCloseTo(1.420405751768 * (1 - 1_500_000 / C), 12);
  });

  it('names every bad field at once: parse errors and the library’s own', () => {
    const calculation = calculate(
      custom({ dec: '+95:00:00', frequency: '1,4', antennas: '1', longestBaselineM: '' }),
      null,
    );
    expect(calculation.status).toBe('invalid');
    if (calculation.status !== 'invalid') return;
    expect(Object.keys(calculation.errors).sort()).toEqual([
      'antennas',
      'dec',
      'frequency',
      'longestBaselineM',
    ]);
    expect(calculation.errors.frequency).toMatch(/point for decimals/);
    expect(calculation.errors.longestBaselineM).toBe('Required.');
    expect(calculation.others).toEqual([]);
  });

  it('waits for the stored setup, and names a stored record that is not there', () => {
    const stored = {
      ...DEFAULT_VALUES,
      setup: 'stored' as const,
      configuration: 'gone',
      band: 'L',
    };
    expect(calculate(stored, null)).toEqual({ status: 'waiting' });
    const observatory = {
      id: 'o',
      name: 'Test Array',
      latitudeDeg: 10,
      longitudeDeg: 20,
      elevationM: 0,
      elevationLimitDeg: 10,
      antennas: 5,
      dishDiameterM: 10,
      correlatorEfficiency: 0.9,
      overheadFraction: 0.1,
      beamFactor: 1.13,
      timeZone: 'UTC',
      configurations: [],
      bands: [],
    };
    const calculation = calculate(stored, {
      observatory,
      configuration: undefined,
      band: undefined,
    });
    expect(calculation).toMatchObject({
      status: 'invalid',
      errors: { configuration: expect.any(String), band: expect.any(String) },
      others: [],
    });
  });
});

describe('parseNumber', () => {
  it.each([
    ['1.4', 1.4],
    [' -3 ', -3],
    ['−3', -3],
    ['.5', 0.5],
    ['1e3', 1000],
    ['', null],
  ])('reads %j', (text, value) => expect(parseNumber(text)).toBe(value));

  it.each(['abc', '1.2.3', '1,4', '0x10', 'Infinity'])('refuses %j', (text) =>
    expect(parseNumber(text)).toEqual({ error: expect.any(String) }),
  );
});

describe('the link', () => {
  it('gives back the values it was made from', () => {
    const values = custom({
      frequencyMode: 'line',
      shift: 'redshift',
      redshift: '0.3',
      dec: '-05:30',
    });
    expect(valuesFromSearch(valuesToSearch(values))).toEqual(values);
  });

  it('leaves out what the mode does not use, and ignores unknown choices', () => {
    const search = valuesToSearch({ ...DEFAULT_VALUES, setup: 'stored', configuration: 'wide' });
    expect(search.has('antennas')).toBe(false);
    expect(search.has('restFrequency')).toBe(false);
    expect(search.get('configuration')).toBe('wide');
    const values = valuesFromSearch(new URLSearchParams('frequencyUnit=THz&frequency=abc'));
    expect(values.frequencyUnit).toBe('GHz');
    // Text is kept as typed: the form shows what is wrong with it.
    expect(values.frequency).toBe('abc');
  });
});

describe('formatting', () => {
  it.each([
    [21.4137, 4, '21.41'],
    [12345.6, 4, '12 350'.replace(' ', '\u2009')],
    [-0.5, 3, '−0.5'],
    [0.000123456, 3, '1.23 × 10⁻⁴'],
    [6.2e9, 3, '6.2 × 10⁹'],
    [Number.NaN, 3, '—'],
  ])('writes %d with %d digits as %s', (x, digits, text) =>
    expect(formatNumber(x, digits)).toBe(text),
  );

  it('writes LST as hh:mm and carries 59.6 minutes into the next hour', () => {
    expect(formatLst(5.5)).toBe('05:30');
    expect(formatLst(23.9999)).toBe('00:00');
    expect(formatLst(-1)).toBe('23:00');
  });
});
