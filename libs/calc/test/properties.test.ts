/** Property tests (fast-check): scaling laws, inverses, and no NaN/Infinity from any valid input. */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  SPEED_OF_LIGHT_M_PER_S,
  elevationAtHourAngleDeg,
  evaluateObservation,
  fringeSpacingArcsec,
  hourAngleAtElevationLimit,
  imageRmsJy,
  integrationSForRms,
  lstWindow,
  primaryBeamArcmin,
  skyFrequencyHz,
  validateObservationInput,
  type ObservationInput,
} from '../src/index.js';

/** |a/b − 1| ≤ 1e-12 */
const expectRatioOne = (a: number, b: number): void => {
  expect(Math.abs(a / b - 1)).toBeLessThanOrEqual(1e-12);
};

/** Log-uniform between min and max, with both ends themselves drawn now and then. */
const logUniform = (min: number, max: number): fc.Arbitrary<number> =>
  fc.oneof(
    { arbitrary: fc.constantFrom(min, max), weight: 1 },
    {
      arbitrary: fc
        .double({ min: Math.log10(min), max: Math.log10(max), noNaN: true })
        .map((e) => Math.min(max, Math.max(min, 10 ** e))),
      weight: 4,
    },
  );

const setupArb = fc.record({
  sefdJy: logUniform(1e-3, 1e6),
  correlatorEfficiency: fc.double({ min: 0.001, max: 1, noNaN: true }),
  polarizations: fc.constantFrom(1 as const, 2 as const),
  antennas: fc.integer({ min: 2, max: 100_000 }),
  bandwidthHz: logUniform(1, 1e12),
});
const secondsArb = logUniform(1e-3, 1e10);
const factorArb = fc.double({ min: 1.5, max: 1e4, noNaN: true });

describe('radiometer equation', () => {
  it('rms ∝ 1/√t', () => {
    fc.assert(
      fc.property(setupArb, secondsArb, factorArb, (setup, t, k) => {
        expectRatioOne(
          imageRmsJy({ ...setup, integrationS: k * t }) * Math.sqrt(k),
          imageRmsJy({ ...setup, integrationS: t }),
        );
      }),
    );
  });

  it('rms ∝ 1/√Δν', () => {
    fc.assert(
      fc.property(setupArb, secondsArb, factorArb, (setup, t, k) => {
        const wide = imageRmsJy({ ...setup, bandwidthHz: setup.bandwidthHz * k, integrationS: t });
        expectRatioOne(wide * Math.sqrt(k), imageRmsJy({ ...setup, integrationS: t }));
      }),
    );
  });

  it('rms ∝ 1/√(N(N−1))', () => {
    fc.assert(
      fc.property(setupArb, secondsArb, fc.integer({ min: 2, max: 100_000 }), (setup, t, n2) => {
        const n1 = setup.antennas;
        const rms1 = imageRmsJy({ ...setup, integrationS: t });
        const rms2 = imageRmsJy({ ...setup, antennas: n2, integrationS: t });
        expectRatioOne(rms1 / rms2, Math.sqrt((n2 * (n2 - 1)) / (n1 * (n1 - 1))));
      }),
    );
  });

  it('two polarisations are √2 better than one', () => {
    fc.assert(
      fc.property(setupArb, secondsArb, (setup, t) => {
        const one = imageRmsJy({ ...setup, polarizations: 1, integrationS: t });
        const two = imageRmsJy({ ...setup, polarizations: 2, integrationS: t });
        expectRatioOne(one / two, Math.SQRT2);
      }),
    );
  });

  it('time for a goal reaches exactly that goal', () => {
    fc.assert(
      fc.property(setupArb, logUniform(1e-9, 1), (setup, rmsJy) => {
        const t = integrationSForRms({ ...setup, rmsJy });
        expectRatioOne(imageRmsJy({ ...setup, integrationS: t }), rmsJy);
      }),
    );
  });
});

