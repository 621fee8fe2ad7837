import { describe, expect, it } from 'vitest';
import {
  CalcInputError,
  HI_REST_FREQUENCY_GHZ,
  evaluateObservation,
  validateObservationInput,
  type ObservationInput,
} from '../src/index.js';
import { makeObservation, withValue } from './support/observations.js';

const valid = makeObservation();
const line = (l: Record<string, unknown>): unknown => ({ ...valid, frequencyGHz: null, line: l });
const paths = (input: unknown): string[] => validateObservationInput(input).map((i) => i.path);

/** [what, input, the path that must be reported] */
const bad: [string, unknown, string][] = [
  ['one antenna', withValue(valid, 'array.antennas', 1), 'array.antennas'],
  ['fractional antennas', withValue(valid, 'array.antennas', 2.5), 'array.antennas'],
  ['antennas as text', withValue(valid, 'array.antennas', '18'), 'array.antennas'],
  ['negative dish', withValue(valid, 'array.dishDiameterM', -16), 'array.dishDiameterM'],
  ['no dish', withValue(valid, 'array.dishDiameterM', undefined), 'array.dishDiameterM'],
  ['latitude 91°', withValue(valid, 'array.latitudeDeg', 91), 'array.latitudeDeg'],
  ['longitude 200°', withValue(valid, 'array.longitudeDeg', 200), 'array.longitudeDeg'],
  [
    'elevation limit 90°',
    withValue(valid, 'array.elevationLimitDeg', 90),
    'array.elevationLimitDeg',
  ],
  [
    'correlator efficiency 0',
    withValue(valid, 'array.correlatorEfficiency', 0),
    'array.correlatorEfficiency',
  ],
  [
    'correlator efficiency 1.2',
    withValue(valid, 'array.correlatorEfficiency', 1.2),
    'array.correlatorEfficiency',
  ],
  ['negative overhead', withValue(valid, 'array.overheadFraction', -0.1), 'array.overheadFraction'],
  ['beam factor 0', withValue(valid, 'array.beamFactor', 0), 'array.beamFactor'],
  ['no array', withValue(valid, 'array', undefined), 'array'],
  [
    'NaN baseline',
    withValue(valid, 'configuration.longestBaselineM', NaN),
    'configuration.longestBaselineM',
  ],
  [
    'shortest above longest',
    withValue(valid, 'configuration.shortestBaselineM', 5000),
    'configuration.shortestBaselineM',
  ],
  ['zero-width band', withValue(valid, 'band.maxGHz', 1), 'band.maxGHz'],
  ['negative band edge', withValue(valid, 'band.minGHz', -1), 'band.minGHz'],
  ['T_sys 0', withValue(valid, 'band.tsysK', 0), 'band.tsysK'],
  [
    'aperture efficiency 1.01',
    withValue(valid, 'band.apertureEfficiency', 1.01),
    'band.apertureEfficiency',
  ],
  ['max bandwidth 0', withValue(valid, 'band.maxBandwidthMHz', 0), 'band.maxBandwidthMHz'],
  ['band as a list', withValue(valid, 'band', [1, 2]), 'band'],
  ['frequency 0', withValue(valid, 'frequencyGHz', 0), 'frequencyGHz'],
  ['negative frequency', withValue(valid, 'frequencyGHz', -1.4), 'frequencyGHz'],
  ['infinite frequency', withValue(valid, 'frequencyGHz', Infinity), 'frequencyGHz'],
  ['neither frequency nor line', withValue(valid, 'frequencyGHz', undefined), 'frequencyGHz'],
  ['frequency and line', { ...valid, line: { restGHz: 1.42, redshift: 0 } }, 'line'],
  ['line rest frequency 0', line({ restGHz: 0, redshift: 0 }), 'line.restGHz'],
  [
    'unknown convention',
    line({ restGHz: 1.42, velocityKmS: 10, convention: 'lsr' }),
    'line.convention',
  ],
  ['velocity without convention', line({ restGHz: 1.42, velocityKmS: 10 }), 'line.convention'],
  [
    'radio velocity c',
    line({ restGHz: 1.42, velocityKmS: 299_792.458, convention: 'radio' }),
    'line.velocityKmS',
  ],
  [
    'relativistic velocity −c',
    line({ restGHz: 1.42, velocityKmS: -299_792.458, convention: 'relativistic' }),
    'line.velocityKmS',
  ],
  [
    'optical velocity −c',
    line({ restGHz: 1.42, velocityKmS: -3e5, convention: 'optical' }),
    'line.velocityKmS',
  ],
  ['redshift −1', line({ restGHz: 1.42, redshift: -1 }), 'line.redshift'],
  ['redshift to below 1 kHz', line({ restGHz: 0.5, redshift: 1e6 - 1 }), 'line.redshift'],
  [
    'velocity and redshift',
    line({ restGHz: 1.42, velocityKmS: 10, convention: 'radio', redshift: 0 }),
    'line',
  ],
  ['line without shift', line({ restGHz: 1.42 }), 'line'],
  ['zero bandwidth', withValue(valid, 'bandwidthMHz', 0), 'bandwidthMHz'],
  ['three polarizations', withValue(valid, 'polarizations', 3), 'polarizations'],
  ['polarizations as text', withValue(valid, 'polarizations', '2'), 'polarizations'],
  ['RA 360°', withValue(valid, 'target.raDeg', 360), 'target.raDeg'],
  ['negative RA', withValue(valid, 'target.raDeg', -1), 'target.raDeg'],
  ['dec 90.5°', withValue(valid, 'target.decDeg', 90.5), 'target.decDeg'],
  ['dec −91°', withValue(valid, 'target.decDeg', -91), 'target.decDeg'],
  ['negative extent', withValue(valid, 'target.extentArcsec', -1), 'target.extentArcsec'],
  [
    'resolution goal 0',
    withValue(valid, 'target.resolutionGoalArcsec', 0),
    'target.resolutionGoalArcsec',
  ],
  ['no target', withValue(valid, 'target', null), 'target'],
  ['rms goal 0', withValue(valid, 'rmsGoalMicroJy', 0), 'rmsGoalMicroJy'],
  ['negative on-source time', withValue(valid, 'onSourceHours', -2), 'onSourceHours'],
  ['zero on-source time', withValue(valid, 'onSourceHours', 0), 'onSourceHours'],
  ['not an object', null, ''],
];

