/** The JSON body and answer of `POST /api/calculator` (SCIENCE.md "The calculator's HTTP contract"). */
import type { LineInput } from './line.js';

export interface ArraySettings {
  /** Number of identical antennas, a whole number ≥ 2. */
  antennas: number;
  dishDiameterM: number;
  latitudeDeg: number;
  /** East longitude. */
  longitudeDeg: number;
  elevationLimitDeg: number;
  correlatorEfficiency: number;
  /** Calibration and slewing time as a fraction of on-source time (0.2 = 20 %). */
  overheadFraction: number;
  /** Primary beam = beamFactor · λ/D; absent or null means 1.13. */
  beamFactor?: number | null;
}

export interface ConfigurationSettings {
  shortestBaselineM: number;
  longestBaselineM: number;
}

export interface BandSettings {
  minGHz: number;
  maxGHz: number;
  tsysK: number;
  apertureEfficiency: number;
  maxBandwidthMHz: number;
}

export interface TargetInput {
  raDeg: number;
  decDeg: number;
  /** Diameter of the region to image; 0 for a point source. */
  extentArcsec: number;
  resolutionGoalArcsec?: number | null;
}

interface ObservationCommon {
  array: ArraySettings;
  configuration: ConfigurationSettings;
  band: BandSettings;
  bandwidthMHz: number;
  polarizations: 1 | 2;
  target: TargetInput;
  /** Absent or null: no sensitivity goal. */
  rmsGoalMicroJy?: number | null;
  /** On-source time of one pointing; absent or null: not given. */
  onSourceHours?: number | null;
}

/** Exactly one of `frequencyGHz` and `line` (null counts as absent). */
export type ObservationInput = ObservationCommon &
  ({ frequencyGHz: number; line?: null } | { line: LineInput; frequencyGHz?: null });

export type CheckLevel = 'blocker' | 'warning' | 'note';

export const CHECK_CODES = [
  'FREQUENCY_OUTSIDE_BAND',
  'BANDWIDTH_TOO_WIDE',
  'NEVER_RISES',
  'RESOLUTION_NOT_REACHED',
  'EXTENT_EXCEEDS_LARGEST_SCALE',
  'MOSAIC_REQUIRED',
  'TIME_SHORT_OF_GOAL',
  'TIME_ABOVE_NEED',
  'LOW_ELEVATION',
] as const;

export type CheckCode = (typeof CHECK_CODES)[number];

/** A finding about an observation; `field` is the input path it is about. */
export interface Check {
  level: CheckLevel;
  code: CheckCode;
  field: string;
  message: string;
}

export interface ObservationResult {
  skyFrequencyGHz: number;
  wavelengthM: number;
  resolutionArcsec: number;
  largestScaleArcsec: number;
  primaryBeamArcmin: number;
  pointings: number;
  effectiveAreaM2: number;
  sefdJy: number;
  /** Image rms reached in `onSourceHours` (per pointing); null without onSourceHours. */
  rmsMicroJy: number | null;
  /** On-source hours per pointing that reach `rmsGoalMicroJy`; null without a goal. */
  onSourceHoursForGoal: number | null;
  /** onSourceHours (else the goal's hours) · pointings · (1 + overhead); null with neither. */
  totalHours: number | null;
  /** Brightness rms for rmsMicroJy (else the goal); null with neither. */
  brightnessRmsK: number | null;
  maxElevationDeg: number;
  hoursAboveLimit: number;
  /** null when the target never rises or never sets. */
  lstRiseHours: number | null;
  lstSetHours: number | null;
  /** Blockers first, then warnings, then notes. */
  checks: Check[];
}
