/** Physical constants and observatory defaults (SCIENCE.md "Constants"). SI unless the name says otherwise. */

/** Boltzmann constant, exact since the 2019 SI redefinition. */
export const BOLTZMANN_J_PER_K = 1.380649e-23;

/** Speed of light in vacuum, exact by the definition of the metre. */
export const SPEED_OF_LIGHT_M_PER_S = 299_792_458;

/** The jansky (IAU): 1 Jy = 1e-26 W m⁻² Hz⁻¹. */
export const JANSKY_W_PER_M2_HZ = 1e-26;

export const ARCSEC_PER_RAD = 648_000 / Math.PI;
export const ARCMIN_PER_RAD = 10_800 / Math.PI;
export const DEG_PER_RAD = 180 / Math.PI;

/** Neutral-hydrogen hyperfine line, 1420.405751768 MHz (Hellwig et al. 1970). */
export const HI_REST_FREQUENCY_GHZ = 1.420405751768;

/** CO J=1–0, 115271.2018 MHz (JPL catalogue, species tag 28001). */
export const CO_1_0_REST_FREQUENCY_GHZ = 115.2712018;

/** Half-power width of a uniformly illuminated circular aperture, in λ/D (Airy pattern, Born & Wolf). */
export const AIRY_HALF_POWER_FACTOR = 1.02899;

/** First null of the Airy pattern, in λ/D: the first zero of J1 (3.83171) divided by π. */
export const AIRY_FIRST_NULL_FACTOR = 1.21967;

/** Primary-beam factor for a tapered illumination (common practice); observatories may set their own. */
export const DEFAULT_BEAM_FACTOR = 1.13;

/** Highest elevation below which an observation is flagged (common practice). */
export const LOW_ELEVATION_DEG = 30;
