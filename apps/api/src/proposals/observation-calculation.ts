import {
  CalcInputError,
  type Check,
  evaluateObservation,
  type LineInput,
  type ObservationInput,
  type ObservationResult,
} from '@skyhours/calc';
import { type FieldIssue, validationFailed } from '../common/errors/app-error.js';
import type { Configuration } from '../observatory/entities/configuration.entity.js';
import type { Observatory } from '../observatory/entities/observatory.entity.js';
import type { ReceiverBand } from '../observatory/entities/receiver-band.entity.js';
import type { ProposalTarget } from './entities/proposal-target.entity.js';

/** The observation's own fields that the calculator reads. */
export interface ObservationValues {
  frequencyGHz: number | null;
  bandwidthMHz: number;
  polarizations: 1 | 2;
  rmsGoalMicroJy: number | null;
  resolutionGoalArcsec: number | null;
  hoursAsked: number;
}

export type TargetValues = Pick<
  ProposalTarget,
  | 'raDeg'
  | 'decDeg'
  | 'extentArcsec'
  | 'lineRestGHz'
  | 'lineVelocityKmS'
  | 'lineConvention'
  | 'lineRedshift'
>;

export interface ObservationSetup {
  observatory: Observatory;
  band: ReceiverBand;
  configuration: Configuration;
  target: TargetValues;
  observation: ObservationValues;
}

/**
 * The calculator's input paths, named as the proposal's fields, so a check or an issue lands
 * under the field the proposer can change.
 */
const FIELD_NAMES: Record<string, string> = {
  onSourceHours: 'hoursAsked',
  'target.resolutionGoalArcsec': 'resolutionGoalArcsec',
  'target.raDeg': 'target.ra',
  'target.decDeg': 'target.dec',
  'target.extentArcsec': 'target.extentArcsec',
  line: 'target.line',
};

export function proposalField(calcPath: string): string {
  if (FIELD_NAMES[calcPath]) return FIELD_NAMES[calcPath];
  if (calcPath.startsWith('line.')) return `target.${calcPath}`;
  // The observatory's own settings (array, band, configuration) come from staff, not the form.
  if (calcPath.startsWith('band.')) return 'bandId';
  if (calcPath.startsWith('configuration.')) return 'configurationId';
  if (calcPath.startsWith('array.')) return 'configurationId';
  return calcPath;
}

export function targetLine(t: TargetValues): LineInput | null {
  if (t.lineRestGHz === null) return null;
  if (t.lineRedshift !== null) return { restGHz: t.lineRestGHz, redshift: t.lineRedshift };
  return {
    restGHz: t.lineRestGHz,
    velocityKmS: t.lineVelocityKmS ?? 0,
    convention: t.lineConvention ?? 'radio',
  };
}

function input(setup: ObservationSetup, onSourceHours: number | null): ObservationInput {
  const { observatory: a, band, configuration, target, observation: o } = setup;
  const line = o.frequencyGHz === null ? targetLine(target) : null;
  const common = {
    array: {
      antennas: a.antennas,
      dishDiameterM: a.dishDiameterM,
      latitudeDeg: a.latitudeDeg,
      longitudeDeg: a.longitudeDeg,
      elevationLimitDeg: a.elevationLimitDeg,
      correlatorEfficiency: a.correlatorEfficiency,
      overheadFraction: a.overheadFraction,
      beamFactor: a.beamFactor,
    },
    configuration: {
      shortestBaselineM: configuration.shortestBaselineM,
      longestBaselineM: configuration.longestBaselineM,
    },
    band: {
      minGHz: band.minGHz,
      maxGHz: band.maxGHz,
      tsysK: band.tsysK,
      apertureEfficiency: band.apertureEfficiency,
      maxBandwidthMHz: band.maxBandwidthMHz,
    },
    bandwidthMHz: o.bandwidthMHz,
    polarizations: o.polarizations,
    target: {
      raDeg: target.raDeg,
      decDeg: target.decDeg,
      extentArcsec: target.extentArcsec,
      resolutionGoalArcsec: o.resolutionGoalArcsec,
    },
    rmsGoalMicroJy: o.rmsGoalMicroJy,
    onSourceHours,
  };
  return line ? { ...common, line } : { ...common, frequencyGHz: o.frequencyGHz as number };
}

/**
 * Runs the calculator library for a saved observation. `hoursAsked` is the total, pointings and
 * overheads included, so the on-source time per pointing the library takes is
 * hoursAsked / (pointings · (1 + overheadFraction)); the pointings depend on the frequency and
 * the extent, so a first evaluation finds them. Bad input is a 400 naming the proposal's fields.
 */
export function calculateObservation(setup: ObservationSetup): {
  result: ObservationResult;
  checks: Check[];
} {
  if (setup.observation.frequencyGHz === null && setup.target.lineRestGHz === null)
    throw validationFailed([
      {
        path: 'frequencyGHz',
        message: 'frequencyGHz is required unless the target has a line to observe',
      },
    ]);
  try {
    const { pointings } = evaluateObservation(input(setup, null));
    const onSource =
      setup.observation.hoursAsked / (pointings * (1 + setup.observatory.overheadFraction));
    const result = evaluateObservation(input(setup, onSource));
    const checks = result.checks.map((c) => ({ ...c, field: proposalField(c.field) }));
    return { result: { ...result, checks }, checks };
  } catch (error) {
    if (error instanceof CalcInputError) {
      const issues: FieldIssue[] = error.issues.map((i) => ({
        path: proposalField(i.path),
        message: i.message,
      }));
      throw validationFailed(issues);
    }
    throw error;
  }
}
