import { angle, base } from 'astronomia';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { angularSeparationDeg, primaryBeamArcmin, wavelengthM } from '../src/index.js';

/*
 * Angular separation beyond the fixed checks elsewhere: Meeus, Astronomical Algorithms (2nd ed.),
 * example 17.a (Arcturus–Spica, 32.7930°) is a row of published.test.ts, and 2000 fixed pairs are
 * compared with astronomia in reference-libraries.test.ts. Here: random pairs (fast-check) against
 * astronomia's haversine separation (angle.sepHav, its port of Meeus eq. 17.5), down to the
 * arcminute scale the overlap warnings between proposals work at.
 */
const RAD = Math.PI / 180;
const theirsDeg = (ra1: number, dec1: number, ra2: number, dec2: number) =>
  angle.sepHav(new base.Coord(ra1 * RAD, dec1 * RAD), new base.Coord(ra2 * RAD, dec2 * RAD)) / RAD;

/*
 * astronomia's haversine is (1 − cos θ)/2, which keeps only about 1e-8 rad (≈ 6e-7°) near zero
 * separation, so that is the agreement to expect (3.6 milliarcseconds, far below any beam here).
 */
const TOLERANCE_DEG = 1e-6;

const ra = fc.double({ min: 0, max: 360, noNaN: true, maxExcluded: true });
const dec = fc.double({ min: -90, max: 90, noNaN: true });

describe('angularSeparationDeg against astronomia angle.sepHav (fast-check)', () => {
  it('agrees to 1e-6° over random pairs anywhere on the sky', () => {
    fc.assert(
      fc.property(ra, dec, ra, dec, (ra1, dec1, ra2, dec2) => {
        const ours = angularSeparationDeg(
          { raDeg: ra1, decDeg: dec1 },
          { raDeg: ra2, decDeg: dec2 },
        );
        expect(Math.abs(ours - theirsDeg(ra1, dec1, ra2, dec2))).toBeLessThanOrEqual(TOLERANCE_DEG);
      }),
      { numRuns: 2000 },
    );
  });

  it('agrees to 1e-6° for pairs under 10′ apart (the overlap scale)', () => {
    const offset = fc.double({ min: -10 / 60, max: 10 / 60, noNaN: true });
    const midDec = fc.double({ min: -80, max: 80, noNaN: true });
    fc.assert(
      fc.property(ra, midDec, offset, offset, (ra1, dec1, dRa, dDec) => {
        const ra2 = ra1 + dRa;
        const dec2 = dec1 + dDec;
        const ours = angularSeparationDeg(
          { raDeg: ra1, decDeg: dec1 },
          { raDeg: ra2, decDeg: dec2 },
        );
        const theirs = theirsDeg(ra1, dec1, ra2, dec2);
        expect(Math.abs(ours - theirs)).toBeLessThanOrEqual(TOLERANCE_DEG);
      }),
      { numRuns: 2000 },
    );
  });

  it('is symmetric, zero for a point with itself, and at most 180°', () => {
    fc.assert(
      fc.property(ra, dec, ra, dec, (ra1, dec1, ra2, dec2) => {
        const a = { raDeg: ra1, decDeg: dec1 };
        const b = { raDeg: ra2, decDeg: dec2 };
        expect(angularSeparationDeg(a, b)).toBeCloseTo(angularSeparationDeg(b, a), 12);
        expect(angularSeparationDeg(a, a)).toBe(0);
        expect(angularSeparationDeg(a, b)).toBeLessThanOrEqual(180);
      }),
    );
  });

  it('gives 1′ along a meridian exactly (a declination offset is a great-circle arc)', () => {
    expect(
      angularSeparationDeg({ raDeg: 150, decDeg: -30 }, { raDeg: 150, decDeg: -30 + 1 / 60 }) * 60,
    ).toBeCloseTo(1, 9);
  });
});

describe('the overlap rule’s scale', () => {
  // 1.13 λ/D, λ = c/ν: 6 GHz on 12 m dishes gives 16.175′ (computed by hand from the formula).
  it('puts 1′ inside and 5° outside the half-power radius of a 12 m dish at 6 GHz', () => {
    const beam = primaryBeamArcmin({
      wavelengthM: wavelengthM({ frequencyHz: 6e9 }),
      dishDiameterM: 12,
    });
    expect(beam).toBeCloseTo(16.175, 3);
    const near =
      angularSeparationDeg({ raDeg: 150, decDeg: -30 }, { raDeg: 150, decDeg: -30 + 1 / 60 }) * 60;
    const far = angularSeparationDeg({ raDeg: 150, decDeg: -30 }, { raDeg: 150, decDeg: -25 }) * 60;
    expect(near).toBeLessThan(beam / 2);
    expect(far).toBeGreaterThan(beam / 2);
  });
});
