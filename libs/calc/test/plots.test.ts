import { describe, expect, it } from 'vitest';
import {
  CalcInputError,
  elevationCurve,
  fringeResponse,
  fringeSpacingArcsec,
  maxElevationDeg,
  primaryBeamArcmin,
  wavelengthM,
} from '../src/index.js';

const lambdaM = wavelengthM({ frequencyHz: 1.4e9 });
const setup = { wavelengthM: lambdaM, longestBaselineM: 300, dishDiameterM: 16, beamFactor: 1.13 };

describe('fringeResponse', () => {
  const spacing = fringeSpacingArcsec({ wavelengthM: lambdaM, baselineM: 300 });
  const beam = primaryBeamArcmin({ wavelengthM: lambdaM, dishDiameterM: 16 }) * 60;

  it('spans ±1 primary beam by default, symmetric, with a point on axis', () => {
    const points = fringeResponse(setup);
    expect(points.length % 2).toBe(1);
    expect(points[0]!.offsetArcsec).toBeCloseTo(-beam, 9);
    expect(points.at(-1)!.offsetArcsec).toBeCloseTo(beam, 9);
    const centre = points[(points.length - 1) / 2]!;
    expect(centre.offsetArcsec).toBeCloseTo(0, 9);
    expect(centre).toMatchObject({ fringe: 1, envelope: 1, response: 1 });
  });

  it('samples each fringe at least 8 times', () => {
    const points = fringeResponse(setup);
    const step = points[1]!.offsetArcsec - points[0]!.offsetArcsec;
    expect(spacing / step).toBeGreaterThanOrEqual(8);
  });

  it('has fringe maxima at multiples of λ/B and the envelope at half power at ±FWHM/2', () => {
    const [atSpacing] = fringeResponse({ ...setup, halfWidthArcsec: spacing, samples: 3 });
    expect(atSpacing!.fringe).toBeCloseTo(1, 12);
    const [halfPower] = fringeResponse({ ...setup, halfWidthArcsec: beam / 2, samples: 2 });
    expect(halfPower!.envelope).toBeCloseTo(0.5, 12);
    expect(halfPower!.response).toBeCloseTo(halfPower!.fringe * 0.5, 12);
  });

  it('honours samples and rejects bad arguments', () => {
    expect(fringeResponse({ ...setup, samples: 11 })).toHaveLength(11);
    expect(() => fringeResponse({ ...setup, dishDiameterM: 0 })).toThrow(CalcInputError);
    expect(() => fringeResponse({ ...setup, samples: 1 })).toThrow(/samples/);
  });
});

describe('elevationCurve', () => {
  it('covers LST 0–24 h every quarter hour and peaks at transit (LST = RA)', () => {
    const points = elevationCurve({ latitudeDeg: 47.3, decDeg: 22.5, raDeg: 150 });
    expect(points).toHaveLength(97);
    expect(points[0]!.lstHours).toBe(0);
    expect(points.at(-1)!.lstHours).toBe(24);
    const transit = points.find((p) => p.lstHours === 10)!;
    expect(transit.elevationDeg).toBeCloseTo(
      maxElevationDeg({ latitudeDeg: 47.3, decDeg: 22.5 }),
      9,
    );
    for (const p of points) expect(p.elevationDeg).toBeLessThanOrEqual(transit.elevationDeg + 1e-9);
  });

  it('is constant at the pole and rejects bad arguments', () => {
    for (const p of elevationCurve({ latitudeDeg: 90, decDeg: 40, raDeg: 0, samples: 5 })) {
      expect(p.elevationDeg).toBeCloseTo(40, 9);
    }
    expect(() => elevationCurve({ latitudeDeg: 91, decDeg: 0, raDeg: 0 })).toThrow(CalcInputError);
  });
});
