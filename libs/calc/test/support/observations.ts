import type { ObservationInput } from '../../src/index.js';

/** The example body of SCIENCE.md's `POST /api/calculator`. */
export function makeObservation(overrides: Partial<ObservationInput> = {}): ObservationInput {
  return {
    array: {
      antennas: 18,
      dishDiameterM: 16,
      latitudeDeg: 47.3,
      longitudeDeg: -118.9,
      elevationLimitDeg: 15,
      correlatorEfficiency: 0.88,
      overheadFraction: 0.2,
      beamFactor: 1.13,
    },
    configuration: { shortestBaselineM: 30, longestBaselineM: 3200 },
    band: { minGHz: 1, maxGHz: 2, tsysK: 28, apertureEfficiency: 0.65, maxBandwidthMHz: 1000 },
    frequencyGHz: 1.4,
    bandwidthMHz: 500,
    polarizations: 2,
    target: { raDeg: 150.1, decDeg: 22.5, extentArcsec: 0, resolutionGoalArcsec: null },
    rmsGoalMicroJy: 10,
    onSourceHours: 2,
    ...overrides,
  } as ObservationInput;
}

/** A deep copy with one value at a dotted path replaced (or deleted with `undefined`). */
export function withValue(input: unknown, path: string, value: unknown): unknown {
  const copy = structuredClone(input) as Record<string, unknown>;
  const keys = path.split('.');
  let node = copy;
  for (const key of keys.slice(0, -1)) node = node[key] as Record<string, unknown>;
  const last = keys.at(-1)!;
  if (value === undefined) delete node[last];
  else node[last] = value;
  return copy;
}