describe('geometry', () => {
  const lengthArb = logUniform(0.01, 1e7);
  const wavelengthArb = logUniform(1e-4, 1e2);

  it('the fringe spacing halves when the baseline doubles', () => {
    fc.assert(
      fc.property(wavelengthArb, lengthArb, (wavelengthM, baselineM) => {
        const once = fringeSpacingArcsec({ wavelengthM, baselineM });
        expectRatioOne(fringeSpacingArcsec({ wavelengthM, baselineM: 2 * baselineM }), once / 2);
      }),
    );
  });

  it('the field of view halves when the dish diameter doubles', () => {
    fc.assert(
      fc.property(
        wavelengthArb,
        lengthArb,
        fc.double({ min: 0.5, max: 3, noNaN: true }),
        (wavelengthM, d, beamFactor) => {
          const once = primaryBeamArcmin({ wavelengthM, dishDiameterM: d, beamFactor });
          expectRatioOne(
            primaryBeamArcmin({ wavelengthM, dishDiameterM: 2 * d, beamFactor }),
            once / 2,
          );
        },
      ),
    );
  });
});

describe('lines and visibility', () => {
  it('the relativistic sky frequency is the geometric mean of the radio and optical ones', () => {
    const c = SPEED_OF_LIGHT_M_PER_S / 1000;
    fc.assert(
      fc.property(
        logUniform(1e6, 1e12),
        fc.double({ min: -0.99 * c, max: 0.99 * c, noNaN: true }),
        (rest, v) => {
          const at = (convention: 'radio' | 'optical' | 'relativistic') =>
            skyFrequencyHz({ restFrequencyHz: rest, velocityKmS: v, convention });
          expect(
            Math.abs(at('relativistic') / Math.sqrt(at('radio') * at('optical')) - 1),
          ).toBeLessThan(1e-12);
        },
      ),
    );
  });

  const siteArb = fc.record({
    latitudeDeg: fc.double({ min: -89, max: 89, noNaN: true }),
    decDeg: fc.double({ min: -89, max: 89, noNaN: true }),
    elevationLimitDeg: fc.double({ min: -10, max: 80, noNaN: true }),
  });

  it('the target is at the limit at ±H0', () => {
    fc.assert(
      fc.property(siteArb, (site) => {
        const { visibility, hourAngleDeg } = hourAngleAtElevationLimit(site);
        fc.pre(visibility === 'rises-and-sets' && hourAngleDeg > 1e-3 && hourAngleDeg < 180 - 1e-3);
        for (const h of [hourAngleDeg, -hourAngleDeg]) {
          expect(elevationAtHourAngleDeg({ ...site, hourAngleDeg: h })).toBeCloseTo(
            site.elevationLimitDeg,
            6,
          );
        }
      }),
    );
  });

  it('the LST window lasts hoursAboveLimit', () => {
    fc.assert(
      fc.property(
        siteArb,
        fc.double({ min: 0, max: 360, maxExcluded: true, noNaN: true }),
        (site, raDeg) => {
          const w = lstWindow({ ...site, raDeg });
          fc.pre(w.lstRiseHours !== null && w.lstSetHours !== null);
          const length = (((w.lstSetHours! - w.lstRiseHours!) % 24) + 24) % 24;
          expect(
            Math.min(
              Math.abs(length - w.hoursAboveLimit),
              24 - Math.abs(length - w.hoursAboveLimit),
            ),
          ).toBeLessThan(1e-9);
        },
      ),
    );
  });
});

const C_KM_S = SPEED_OF_LIGHT_M_PER_S / 1000;
const nullable = <T>(arb: fc.Arbitrary<T>): fc.Arbitrary<T | null> =>
  fc.oneof({ arbitrary: fc.constant(null), weight: 1 }, { arbitrary: arb, weight: 3 });
const ordered = (min: number, max: number, strict: boolean): fc.Arbitrary<[number, number]> =>
  fc
    .tuple(logUniform(min, max), logUniform(min, max))
    .filter(([a, b]) => !strict || a !== b)
    .map(([a, b]) => (a <= b ? [a, b] : [b, a]));

