/**
 * Sensitivity (SCIENCE.md "Sensitivity"): the radiometer equation for an interferometer with N
 * identical antennas and natural weighting (Wrobel & Walker 1999; Thompson, Moran & Swenson 2017,
 * ch. 6), its inverse, brightness temperature (Rayleigh–Jeans) and the Dicke radiometer.
 *
 * Formula functions assume physically valid arguments; `evaluateObservation` validates.
 */
import { ARCSEC_PER_RAD, BOLTZMANN_J_PER_K, JANSKY_W_PER_M2_HZ } from './constants.js';

/** A_eff = η_a · π D² / 4. */
export function effectiveAreaM2({
  dishDiameterM,
  apertureEfficiency,
}: {
  dishDiameterM: number;
  apertureEfficiency: number;
}): number {
  return (apertureEfficiency * Math.PI * dishDiameterM * dishDiameterM) / 4;
}

/** System equivalent flux density, SEFD = 2 k T_sys / A_eff. */
export function sefdJy({
  tsysK,
  effectiveAreaM2,
}: {
  tsysK: number;
  effectiveAreaM2: number;
}): number {
  return (2 * BOLTZMANN_J_PER_K * tsysK) / effectiveAreaM2 / JANSKY_W_PER_M2_HZ;
}

/** What the image rms depends on besides time or rms. */
export interface RadiometerSetup {
  sefdJy: number;
  correlatorEfficiency: number;
  polarizations: 1 | 2;
  antennas: number;
  bandwidthHz: number;
}

/** σ = SEFD / (η_c · √(n_pol · N(N−1) · Δν · t)), t the on-source time of one pointing. */
export function imageRmsJy({
  sefdJy,
  correlatorEfficiency,
  polarizations,
  antennas,
  bandwidthHz,
  integrationS,
}: RadiometerSetup & { integrationS: number }): number {
  const samples = polarizations * antennas * (antennas - 1) * bandwidthHz * integrationS;
  return sefdJy / (correlatorEfficiency * Math.sqrt(samples));
}

/** t = (SEFD / (η_c σ))² / (n_pol · N(N−1) · Δν): the on-source time that reaches rms σ. */
export function integrationSForRms({
  sefdJy,
  correlatorEfficiency,
  polarizations,
  antennas,
  bandwidthHz,
  rmsJy,
}: RadiometerSetup & { rmsJy: number }): number {
  const ratio = sefdJy / (correlatorEfficiency * rmsJy);
  return (ratio * ratio) / (polarizations * antennas * (antennas - 1) * bandwidthHz);
}

/** Total time asked: on-source time of one pointing · pointings · (1 + overhead). */
export function totalTimeHours({
  onSourceHours,
  pointings,
  overheadFraction,
}: {
  onSourceHours: number;
  pointings: number;
  overheadFraction: number;
}): number {
  return onSourceHours * pointings * (1 + overheadFraction);
}

/** Solid angle of a Gaussian beam, Ω = π θ² / (4 ln 2), θ its FWHM. */
export function gaussianBeamSolidAngleSr({ fwhmArcsec }: { fwhmArcsec: number }): number {
  const fwhmRad = fwhmArcsec / ARCSEC_PER_RAD;
  return (Math.PI * fwhmRad * fwhmRad) / (4 * Math.LN2);
}

/** Brightness-temperature rms in the synthesised beam (Rayleigh–Jeans): ΔT_b = σ λ² / (2 k Ω). */
export function brightnessTemperatureRmsK({
  rmsJy,
  wavelengthM,
  beamFwhmArcsec,
}: {
  rmsJy: number;
  wavelengthM: number;
  beamFwhmArcsec: number;
}): number {
  const solidAngleSr = gaussianBeamSolidAngleSr({ fwhmArcsec: beamFwhmArcsec });
  return (
    (rmsJy * JANSKY_W_PER_M2_HZ * wavelengthM * wavelengthM) /
    (2 * BOLTZMANN_J_PER_K * solidAngleSr)
  );
}

/** Single-dish Dicke radiometer, ΔT = T_sys / √(Δν τ). */
export function dickeRmsK({
  tsysK,
  bandwidthHz,
  integrationS,
}: {
  tsysK: number;
  bandwidthHz: number;
  integrationS: number;
}): number {
  return tsysK / Math.sqrt(bandwidthHz * integrationS);
}
