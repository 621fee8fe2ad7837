/**
 * Published check values (SCIENCE.md "Published checks for the tests") and more from the same
 * sources. Each row names its source; "from memory" marks values recalled, not re-read.
 */
import { describe, expect, it } from 'vitest';
import {
  AIRY_FIRST_NULL_FACTOR,
  AIRY_HALF_POWER_FACTOR,
  HI_REST_FREQUENCY_GHZ,
  angularSeparationDeg,
  brightnessTemperatureRmsK,
  channelWidthKmS,
  dickeRmsK,
  effectiveAreaM2,
  gmstDeg,
  hourAngleAtElevationLimit,
  imageRmsJy,
  integrationSForRms,
  julianDayFromInstant,
  sefdJy,
  wavelengthM,
} from '../src/index.js';

const hms = (h: number, m: number, s: number): number => h + m / 60 + s / 3600;
const gmstHours = (julianDay: number): number => gmstDeg({ julianDay }) / 15;

/** J1 by its power series Σ (−1)^k (x/2)^(2k+1) / (k!(k+1)!), ample for x < 5. */
function besselJ1(x: number): number {
  let term = x / 2;
  let sum = term;
  for (let k = 1; k < 40; k++) {
    term *= -((x / 2) ** 2) / (k * (k + 1));
    sum += term;
  }
  return sum;
}

function bisect(f: (x: number) => number, lo: number, hi: number): number {
  for (let i = 0; i < 200; i++) {
    const mid = (lo + hi) / 2;
    if (f(lo) * f(mid) <= 0) hi = mid;
    else lo = mid;
  }
  return (lo + hi) / 2;
}

const radiometer = {
  sefdJy: 400,
  correlatorEfficiency: 1,
  polarizations: 2 as const,
  antennas: 27,
  bandwidthHz: 128e6,
};

interface Row {
  check: string;
  actual: () => number;
  expected: number;
  tolerance: number;
}

