/**
 * Our numbers against independent implementations from npm: astronomia (Meeus' algorithms),
 * astronomy-engine (IAU 2006 sidereal time) and mathjs (units, exact SI constants).
 * The sample points are fixed grids, so a failure is reproducible.
 */
import { angle, base, julian, rise, sidereal } from 'astronomia';
import { e_tilt, MakeTime, SiderealTime } from 'astronomy-engine';
import { all, create, type FactoryFunctionMap, type Unit } from 'mathjs';
import { describe, expect, it } from 'vitest';
import {
  ARCSEC_PER_RAD,
  BOLTZMANN_J_PER_K,
  HI_REST_FREQUENCY_GHZ,
  SPEED_OF_LIGHT_M_PER_S,
  angularSeparationDeg,
  brightnessTemperatureRmsK,
  effectiveAreaM2,
  gmstDeg,
  hourAngleAtElevationLimit,
  imageRmsJy,
  julianDayFromInstant,
  primaryBeamArcmin,
  resolutionArcsec,
  sefdJy,
  wavelengthM,
} from '../src/index.js';

const RAD = Math.PI / 180;

/** Signed difference a − b of two times of day in seconds, folded into (−43200, 43200]. */
function daySecondsDiff(aSeconds: number, bSeconds: number): number {
  let d = (aSeconds - bSeconds) % 86_400;
  if (d > 43_200) d -= 86_400;
  if (d <= -43_200) d += 86_400;
  return d;
}

/** Instants from 1900 to 2100, every 9.7 days plus a drifting time of day. */
const instants: Date[] = Array.from({ length: 7500 }, (_, i) => {
  const ms = Date.UTC(1900, 0, 1) + i * 9.7 * 86_400_000 + ((i * 7919) % 86_400) * 1000;
  return new Date(ms);
});

describe('GMST against astronomia and astronomy-engine', () => {
  it('matches astronomia sidereal.mean (IAU 1982, Meeus 12.2 form) within 1 ms', () => {
    let worst = 0;
    for (const date of instants) {
      const jd = julianDayFromInstant(date);
      const ours = (gmstDeg({ julianDay: jd }) / 15) * 3600;
      worst = Math.max(worst, Math.abs(daySecondsDiff(ours, sidereal.mean(jd))));
    }
    expect(worst).toBeLessThan(1e-3);
  });

  it('uses the same Julian day as astronomia for a Date', () => {
    for (const date of instants.slice(0, 500)) {
      expect(julianDayFromInstant(date)).toBeCloseTo(julian.DateToJD(date), 8);
    }
  });

  it('is within the equation of the equinoxes (1.2 s) of astronomy-engine GAST', () => {
    let worst = 0;
    for (const date of instants) {
      const ours = (gmstDeg({ julianDay: julianDayFromInstant(date) }) / 15) * 3600;
      worst = Math.max(worst, Math.abs(daySecondsDiff(ours, SiderealTime(date) * 3600)));
    }
    expect(worst).toBeLessThan(1.2);
  });

  it('is within 20 ms of astronomy-engine once its equation of the equinoxes is removed', () => {
    let worst = 0;
    for (const date of instants) {
      const ours = (gmstDeg({ julianDay: julianDayFromInstant(date) }) / 15) * 3600;
      const gmstEngine = SiderealTime(date) * 3600 - e_tilt(MakeTime(date)).ee;
      worst = Math.max(worst, Math.abs(daySecondsDiff(ours, gmstEngine)));
    }
    expect(worst).toBeLessThan(0.02);
  });
});

describe('hour angle at the elevation limit against astronomia rise.hourAngle (Meeus 15.1)', () => {
  const cases: { latitudeDeg: number; decDeg: number; elevationLimitDeg: number }[] = [];
  for (let lat = -85; lat <= 85; lat += 17) {
    for (let dec = -88; dec <= 88; dec += 11) {
      for (const elevationLimitDeg of [-0.5667, 0, 10, 15, 30, 60]) {
        cases.push({ latitudeDeg: lat, decDeg: dec, elevationLimitDeg });
      }
    }
  }

  it(`agrees on visibility and H0 for ${cases.length} site/target pairs`, () => {
    let compared = 0;
    for (const c of cases) {
      const ours = hourAngleAtElevationLimit(c);
      let theirs: number | 'never-rises' | 'never-sets';
      try {
        theirs =
          rise.hourAngle(c.latitudeDeg * RAD, c.elevationLimitDeg * RAD, c.decDeg * RAD) / RAD;
      } catch (error) {
        // astronomia: "always above horizon" when cos H < −1, "always below" when cos H > 1.
        theirs = /above/i.test(String((error as Error).message)) ? 'never-sets' : 'never-rises';
      }
      if (typeof theirs === 'number') {
        expect(ours.visibility).toBe('rises-and-sets');
        expect(ours.hourAngleDeg).toBeCloseTo(theirs, 10);
        compared++;
      } else {
        expect(ours.visibility).toBe(theirs);
      }
    }
    expect(compared).toBeGreaterThan(cases.length / 3);
  });
});

