/** Sample arrays for the browser's plots. Pure: the same arguments give the same points. */
import { DEFAULT_BEAM_FACTOR } from './constants.js';
import { CalcInputError, type InputIssue } from './errors.js';
import { fringeSpacingArcsec, primaryBeamArcmin } from './geometry.js';
import { elevationAtHourAngleDeg } from './sky.js';

export interface FringePoint {
  offsetArcsec: number;
  /** cos(2π θ B/λ): the fringe of the longest baseline, period λ/B. */
  fringe: number;
  /** Primary-beam attenuation at that offset, 1 on axis. */
  envelope: number;
  /** fringe · envelope: what a point source at that offset contributes. */
  response: number;
}

export interface FringeResponseOptions {
  wavelengthM: number;
  longestBaselineM: number;
  dishDiameterM: number;
  beamFactor?: number;
  /** Half the plotted range; defaults to the primary beam FWHM, so the plot spans ±1 beam. */
  halfWidthArcsec?: number;
  /**
   * Number of points (odd numbers put one on axis). Defaults to 8 per fringe across the range,
   * at least 201 and at most 10 001; past that cap the fringes alias, so narrow halfWidthArcsec.
   */
  samples?: number;
}

const MAX_DEFAULT_SAMPLES = 10_001;

function requirePositive(issues: InputIssue[], path: string, value: number | undefined): void {
  if (value !== undefined && !(Number.isFinite(value) && value > 0)) {
    issues.push({ path, message: `${path} must be a positive finite number, got ${value}.` });
  }
}

function requireSamples(issues: InputIssue[], samples: number | undefined): void {
  if (samples !== undefined && !(Number.isInteger(samples) && samples >= 2 && samples <= 1e6)) {
    issues.push({
      path: 'samples',
      message: `samples must be a whole number from 2 to 1e6, got ${samples}.`,
    });
  }
}

/**
 * The fringe pattern of spacing λ/B under the primary-beam envelope.
 *
 * The envelope is modelled as a Gaussian of FWHM = the primary beam (beamFactor · λ/D),
 * exp(−4 ln 2 · θ² / FWHM²): the usual approximation of a tapered dish's main lobe, without
 * the Airy sidelobes.
 */
export function fringeResponse(options: FringeResponseOptions): FringePoint[] {
  const {
    wavelengthM,
    longestBaselineM,
    dishDiameterM,
    beamFactor = DEFAULT_BEAM_FACTOR,
  } = options;
  const issues: InputIssue[] = [];
  requirePositive(issues, 'wavelengthM', wavelengthM);
  requirePositive(issues, 'longestBaselineM', longestBaselineM);
  requirePositive(issues, 'dishDiameterM', dishDiameterM);
  requirePositive(issues, 'beamFactor', beamFactor);
  requirePositive(issues, 'halfWidthArcsec', options.halfWidthArcsec);
  requireSamples(issues, options.samples);
  if (issues.length > 0) throw new CalcInputError(issues);

  const spacingArcsec = fringeSpacingArcsec({ wavelengthM, baselineM: longestBaselineM });
  const beamArcsec = primaryBeamArcmin({ wavelengthM, dishDiameterM, beamFactor }) * 60;
  const halfWidthArcsec = options.halfWidthArcsec ?? beamArcsec;
  const fringesAcross = (2 * halfWidthArcsec) / spacingArcsec;
  const samples =
    options.samples ??
    Math.min(MAX_DEFAULT_SAMPLES, Math.max(201, 2 * Math.ceil(4 * fringesAcross) + 1));

  const points: FringePoint[] = new Array<FringePoint>(samples);
  const step = (2 * halfWidthArcsec) / (samples - 1);
  const envelopeScale = (-4 * Math.LN2) / (beamArcsec * beamArcsec);
  for (let i = 0; i < samples; i++) {
    const offsetArcsec = -halfWidthArcsec + i * step;
    const fringe = Math.cos((2 * Math.PI * offsetArcsec) / spacingArcsec);
    const envelope = Math.exp(envelopeScale * offsetArcsec * offsetArcsec);
    points[i] = { offsetArcsec, fringe, envelope, response: fringe * envelope };
  }
  return points;
}

export interface ElevationPoint {
  lstHours: number;
  elevationDeg: number;
}

/**
 * Elevation of a target over one sidereal day, LST 0 h to 24 h inclusive (hour angle = LST − RA).
 * The default 97 samples put a point every quarter hour.
 */
export function elevationCurve({
  latitudeDeg,
  decDeg,
  raDeg,
  samples = 97,
}: {
  latitudeDeg: number;
  decDeg: number;
  raDeg: number;
  samples?: number;
}): ElevationPoint[] {
  const issues: InputIssue[] = [];
  if (!(Number.isFinite(latitudeDeg) && Math.abs(latitudeDeg) <= 90)) {
    issues.push({
      path: 'latitudeDeg',
      message: `latitudeDeg must lie in [−90, 90], got ${latitudeDeg}.`,
    });
  }
  if (!(Number.isFinite(decDeg) && Math.abs(decDeg) <= 90)) {
    issues.push({ path: 'decDeg', message: `decDeg must lie in [−90, 90], got ${decDeg}.` });
  }
  if (!Number.isFinite(raDeg)) {
    issues.push({ path: 'raDeg', message: `raDeg must be a finite number, got ${raDeg}.` });
  }
  requireSamples(issues, samples);
  if (issues.length > 0) throw new CalcInputError(issues);

  const points: ElevationPoint[] = new Array<ElevationPoint>(samples);
  for (let i = 0; i < samples; i++) {
    const lstHours = (24 * i) / (samples - 1);
    const elevationDeg = elevationAtHourAngleDeg({
      latitudeDeg,
      decDeg,
      hourAngleDeg: lstHours * 15 - raDeg,
    });
    points[i] = { lstHours, elevationDeg };
  }
  return points;
}
