/**
 * Where and when the target is up (SCIENCE.md "Where and when the target is up"): Julian day,
 * sidereal time (IAU 1982, Meeus eq. 12.4), elevations, the hour angle at the elevation limit
 * (Meeus eq. 15.1), LST windows and angular separations (haversine form, Meeus ch. 17).
 * Angles in degrees, hour angles in degrees, sidereal times in hours.
 */
import { DEG_PER_RAD } from './constants.js';
import { CalcInputError } from './errors.js';

const RAD_PER_DEG = 1 / DEG_PER_RAD;
const MS_PER_DAY = 86_400_000;
/** Julian day of the Unix epoch, 1970-01-01T00:00:00Z. */
const JD_UNIX_EPOCH = 2_440_587.5;
const JD_J2000 = 2_451_545.0;

/** Reduce to [0, period); float noise can make x − period·floor(x/period) equal period itself. */
function wrap(x: number, period: number): number {
  const r = x - period * Math.floor(x / period);
  return r >= period ? 0 : r;
}

export function wrapHours(hours: number): number {
  return wrap(hours, 24);
}

export function wrapDegrees(deg: number): number {
  return wrap(deg, 360);
}

/** An ISO 8601 instant: a date alone (midnight UTC) or a date-time with Z or an explicit offset. */
const ISO_INSTANT =
  /^\d{4}-\d{2}-\d{2}(?:T\d{2}:\d{2}(?::\d{2}(?:\.\d+)?)?(?:Z|[+-]\d{2}:\d{2}))?$/;

/**
 * Julian day (UT) of an instant passed in by the caller: a `Date` or an ISO 8601 string.
 * A date-time string must carry `Z` or an offset: JavaScript reads one without as local time,
 * which would make the answer depend on the machine. UT1 − UTC (< 0.9 s) is neglected.
 */
export function julianDayFromInstant(instant: Date | string): number {
  let ms: number;
  if (typeof instant === 'string') {
    if (!ISO_INSTANT.test(instant)) {
      throw new CalcInputError([
        {
          path: 'instant',
          message: `"${instant}" is not an ISO 8601 instant with a time zone (e.g. 2026-03-01T21:30:00Z).`,
        },
      ]);
    }
    ms = Date.parse(instant);
  } else {
    ms = instant.getTime();
  }
  if (!Number.isFinite(ms)) {
    throw new CalcInputError([{ path: 'instant', message: 'The instant is not a valid date.' }]);
  }
  return ms / MS_PER_DAY + JD_UNIX_EPOCH;
}

/**
 * Greenwich mean sidereal time, IAU 1982 (Meeus eq. 12.4), in degrees [0, 360):
 * θ0 = 280.46061837° + 360.98564736629°·d + 0.000387933°·T² − T³/38710000°, d = JD − 2451545.0.
 * The 360°·d term is taken on the day fraction only, which keeps full precision far from J2000.
 */
export function gmstDeg({ julianDay }: { julianDay: number }): number {
  const d = julianDay - JD_J2000;
  const t = d / 36_525;
  const theta =
    280.46061837 +
    360 * (d - Math.floor(d)) +
    0.98564736629 * d +
    0.000387933 * t * t -
    (t * t * t) / 38_710_000;
  return wrapDegrees(theta);
}

/** Local (mean) sidereal time for an east longitude, in hours [0, 24). */
export function localSiderealTimeHours({
  julianDay,
  eastLongitudeDeg,
}: {
  julianDay: number;
  eastLongitudeDeg: number;
}): number {
  return wrapHours((gmstDeg({ julianDay }) + eastLongitudeDeg) / 15);
}

/** Elevation at upper culmination, 90° − |φ − δ|. */
export function maxElevationDeg({
  latitudeDeg,
  decDeg,
}: {
  latitudeDeg: number;
  decDeg: number;
}): number {
  return 90 - Math.abs(latitudeDeg - decDeg);
}

/** Elevation of a target at a given hour angle: sin h = sin φ sin δ + cos φ cos δ cos H. */
export function elevationAtHourAngleDeg({
  latitudeDeg,
  decDeg,
  hourAngleDeg,
}: {
  latitudeDeg: number;
  decDeg: number;
  hourAngleDeg: number;
}): number {
  const phi = latitudeDeg * RAD_PER_DEG;
  const dec = decDeg * RAD_PER_DEG;
  const sinH =
    Math.sin(phi) * Math.sin(dec) +
    Math.cos(phi) * Math.cos(dec) * Math.cos(hourAngleDeg * RAD_PER_DEG);
  return Math.asin(Math.min(1, Math.max(-1, sinH))) * DEG_PER_RAD;
}

