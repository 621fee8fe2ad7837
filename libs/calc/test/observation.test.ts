import { describe, expect, it } from 'vitest';
import {
  BOLTZMANN_J_PER_K,
  HI_REST_FREQUENCY_GHZ,
  SPEED_OF_LIGHT_M_PER_S,
  evaluateObservation,
  type CheckCode,
  type ObservationInput,
} from '../src/index.js';
import { makeObservation, withValue } from './support/observations.js';

const codes = (input: ObservationInput): CheckCode[] =>
  evaluateObservation(input).checks.map((c) => c.code);
const check = (input: ObservationInput, code: CheckCode) =>
  evaluateObservation(input).checks.find((c) => c.code === code);
const target = (
  overrides: Partial<ObservationInput['target']>,
): Pick<ObservationInput, 'target'> => ({
  target: { ...makeObservation().target, ...overrides },
});
const ARCSEC_PER_RAD = (180 / Math.PI) * 3600;

describe('evaluateObservation: the numbers', () => {
  const r = evaluateObservation(makeObservation());

  it('answers with exactly the fields of the HTTP contract', () => {
    expect(Object.keys(r).sort()).toEqual(
      [
        'skyFrequencyGHz',
        'wavelengthM',
        'resolutionArcsec',
        'largestScaleArcsec',
        'primaryBeamArcmin',
        'pointings',
        'effectiveAreaM2',
        'sefdJy',
        'rmsMicroJy',
        'onSourceHoursForGoal',
        'totalHours',
        'brightnessRmsK',
        'maxElevationDeg',
        'hoursAboveLimit',
        'lstRiseHours',
        'lstSetHours',
        'checks',
      ].sort(),
    );
  });

  it('computes the contract example by the formulas of SCIENCE.md, written out here', () => {
    const lambda = SPEED_OF_LIGHT_M_PER_S / 1.4e9;
    const area = (0.65 * Math.PI * 16 ** 2) / 4;
    const sefd = (2 * BOLTZMANN_J_PER_K * 28) / area / 1e-26;
    const perSecond = 2 * 18 * 17 * 500e6;
    const rms = sefd / (0.88 * Math.sqrt(perSecond * 2 * 3600));
    const goalSeconds = (sefd / (0.88 * 10e-6)) ** 2 / perSecond;
    const theta = lambda / 3200;
    const omega = (Math.PI * theta ** 2) / (4 * Math.LN2);
    const rad = Math.PI / 180;
    const cosH0 =
      (Math.sin(15 * rad) - Math.sin(47.3 * rad) * Math.sin(22.5 * rad)) /
      (Math.cos(47.3 * rad) * Math.cos(22.5 * rad));
    const h0Hours = Math.acos(cosH0) / rad / 15;

    expect(r.skyFrequencyGHz).toBe(1.4);
    expect(r.wavelengthM).toBeCloseTo(lambda, 15);
    expect(r.resolutionArcsec).toBeCloseTo(theta * ARCSEC_PER_RAD, 10);
    expect(r.largestScaleArcsec).toBeCloseTo(((0.6 * lambda) / 30) * ARCSEC_PER_RAD, 9);
    expect(r.primaryBeamArcmin).toBeCloseTo(((1.13 * lambda) / 16) * (ARCSEC_PER_RAD / 60), 10);
    expect(r.pointings).toBe(1);
    expect(r.effectiveAreaM2).toBeCloseTo(area, 10);
    expect(r.sefdJy).toBeCloseTo(sefd, 9);
    expect(r.rmsMicroJy).toBeCloseTo(rms * 1e6, 10);
    expect(r.onSourceHoursForGoal).toBeCloseTo(goalSeconds / 3600, 10);
    expect(r.totalHours).toBeCloseTo(2 * 1 * 1.2, 12);
    expect(r.brightnessRmsK).toBeCloseTo(
      (rms * 1e-26 * lambda ** 2) / (2 * BOLTZMANN_J_PER_K * omega),
      12,
    );
    expect(r.maxElevationDeg).toBeCloseTo(65.2, 12);
    expect(r.hoursAboveLimit).toBeCloseTo(2 * h0Hours, 10);
    expect(r.lstRiseHours).toBeCloseTo(150.1 / 15 - h0Hours, 10);
    expect(r.lstSetHours).toBeCloseTo(150.1 / 15 + h0Hours, 10);
  });

  it('takes totalHours and brightnessRmsK from the goal when onSourceHours is not given', () => {
    const goalOnly = evaluateObservation(makeObservation({ onSourceHours: null }));
    expect(goalOnly.rmsMicroJy).toBeNull();
    expect(goalOnly.totalHours).toBeCloseTo(goalOnly.onSourceHoursForGoal! * 1.2, 12);
    const atGoal = evaluateObservation(
      makeObservation({ onSourceHours: goalOnly.onSourceHoursForGoal }),
    );
    expect(goalOnly.brightnessRmsK).toBeCloseTo(atGoal.brightnessRmsK!, 15);
    expect(atGoal.rmsMicroJy).toBeCloseTo(10, 10);
  });

  it('answers null where no time or goal is given, and omitted optional fields count as null', () => {
    const neither = evaluateObservation(
      makeObservation({ onSourceHours: null, rmsGoalMicroJy: null }),
    );
    expect(neither).toMatchObject({
      rmsMicroJy: null,
      onSourceHoursForGoal: null,
      totalHours: null,
      brightnessRmsK: null,
    });
    const omitted = withValue(
      withValue(makeObservation(), 'onSourceHours', undefined),
      'array.beamFactor',
      undefined,
    );
    const o = evaluateObservation(omitted as ObservationInput);
    expect(o.rmsMicroJy).toBeNull();
    expect(o.primaryBeamArcmin).toBeCloseTo(
      evaluateObservation(makeObservation()).primaryBeamArcmin,
      12,
    );
  });

  it('multiplies total time by pointings and overhead', () => {
    const mosaic = evaluateObservation(makeObservation(target({ extentArcsec: 3000 })));
    expect(mosaic.pointings).toBe(5);
    expect(mosaic.totalHours).toBeCloseTo(2 * 5 * 1.2, 12);
  });

  it('derives the sky frequency of a line in each convention', () => {
    const c = SPEED_OF_LIGHT_M_PER_S / 1000;
    const rest = HI_REST_FREQUENCY_GHZ;
    const sky = (line: NonNullable<ObservationInput['line']>) =>
      evaluateObservation(makeObservation({ frequencyGHz: null, line })).skyFrequencyGHz;
    expect(sky({ restGHz: rest, velocityKmS: 3000, convention: 'radio' })).toBeCloseTo(
      rest * (1 - 3000 / c),
      14,
    );
    expect(sky({ restGHz: rest, velocityKmS: 3000, convention: 'optical' })).toBeCloseTo(
      rest / (1 + 3000 / c),
      14,
    );
    expect(sky({ restGHz: rest, velocityKmS: 3000, convention: 'relativistic' })).toBeCloseTo(
      rest * Math.sqrt((1 - 3000 / c) / (1 + 3000 / c)),
      14,
    );
    expect(sky({ restGHz: rest, redshift: 0.1 })).toBeCloseTo(rest / 1.1, 14);
    // JSON bodies often carry every key: a null redshift beside a velocity means the velocity.
    const withNullRedshift = {
      restGHz: rest,
      velocityKmS: 3000,
      convention: 'radio',
      redshift: null,
    };
    expect(sky(withNullRedshift as unknown as Parameters<typeof sky>[0])).toBeCloseTo(
      rest * (1 - 3000 / c),
      14,
    );
  });

  it('reports a target that never sets with 24 h and no rise or set time', () => {
    const r80 = evaluateObservation(makeObservation(target({ decDeg: 80 })));
    expect(r80).toMatchObject({ hoursAboveLimit: 24, lstRiseHours: null, lstSetHours: null });
  });

  it('wraps the LST window into [0, 24)', () => {
    const early = evaluateObservation(makeObservation(target({ raDeg: 5 })));
    expect(early.lstRiseHours!).toBeGreaterThanOrEqual(0);
    expect(early.lstRiseHours!).toBeLessThan(24);
    expect(early.lstRiseHours!).toBeGreaterThan(early.lstSetHours!);
  });
});

