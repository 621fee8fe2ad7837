/**
 * Geometry of the array (SCIENCE.md "Geometry of the array"): wavelength, fringe spacing,
 * resolution, largest angular scale, primary beam and mosaic pointings.
 *
 * These formula functions assume physically valid arguments (positive lengths and frequencies);
 * `evaluateObservation` is the validated entry point.
 */
import {
  ARCMIN_PER_RAD,
  ARCSEC_PER_RAD,
  DEFAULT_BEAM_FACTOR,
  SPEED_OF_LIGHT_M_PER_S,
} from './constants.js';

/** λ = c / ν. */
export function wavelengthM({ frequencyHz }: { frequencyHz: number }): number {
  return SPEED_OF_LIGHT_M_PER_S / frequencyHz;
}

/** Fringe spacing of one baseline, λ / B. */
export function fringeSpacingArcsec({
  wavelengthM,
  baselineM,
}: {
  wavelengthM: number;
  baselineM: number;
}): number {
  return (wavelengthM / baselineM) * ARCSEC_PER_RAD;
}

/** Angular resolution: the fringe spacing of the longest baseline (common practice). */
export function resolutionArcsec({
  wavelengthM,
  longestBaselineM,
}: {
  wavelengthM: number;
  longestBaselineM: number;
}): number {
  return fringeSpacingArcsec({ wavelengthM, baselineM: longestBaselineM });
}

/** Largest angular scale recovered, 0.6 λ / B_shortest (common practice; Wilner & Welch 1994). */
export function largestAngularScaleArcsec({
  wavelengthM,
  shortestBaselineM,
}: {
  wavelengthM: number;
  shortestBaselineM: number;
}): number {
  return 0.6 * fringeSpacingArcsec({ wavelengthM, baselineM: shortestBaselineM });
}

/** Primary beam (field of view), beamFactor · λ / D; beamFactor defaults to 1.13. */
export function primaryBeamArcmin({
  wavelengthM,
  dishDiameterM,
  beamFactor = DEFAULT_BEAM_FACTOR,
}: {
  wavelengthM: number;
  dishDiameterM: number;
  beamFactor?: number;
}): number {
  return ((beamFactor * wavelengthM) / dishDiameterM) * ARCMIN_PER_RAD;
}

/** Nyquist spacing of mosaic pointings, λ / (2D). */
export function mosaicSpacingArcsec({
  wavelengthM,
  dishDiameterM,
}: {
  wavelengthM: number;
  dishDiameterM: number;
}): number {
  return (wavelengthM / (2 * dishDiameterM)) * ARCSEC_PER_RAD;
}

/**
 * Pointings needed to cover a target of the given extent (its diameter).
 *
 * One pointing when the extent is at most half the primary beam; otherwise a hexagonal grid of
 * spacing s = λ/(2D): ceil((π/4)·extent² / ((√3/2)·s²)), each hexagonal cell having area (√3/2)s².
 */
export function mosaicPointings({
  extentArcsec,
  wavelengthM,
  dishDiameterM,
  beamFactor = DEFAULT_BEAM_FACTOR,
}: {
  extentArcsec: number;
  wavelengthM: number;
  dishDiameterM: number;
  beamFactor?: number;
}): number {
  const beamArcsec = primaryBeamArcmin({ wavelengthM, dishDiameterM, beamFactor }) * 60;
  if (extentArcsec <= beamArcsec / 2) return 1;
  const spacingArcsec = mosaicSpacingArcsec({ wavelengthM, dishDiameterM });
  const cells =
    ((Math.PI / 4) * extentArcsec * extentArcsec) /
    ((Math.sqrt(3) / 2) * spacingArcsec * spacingArcsec);
  // A ratio that is a whole number up to rounding noise (e.g. 7.000000000000001) must not gain a pointing.
  return Math.max(1, Math.ceil(cells * (1 - 1e-12)));
}