export type Visibility = 'rises-and-sets' | 'never-rises' | 'never-sets';

export interface SiteAndTarget {
  latitudeDeg: number;
  decDeg: number;
  elevationLimitDeg: number;
}

/**
 * Hour angle H0 at which the target crosses the elevation limit e (Meeus eq. 15.1):
 * cos H0 = (sin e − sin φ sin δ) / (cos φ cos δ). Above 1 the target never rises (H0 = 0°);
 * below −1 it never sets (H0 = 180°). At a pole or for a target at a pole (cos φ cos δ ≈ 0) the
 * elevation does not change with hour angle, and it is compared with the limit directly.
 */
export function hourAngleAtElevationLimit({
  latitudeDeg,
  decDeg,
  elevationLimitDeg,
}: SiteAndTarget): { visibility: Visibility; hourAngleDeg: number } {
  const phi = latitudeDeg * RAD_PER_DEG;
  const dec = decDeg * RAD_PER_DEG;
  const numerator = Math.sin(elevationLimitDeg * RAD_PER_DEG) - Math.sin(phi) * Math.sin(dec);
  const denominator = Math.cos(phi) * Math.cos(dec);
  if (Math.abs(denominator) < 1e-12) {
    return numerator > 0
      ? { visibility: 'never-rises', hourAngleDeg: 0 }
      : { visibility: 'never-sets', hourAngleDeg: 180 };
  }
  const cosH0 = numerator / denominator;
  if (cosH0 > 1) return { visibility: 'never-rises', hourAngleDeg: 0 };
  if (cosH0 < -1) return { visibility: 'never-sets', hourAngleDeg: 180 };
  return { visibility: 'rises-and-sets', hourAngleDeg: Math.acos(cosH0) * DEG_PER_RAD };
}

/** Sidereal hours above the elevation limit per sidereal day, 2 H0 / 15° (0 to 24). */
export function hoursAboveElevationLimit(site: SiteAndTarget): number {
  return (2 * hourAngleAtElevationLimit(site).hourAngleDeg) / 15;
}

export interface LstWindow {
  visibility: Visibility;
  hoursAboveLimit: number;
  /** LST of rising through the limit, RA − H0, in [0, 24); null when the target never rises or never sets. */
  lstRiseHours: number | null;
  /** LST of setting through the limit, RA + H0, in [0, 24); null when the target never rises or never sets. */
  lstSetHours: number | null;
}

/** The LST window during which the target is above the elevation limit. */
export function lstWindow(site: SiteAndTarget & { raDeg: number }): LstWindow {
  const { visibility, hourAngleDeg } = hourAngleAtElevationLimit(site);
  const hoursAboveLimit = (2 * hourAngleDeg) / 15;
  if (visibility !== 'rises-and-sets') {
    return { visibility, hoursAboveLimit, lstRiseHours: null, lstSetHours: null };
  }
  return {
    visibility,
    hoursAboveLimit,
    lstRiseHours: wrapHours((site.raDeg - hourAngleDeg) / 15),
    lstSetHours: wrapHours((site.raDeg + hourAngleDeg) / 15),
  };
}

export interface EquatorialPosition {
  raDeg: number;
  decDeg: number;
}

/**
 * Angular separation, haversine form (Meeus eq. 17.5):
 * hav d = hav Δδ + cos δ1 cos δ2 hav Δα. Stable for small separations, unlike the cosine form.
 */
export function angularSeparationDeg(a: EquatorialPosition, b: EquatorialPosition): number {
  const dec1 = a.decDeg * RAD_PER_DEG;
  const dec2 = b.decDeg * RAD_PER_DEG;
  // Differences are taken in degrees before converting, so tiny separations keep their digits.
  const sinHalfDDec = Math.sin(((b.decDeg - a.decDeg) * RAD_PER_DEG) / 2);
  const sinHalfDRa = Math.sin(((b.raDeg - a.raDeg) * RAD_PER_DEG) / 2);
  const hav = sinHalfDDec * sinHalfDDec + Math.cos(dec1) * Math.cos(dec2) * sinHalfDRa * sinHalfDRa;
  return 2 * Math.asin(Math.sqrt(Math.min(1, hav))) * DEG_PER_RAD;
}