describe('evaluateObservation: the nine checks', () => {
  it('raises none on the contract example with a matching time', () => {
    const need = evaluateObservation(makeObservation()).onSourceHoursForGoal!;
    expect(codes(makeObservation({ onSourceHours: need }))).toEqual([]);
  });

  it('FREQUENCY_OUTSIDE_BAND fires outside the band, not on its edges', () => {
    const found = check(makeObservation({ frequencyGHz: 2.5 }), 'FREQUENCY_OUTSIDE_BAND');
    expect(found).toMatchObject({ level: 'blocker', field: 'frequencyGHz' });
    expect(found!.message).toContain('2.5 GHz');
    expect(found!.message).toContain('1–2 GHz');
    expect(codes(makeObservation({ frequencyGHz: 2 }))).not.toContain('FREQUENCY_OUTSIDE_BAND');
    expect(codes(makeObservation({ frequencyGHz: 1 }))).not.toContain('FREQUENCY_OUTSIDE_BAND');
  });

  it('FREQUENCY_OUTSIDE_BAND names line.restGHz for a redshifted line', () => {
    const input = makeObservation({
      frequencyGHz: null,
      line: { restGHz: HI_REST_FREQUENCY_GHZ, redshift: 0.5 },
    });
    const found = check(input, 'FREQUENCY_OUTSIDE_BAND');
    expect(found).toMatchObject({ field: 'line.restGHz' });
    expect(found!.message).toContain('0.946937 GHz');
    const near = makeObservation({
      frequencyGHz: null,
      line: { restGHz: HI_REST_FREQUENCY_GHZ, redshift: 0.05 },
    });
    expect(codes(near)).not.toContain('FREQUENCY_OUTSIDE_BAND');
  });

  it('BANDWIDTH_TOO_WIDE fires above the band widest only', () => {
    const found = check(makeObservation({ bandwidthMHz: 1500 }), 'BANDWIDTH_TOO_WIDE');
    expect(found).toMatchObject({ level: 'blocker', field: 'bandwidthMHz' });
    expect(found!.message).toMatch(/1500 MHz.*1000 MHz/);
    expect(codes(makeObservation({ bandwidthMHz: 1000 }))).not.toContain('BANDWIDTH_TOO_WIDE');
  });

  it('NEVER_RISES fires for a target below the limit all day, without LOW_ELEVATION', () => {
    const input = makeObservation(target({ decDeg: -60 }));
    const r = evaluateObservation(input);
    expect(r.checks.find((c) => c.code === 'NEVER_RISES')).toMatchObject({
      level: 'blocker',
      field: 'target.decDeg',
    });
    expect(r.checks.find((c) => c.code === 'NEVER_RISES')!.message).toMatch(
      /47\.3°.*-60°.*15°.*-17\.3°/,
    );
    expect(r.checks.map((c) => c.code)).not.toContain('LOW_ELEVATION');
    expect(r).toMatchObject({ hoursAboveLimit: 0, lstRiseHours: null, lstSetHours: null });
    expect(codes(makeObservation(target({ decDeg: -27 })))).not.toContain('NEVER_RISES');
  });

  it('RESOLUTION_NOT_REACHED fires for a goal finer than λ/B_longest', () => {
    const found = check(
      makeObservation(target({ resolutionGoalArcsec: 5 })),
      'RESOLUTION_NOT_REACHED',
    );
    expect(found).toMatchObject({ level: 'warning', field: 'target.resolutionGoalArcsec' });
    expect(found!.message).toMatch(/5″.*13\.8″.*3200 m.*1\.4 GHz/);
    expect(codes(makeObservation(target({ resolutionGoalArcsec: 20 })))).not.toContain(
      'RESOLUTION_NOT_REACHED',
    );
    expect(codes(makeObservation(target({ resolutionGoalArcsec: null })))).not.toContain(
      'RESOLUTION_NOT_REACHED',
    );
  });

  it('EXTENT_EXCEEDS_LARGEST_SCALE fires above 0.6 λ/B_shortest (883″ here)', () => {
    const found = check(
      makeObservation(target({ extentArcsec: 1000 })),
      'EXTENT_EXCEEDS_LARGEST_SCALE',
    );
    expect(found).toMatchObject({ level: 'warning', field: 'target.extentArcsec' });
    expect(found!.message).toMatch(/1000″.*883″/);
    expect(codes(makeObservation(target({ extentArcsec: 800 })))).not.toContain(
      'EXTENT_EXCEEDS_LARGEST_SCALE',
    );
  });

  it('MOSAIC_REQUIRED notes more than one pointing with the count', () => {
    const found = check(makeObservation(target({ extentArcsec: 3000 })), 'MOSAIC_REQUIRED');
    expect(found).toMatchObject({ level: 'note', field: 'target.extentArcsec' });
    expect(found!.message).toMatch(/3000″.*52′.*5 pointings/);
    // Half the 51.99′ primary beam is 1559.7″: one pointing up to there.
    expect(codes(makeObservation(target({ extentArcsec: 1559 })))).not.toContain('MOSAIC_REQUIRED');
    expect(codes(makeObservation(target({ extentArcsec: 1561 })))).toContain('MOSAIC_REQUIRED');
  });

  it('TIME_SHORT_OF_GOAL fires when the rms is more than 10 % above the goal', () => {
    const need = evaluateObservation(makeObservation()).onSourceHoursForGoal!;
    // rms scales as 1/√t: need/1.25 gives 1.118 × goal, need/1.2 gives 1.095 × goal.
    const found = check(makeObservation({ onSourceHours: need / 1.25 }), 'TIME_SHORT_OF_GOAL');
    expect(found).toMatchObject({ level: 'warning', field: 'onSourceHours' });
    expect(found!.message).toMatch(/3\.28 h.*11\.2 µJy.*11\.8% above.*10 µJy.*4\.1 h/);
    expect(codes(makeObservation({ onSourceHours: need / 1.2 }))).not.toContain(
      'TIME_SHORT_OF_GOAL',
    );
    expect(codes(makeObservation({ rmsGoalMicroJy: null }))).not.toContain('TIME_SHORT_OF_GOAL');
  });

  it('TIME_ABOVE_NEED fires above 1.5 × the time the goal needs', () => {
    const need = evaluateObservation(makeObservation()).onSourceHoursForGoal!;
    const found = check(makeObservation({ onSourceHours: need * 1.6 }), 'TIME_ABOVE_NEED');
    expect(found).toMatchObject({ level: 'warning', field: 'onSourceHours' });
    expect(found!.message).toMatch(/6\.56 h.*1\.6 times.*4\.1 h.*10 µJy/);
    expect(codes(makeObservation({ onSourceHours: need * 1.4 }))).not.toContain('TIME_ABOVE_NEED');
    expect(
      codes(makeObservation({ onSourceHours: need * 1.6, rmsGoalMicroJy: null })),
    ).not.toContain('TIME_ABOVE_NEED');
  });

  it('LOW_ELEVATION fires when the target culminates below 30°', () => {
    const found = check(makeObservation(target({ decDeg: -20 })), 'LOW_ELEVATION');
    expect(found).toMatchObject({ level: 'warning', field: 'target.decDeg' });
    expect(found!.message).toContain('22.7°');
    expect(codes(makeObservation(target({ decDeg: -10 })))).not.toContain('LOW_ELEVATION');
  });

  it('orders blockers, then warnings, then notes', () => {
    const all = evaluateObservation(
      makeObservation({
        frequencyGHz: 2.5,
        bandwidthMHz: 1500,
        onSourceHours: 0.01,
        target: { raDeg: 10, decDeg: -70, extentArcsec: 5000, resolutionGoalArcsec: 1 },
      }),
    ).checks;
    expect(all.map((c) => c.code)).toEqual([
      'FREQUENCY_OUTSIDE_BAND',
      'BANDWIDTH_TOO_WIDE',
      'NEVER_RISES',
      'RESOLUTION_NOT_REACHED',
      'EXTENT_EXCEEDS_LARGEST_SCALE',
      'TIME_SHORT_OF_GOAL',
      'MOSAIC_REQUIRED',
    ]);
  });
});