describe('angular separation against astronomia angle.sepHav and angle.sep', () => {
  const pairs: [number, number, number, number][] = [];
  for (let i = 0; i < 2000; i++) {
    pairs.push([
      (i * 137.508) % 360,
      ((i * 61.803) % 180) - 90,
      (i * 97.31) % 360,
      ((i * 23.17) % 180) - 90,
    ]);
  }

  it('matches sepHav to 1e-9° over 2000 pairs', () => {
    for (const [ra1, dec1, ra2, dec2] of pairs) {
      const ours = angularSeparationDeg({ raDeg: ra1, decDeg: dec1 }, { raDeg: ra2, decDeg: dec2 });
      const theirs = angle.sepHav(
        new base.Coord(ra1 * RAD, dec1 * RAD),
        new base.Coord(ra2 * RAD, dec2 * RAD),
      );
      expect(ours).toBeCloseTo(theirs / RAD, 9);
    }
  });

  it('matches the cosine form (angle.sep) away from 0° and 180°', () => {
    for (const [ra1, dec1, ra2, dec2] of pairs) {
      const theirs =
        angle.sep(new base.Coord(ra1 * RAD, dec1 * RAD), new base.Coord(ra2 * RAD, dec2 * RAD)) /
        RAD;
      if (theirs < 1 || theirs > 179) continue;
      const ours = angularSeparationDeg({ raDeg: ra1, decDeg: dec1 }, { raDeg: ra2, decDeg: dec2 });
      expect(ours).toBeCloseTo(theirs, 7);
    }
  });

  it('stays accurate for tiny separations, where the cosine form loses digits', () => {
    const decDeg = 20 + 1 / 3_600_000;
    const expected = decDeg - 20; // 1 mas, as the float input actually represents it
    const ours = angularSeparationDeg({ raDeg: 150, decDeg: 20 }, { raDeg: 150, decDeg });
    expect(Math.abs(ours / expected - 1)).toBeLessThan(1e-12);
  });
});

describe('units and constants against mathjs', () => {
  const math = create(all as FactoryFunctionMap);
  math.createUnit('Jy', { definition: '1e-26 W m^-2 Hz^-1', prefixes: 'short' });
  const ev = (expr: string): Unit => math.evaluate(expr) as Unit;

  it('has the exact SI constants', () => {
    expect(ev('boltzmann').toNumber('J/K')).toBe(BOLTZMANN_J_PER_K);
    expect(ev('speedOfLight').toNumber('m/s')).toBe(SPEED_OF_LIGHT_M_PER_S);
    expect(math.unit(1, 'rad').toNumber('arcsec')).toBeCloseTo(ARCSEC_PER_RAD, 9);
  });

  it('converts frequency to wavelength', () => {
    for (const mhz of [74, 327, 1420.405751768, 5000, 22235.08, 115271.2018, 345796]) {
      const theirs = ev(`speedOfLight / (${mhz} MHz)`).toNumber('m');
      expect(wavelengthM({ frequencyHz: mhz * 1e6 }) / theirs).toBeCloseTo(1, 14);
    }
    expect(ev(`speedOfLight / (${HI_REST_FREQUENCY_GHZ} GHz)`).toNumber('cm')).toBeCloseTo(
      21.1061140542,
      10,
    );
  });

  it('gives the SEFD in janskys', () => {
    for (const [tsysK, eta, dM] of [
      [50, 0.7, 25],
      [28, 0.65, 16],
      [120, 0.5, 6],
      [20, 0.8, 100],
    ] as const) {
      const area = effectiveAreaM2({ dishDiameterM: dM, apertureEfficiency: eta });
      const theirs = ev(`2 * boltzmann * ${tsysK} K / (${eta} * pi * (${dM} m)^2 / 4)`).toNumber(
        'Jy',
      );
      expect(sefdJy({ tsysK, effectiveAreaM2: area }) / theirs).toBeCloseTo(1, 13);
    }
  });

  it('gives the image rms in janskys', () => {
    const theirs = ev('400 Jy / sqrt(2 * 27 * 26 * 128 MHz * 3600 s)').toNumber('uJy');
    const ours =
      imageRmsJy({
        sefdJy: 400,
        correlatorEfficiency: 1,
        polarizations: 2,
        antennas: 27,
        bandwidthHz: 128e6,
        integrationS: 3600,
      }) * 1e6;
    expect(ours / theirs).toBeCloseTo(1, 13);
  });

  it('gives angles in arcsec and arcmin', () => {
    const lambdaM = wavelengthM({ frequencyHz: 1.4e9 });
    const theirs = math.unit(lambdaM / 3200, 'rad').toNumber('arcsec');
    expect(resolutionArcsec({ wavelengthM: lambdaM, longestBaselineM: 3200 })).toBeCloseTo(
      theirs,
      10,
    );
    const beam = math.unit((1.13 * lambdaM) / 16, 'rad').toNumber('arcmin');
    expect(primaryBeamArcmin({ wavelengthM: lambdaM, dishDiameterM: 16 })).toBeCloseTo(beam, 10);
  });

  it('gives the Rayleigh–Jeans brightness temperature in kelvin', () => {
    for (const [ghz, beamArcsec, jy] of [
      [1.4, 1, 1],
      [1.4, 13.8, 1e-5],
      [115.27, 0.5, 2e-3],
    ] as const) {
      const thetaRad = beamArcsec / ARCSEC_PER_RAD;
      const omega = (Math.PI * thetaRad ** 2) / (4 * Math.log(2));
      const theirs = ev(
        `${jy} Jy * (speedOfLight / (${ghz} GHz))^2 / (2 * boltzmann * ${omega})`,
      ).toNumber('K');
      const ours = brightnessTemperatureRmsK({
        rmsJy: jy,
        wavelengthM: wavelengthM({ frequencyHz: ghz * 1e9 }),
        beamFwhmArcsec: beamArcsec,
      });
      expect(ours / theirs).toBeCloseTo(1, 12);
    }
  });
});