describe('validateObservationInput', () => {
  it('accepts the contract example, lines in every form, and null optional fields', () => {
    expect(validateObservationInput(valid)).toEqual([]);
    expect(
      paths(line({ restGHz: HI_REST_FREQUENCY_GHZ, velocityKmS: 1000, convention: 'radio' })),
    ).toEqual([]);
    expect(
      paths(line({ restGHz: HI_REST_FREQUENCY_GHZ, velocityKmS: 6e5, convention: 'optical' })),
    ).toEqual([]);
    expect(paths(line({ restGHz: HI_REST_FREQUENCY_GHZ, redshift: 0.02 }))).toEqual([]);
    expect(paths({ ...valid, rmsGoalMicroJy: null, onSourceHours: null })).toEqual([]);
    expect(paths(withValue(valid, 'array.beamFactor', null))).toEqual([]);
    expect(paths(withValue(valid, 'array.elevationLimitDeg', -0.5667))).toEqual([]);
  });

  it.each(bad)('reports %s at its path', (_what, input, path) => {
    const issues = validateObservationInput(input);
    expect(issues.map((i) => i.path)).toContain(path);
    for (const issue of issues) expect(issue.message).toMatch(/^[A-Z].*\.$/);
  });

  it('reports every bad field at once', () => {
    let input = withValue(valid, 'array.antennas', 0);
    input = withValue(input, 'target.decDeg', 100);
    input = withValue(input, 'bandwidthMHz', -5);
    expect(paths(input)).toEqual(['array.antennas', 'bandwidthMHz', 'target.decDeg']);
  });

  it('puts the bounds and the bad value in the message', () => {
    const [issue] = validateObservationInput(withValue(valid, 'array.correlatorEfficiency', 1.2));
    expect(issue!.message).toBe('Must be a number from 0.001 to 1, got 1.2.');
    const [velocity] = validateObservationInput(
      line({ restGHz: 1.42, velocityKmS: 'fast', convention: 'radio' }),
    );
    expect(velocity!.message).toBe('Must be a number, got "fast".');
    const [dec] = validateObservationInput(withValue(valid, 'target.decDeg', 91));
    expect(dec!.message).toBe('Must be a number from -90° to 90°, got 91.');
  });
});

describe('evaluateObservation on bad input', () => {
  it.each(bad)('throws CalcInputError naming %s', (_what, input, path) => {
    let thrown: unknown;
    try {
      evaluateObservation(input as ObservationInput);
    } catch (error) {
      thrown = error;
    }
    expect(thrown).toBeInstanceOf(CalcInputError);
    expect((thrown as CalcInputError).issues.map((i) => i.path)).toContain(path);
  });
});