const lineArb = fc.oneof(
  fc.record({
    restGHz: logUniform(1e-6, 1e5),
    redshift: fc.double({ min: -0.999, max: 1e4, noNaN: true }),
  }),
  fc.record({
    restGHz: logUniform(1e-6, 1e5),
    velocityKmS: fc.double({ min: -0.999 * C_KM_S, max: 0.999 * C_KM_S, noNaN: true }),
    convention: fc.constantFrom('radio' as const, 'optical' as const, 'relativistic' as const),
  }),
);

/** Any valid observation, with every number drawn across the whole range validation accepts. */
const observationArb: fc.Arbitrary<ObservationInput> = fc
  .record({
    array: fc.record({
      antennas: fc.oneof(fc.integer({ min: 2, max: 64 }), fc.integer({ min: 2, max: 1_000_000 })),
      dishDiameterM: logUniform(0.01, 1e4),
      latitudeDeg: fc.double({ min: -90, max: 90, noNaN: true }),
      longitudeDeg: fc.double({ min: -180, max: 180, noNaN: true }),
      elevationLimitDeg: fc.double({
        min: -90,
        max: 90,
        minExcluded: true,
        maxExcluded: true,
        noNaN: true,
      }),
      correlatorEfficiency: logUniform(1e-3, 1),
      overheadFraction: fc.double({ min: 0, max: 10, noNaN: true }),
      beamFactor: nullable(fc.double({ min: 0.5, max: 3, noNaN: true })),
    }),
    baselines: ordered(0.01, 1e10, false),
    bandEdges: ordered(1e-6, 1e5, true),
    band: fc.record({
      tsysK: logUniform(0.01, 1e6),
      apertureEfficiency: logUniform(1e-3, 1),
      maxBandwidthMHz: logUniform(1e-300, 1e6),
    }),
    frequency: fc.oneof(
      logUniform(1e-6, 1e5).map((frequencyGHz) => ({ frequencyGHz })),
      lineArb.map((line) => ({ line })),
    ),
    bandwidthMHz: logUniform(1e-6, 1e6),
    polarizations: fc.constantFrom(1 as const, 2 as const),
    target: fc.record({
      raDeg: fc.double({ min: 0, max: 360, maxExcluded: true, noNaN: true }),
      decDeg: fc.double({ min: -90, max: 90, noNaN: true }),
      extentArcsec: fc.oneof(fc.constant(0), logUniform(1e-300, 648_000)),
      resolutionGoalArcsec: nullable(logUniform(1e-300, 648_000)),
    }),
    rmsGoalMicroJy: nullable(logUniform(1e-6, 1e15)),
    onSourceHours: nullable(logUniform(1e-6, 1e6)),
  })
  .map(
    ({ baselines, bandEdges, band, frequency, ...rest }) =>
      ({
        ...rest,
        ...frequency,
        configuration: { shortestBaselineM: baselines[0], longestBaselineM: baselines[1] },
        band: { ...band, minGHz: bandEdges[0], maxGHz: bandEdges[1] },
      }) as ObservationInput,
  )
  // A line can still shift out of the 1 kHz–100 THz the calculator handles; that input is invalid.
  .filter((input) => validateObservationInput(input).length === 0);

function everyNumber(value: unknown, visit: (n: number, path: string) => void, path = ''): void {
  if (typeof value === 'number') visit(value, path);
  else if (Array.isArray(value)) value.forEach((v, i) => everyNumber(v, visit, `${path}[${i}]`));
  else if (typeof value === 'object' && value !== null) {
    for (const [k, v] of Object.entries(value)) everyNumber(v, visit, path ? `${path}.${k}` : k);
  }
}

describe('evaluateObservation over the whole valid input space', () => {
  it('never answers NaN or Infinity, not even in a message', () => {
    fc.assert(
      fc.property(observationArb, (input) => {
        const result = evaluateObservation(input);
        everyNumber(result, (n, path) => {
          if (!Number.isFinite(n)) throw new Error(`${path} is ${n}`);
        });
        for (const c of result.checks) expect(c.message).not.toMatch(/NaN|Infinity/);
        expect(result.pointings).toBeGreaterThanOrEqual(1);
        expect(Number.isInteger(result.pointings)).toBe(true);
      }),
      { numRuns: 1500 },
    );
  }, 30_000);
});
