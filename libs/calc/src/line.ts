/** Line targets (SCIENCE.md "Line targets"): sky frequency and channel width in velocity. */
import { SPEED_OF_LIGHT_M_PER_S } from './constants.js';

export type VelocityConvention = 'radio' | 'optical' | 'relativistic';

export type LineShift =
  | { restFrequencyHz: number; velocityKmS: number; convention: VelocityConvention }
  | { restFrequencyHz: number; redshift: number };

/**
 * Observed (sky) frequency of a line. Radio ν = ν0(1 − v/c); optical ν = ν0/(1 + v/c);
 * relativistic ν = ν0·√((1 − v/c)/(1 + v/c)); redshift ν = ν0/(1 + z). Positive v recedes.
 * The result is ≤ 0 or not finite for |v| ≥ c in the conventions where that is meaningless;
 * `validateObservationInput` rejects such velocities.
 */
export function skyFrequencyHz(line: LineShift): number {
  if (hasRedshift(line)) return line.restFrequencyHz / (1 + line.redshift);
  const { restFrequencyHz, velocityKmS, convention } = line as Extract<
    LineShift,
    { velocityKmS: number }
  >;
  const beta = (velocityKmS * 1000) / SPEED_OF_LIGHT_M_PER_S;
  switch (convention) {
    case 'radio':
      return restFrequencyHz * (1 - beta);
    case 'optical':
      return restFrequencyHz / (1 + beta);
    case 'relativistic':
      return restFrequencyHz * Math.sqrt((1 - beta) / (1 + beta));
  }
}

/** A present-but-null redshift (JSON often carries every key) means "use the velocity". */
function hasRedshift<T extends object>(line: T): line is Extract<T, { redshift: number }> {
  return typeof (line as { redshift?: unknown }).redshift === 'number';
}

/** Channel width in velocity, Δv = c · Δν / ν. */
export function channelWidthKmS({
  channelWidthHz,
  frequencyHz,
}: {
  channelWidthHz: number;
  frequencyHz: number;
}): number {
  return (SPEED_OF_LIGHT_M_PER_S * channelWidthHz) / frequencyHz / 1000;
}

/** A line as the calculator's HTTP contract gives it: rest frequency in GHz with a velocity or a redshift. */
export type LineInput =
  | { restGHz: number; velocityKmS: number; convention: VelocityConvention }
  | { restGHz: number; redshift: number };

/** Sky frequency of a contract line, in GHz. */
export function lineSkyFrequencyGHz(line: LineInput): number {
  const restFrequencyHz = line.restGHz * 1e9;
  const shifted = hasRedshift(line)
    ? skyFrequencyHz({ restFrequencyHz, redshift: line.redshift })
    : skyFrequencyHz({
        restFrequencyHz,
        velocityKmS: (line as Extract<LineInput, { velocityKmS: number }>).velocityKmS,
        convention: (line as Extract<LineInput, { velocityKmS: number }>).convention,
      });
  return shifted / 1e9;
}