const rows: Row[] = [
  // SEFD: formula with exact k (SCIENCE.md table)
  {
    check: 'A_eff for η_a 0.7, D 25 m / m²',
    actual: () => effectiveAreaM2({ dishDiameterM: 25, apertureEfficiency: 0.7 }),
    expected: 343.611696,
    tolerance: 1e-6,
  },
  // SEFD: formula with exact k (SCIENCE.md table)
  {
    check: 'SEFD for T_sys 50 K, η_a 0.7, D 25 m / Jy',
    actual: () =>
      sefdJy({
        tsysK: 50,
        effectiveAreaM2: effectiveAreaM2({ dishDiameterM: 25, apertureEfficiency: 0.7 }),
      }),
    expected: 401.805007,
    tolerance: 1e-6,
  },
  // Image rms: Wrobel & Walker 1999 form (SCIENCE.md table)
  {
    check: 'image rms, SEFD 400 Jy, N 27, 128 MHz, 3600 s, 2 pol / µJy',
    actual: () => imageRmsJy({ ...radiometer, integrationS: 3600 }) * 1e6,
    expected: 15.72607,
    tolerance: 1e-5,
  },
  // Time for rms: inverse of the same (SCIENCE.md table)
  {
    check: 'time for 10 µJy, same setup / s',
    actual: () => integrationSForRms({ ...radiometer, rmsJy: 10e-6 }),
    expected: 8903.134,
    tolerance: 1e-3,
  },
  // Airy half-power width: Born & Wolf, half power of (2 J1(x)/x)², here solved numerically
  {
    check: 'Airy half-power width / (λ/D), numerically',
    actual: () => (2 * bisect((x) => (2 * besselJ1(x)) / x - Math.SQRT1_2, 1, 2)) / Math.PI,
    expected: 1.02899,
    tolerance: 5e-6,
  },
  // Airy half-power width: Born & Wolf (SCIENCE.md table), the constant we export
  {
    check: 'AIRY_HALF_POWER_FACTOR',
    actual: () => AIRY_HALF_POWER_FACTOR,
    expected: 1.02899,
    tolerance: 0,
  },
  // Airy first null: Born & Wolf; first zero of J1 (3.83171) over π, solved numerically
  {
    check: 'Airy first null / (λ/D), numerically, equals the exported constant',
    actual: () => bisect(besselJ1, 3, 4.5) / Math.PI,
    expected: AIRY_FIRST_NULL_FACTOR,
    tolerance: 5e-6,
  },
  // Dicke radiometer: Dicke 1946 (SCIENCE.md table)
  {
    check: 'Dicke ΔT, T_sys 100 K, 1 MHz, 1 s / K',
    actual: () => dickeRmsK({ tsysK: 100, bandwidthHz: 1e6, integrationS: 1 }),
    expected: 0.1,
    tolerance: 1e-12,
  },
  // GMST: Meeus, Astronomical Algorithms, Example 12.a (SCIENCE.md table)
  {
    check: 'GMST 1987 April 10, 0h UT / h',
    actual: () => gmstHours(2446895.5),
    expected: hms(13, 10, 46.3668),
    tolerance: 1e-4 / 3600,
  },
  // GMST: Meeus, Example 12.b (value given in the brief; recalled from memory, not re-read)
  {
    check: 'GMST 1987 April 10, 19:21:00 UT / h',
    actual: () => gmstHours(julianDayFromInstant('1987-04-10T19:21:00Z')),
    expected: hms(8, 34, 57.0896),
    tolerance: 1e-3 / 3600,
  },
  // Julian day of Example 12.a: Meeus, Example 12.a (JD 2446895.5, SCIENCE.md table)
  {
    check: 'JD of 1987 April 10, 0h UT',
    actual: () => julianDayFromInstant('1987-04-10'),
    expected: 2446895.5,
    tolerance: 0,
  },
  // Julian day: Meeus, Example 7.a, 1957 October 4.81 = JD 2436116.31 (from memory)
  {
    check: 'JD of 1957 October 4.81 (19:26:24 UT)',
    actual: () => julianDayFromInstant(new Date(Date.UTC(1957, 9, 4, 19, 26, 24))),
    expected: 2436116.31,
    tolerance: 1e-8,
  },
  // Julian day: J2000.0 = 2000 January 1.5 = JD 2451545.0 (Meeus ch. 7, by definition)
  {
    check: 'JD of J2000.0',
    actual: () => julianDayFromInstant('2000-01-01T12:00:00Z'),
    expected: 2451545.0,
    tolerance: 0,
  },
  // Hour angle at limit: Meeus, Example 15.a (Venus at Boston, SCIENCE.md table)
  {
    check: 'H0 for φ 42.3333°, e −0.5667°, δ 18.44092° / °',
    actual: () =>
      hourAngleAtElevationLimit({
        latitudeDeg: 42.3333,
        decDeg: 18.44092,
        elevationLimitDeg: -0.5667,
      }).hourAngleDeg,
    expected: 108.5344,
    tolerance: 1e-4,
  },
  // Angular separation: Meeus, Example 17.a, Arcturus–Spica (from memory)
  {
    check: 'separation Arcturus (213.9154°, +19.1825°) – Spica (201.2983°, −11.1614°) / °',
    actual: () =>
      angularSeparationDeg(
        { raDeg: 213.9154, decDeg: 19.1825 },
        { raDeg: 201.2983, decDeg: -11.1614 },
      ),
    expected: 32.793,
    tolerance: 1e-4,
  },
  // Rayleigh–Jeans: formula with exact k (SCIENCE.md table)
  {
    check: 'T_b for 1 Jy/beam, 1.4 GHz, 1″ beam / K',
    actual: () =>
      brightnessTemperatureRmsK({
        rmsJy: 1,
        wavelengthM: wavelengthM({ frequencyHz: 1.4e9 }),
        beamFwhmArcsec: 1,
      }),
    expected: 623530.79,
    tolerance: 0.01,
  },
  // 21-cm wavelength: c/ν of Hellwig et al. 1970's frequency (SCIENCE.md table)
  {
    check: 'λ of 1420.405751768 MHz / cm',
    actual: () => wavelengthM({ frequencyHz: HI_REST_FREQUENCY_GHZ * 1e9 }) * 100,
    expected: 21.1061140542,
    tolerance: 1e-10,
  },
  // Channel width: Δv = c Δν/ν = λ Δν, so 1 MHz at 21.1061140542 cm is 211.061140542 km/s (row above)
  {
    check: '1 MHz channel at the HI line / km/s',
    actual: () =>
      channelWidthKmS({ channelWidthHz: 1e6, frequencyHz: HI_REST_FREQUENCY_GHZ * 1e9 }),
    expected: 211.061140542,
    tolerance: 1e-9,
  },
];

describe('published check values', () => {
  it.each(rows)('$check', ({ actual, expected, tolerance }) => {
    expect(Math.abs(actual() - expected)).toBeLessThanOrEqual(tolerance);
  });
});
