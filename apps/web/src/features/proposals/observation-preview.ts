/**
 * The observation form's live numbers: the form's text turned into the calculator library's
 * input with the observatory's stored settings, evaluated in the browser by the same code the
 * server runs when the observation is saved.
 */
import {
  CalcInputError,
  evaluateObservation,
  type LineInput,
  type ObservationInput as CalcInput,
  type ObservationResult,
} from '@skyhours/calc';
import type { ObservationInput, ObservatorySetup, Target, TargetLine } from './api';
import { parseNumber } from './format';

export interface ObservationFormValues {
  targetId: string;
  bandId: string;
  configurationId: string;
  /** `sky`: the frequency typed here; `line`: the target's line shifted by its velocity. */
  frequencySource: 'sky' | 'line';
  frequencyGHz: string;
  bandwidthMHz: string;
  spectralResolutionKHz: string;
  polarizations: '1' | '2';
  rmsGoalMicroJy: string;
  resolutionGoalArcsec: string;
  hoursAsked: string;
}

export type ObservationField = keyof ObservationFormValues;

export const OBSERVATION_FIELD_LABELS: Record<ObservationField, string> = {
  targetId: 'Target',
  bandId: 'Receiver band',
  configurationId: 'Configuration',
  frequencySource: 'Frequency from',
  frequencyGHz: 'Sky frequency (GHz)',
  bandwidthMHz: 'Bandwidth (MHz)',
  spectralResolutionKHz: 'Spectral resolution (kHz)',
  polarizations: 'Polarisations',
  rmsGoalMicroJy: 'Rms goal (µJy)',
  resolutionGoalArcsec: 'Resolution goal (″)',
  hoursAsked: 'Hours asked',
};

export type FieldErrors = Partial<Record<ObservationField, string>>;

export type Preview =
  /** Something needed is not given yet: nothing to compute, and nothing wrong either. */
  | { status: 'incomplete'; missing: ObservationField[] }
  | { status: 'invalid'; errors: FieldErrors; others: string[] }
  | {
      status: 'ready';
      input: CalcInput;
      result: ObservationResult;
      /** On-source hours per pointing the hours asked buy; null when no hours are given. */
      onSourceHours: number | null;
      /** Total hours (pointings and overheads included) the rms goal needs; null without a goal. */
      hoursForGoal: number | null;
    };

/** The library's input paths, and the field of this form each is about. */
const FIELD_OF_PATH: Record<string, ObservationField> = {
  frequencyGHz: 'frequencyGHz',
  line: 'frequencySource',
  'line.restGHz': 'frequencySource',
  'line.velocityKmS': 'frequencySource',
  'line.redshift': 'frequencySource',
  'line.convention': 'frequencySource',
  bandwidthMHz: 'bandwidthMHz',
  polarizations: 'polarizations',
  target: 'targetId',
  'target.raDeg': 'targetId',
  'target.decDeg': 'targetId',
  'target.extentArcsec': 'targetId',
  'target.resolutionGoalArcsec': 'resolutionGoalArcsec',
  resolutionGoalArcsec: 'resolutionGoalArcsec',
  rmsGoalMicroJy: 'rmsGoalMicroJy',
  onSourceHours: 'hoursAsked',
  hoursAsked: 'hoursAsked',
  spectralResolutionKHz: 'spectralResolutionKHz',
  targetId: 'targetId',
  bandId: 'bandId',
  band: 'bandId',
  configurationId: 'configurationId',
  configuration: 'configurationId',
};

/** The form field a library or server path (of an issue or a check) is about, if any. */
export const observationFieldOf = (path: string): ObservationField | null =>
  FIELD_OF_PATH[path] ?? FIELD_OF_PATH[path.replace(/^observations?\.[^.]+\./, '')] ?? null;

/** A stored target line as the library takes it. */
export function lineInput(line: TargetLine): LineInput {
  return line.redshift !== undefined && line.redshift !== null
    ? { restGHz: line.restGHz, redshift: line.redshift }
    : {
        restGHz: line.restGHz,
        velocityKmS: line.velocityKmS ?? 0,
        convention: line.convention ?? 'radio',
      };
}

/** Reads the text fields, collecting what is missing and what cannot be read. */
class Reader {
  readonly errors: FieldErrors = {};
  readonly missing: ObservationField[] = [];

  constructor(private readonly values: ObservationFormValues) {}

  number(field: ObservationField, required: boolean): number | null {
    const parsed = parseNumber(this.values[field]);
    if (parsed === null) {
      if (required) this.missing.push(field);
      return null;
    }
    if (typeof parsed === 'object') {
      this.errors[field] = parsed.error;
      return null;
    }
    return parsed;
  }
}

export interface PreviewContext {
  observatory: ObservatorySetup | undefined;
  targets: Target[];
}

/** What the form shows for these values: the library's numbers, or what stops them. */
export function previewObservation(
  values: ObservationFormValues,
  { observatory, targets }: PreviewContext,
): Preview {
  const read = new Reader(values);
  const target = targets.find((t) => t.id === values.targetId);
  const band = observatory?.bands.find((b) => b.id === values.bandId);
  const configuration = observatory?.configurations.find((c) => c.id === values.configurationId);
  if (!target) read.missing.push('targetId');
  if (!band) read.missing.push('bandId');
  if (!configuration) read.missing.push('configurationId');

  const useLine = values.frequencySource === 'line';
  if (useLine && target && !target.line) {
    read.errors.frequencySource = `${target.name} has no line; give a sky frequency.`;
  }
  const frequencyGHz = useLine ? null : read.number('frequencyGHz', true);
  const bandwidthMHz = read.number('bandwidthMHz', true);
  const spectralResolutionKHz = read.number('spectralResolutionKHz', false);
  const rmsGoalMicroJy = read.number('rmsGoalMicroJy', false);
  const resolutionGoalArcsec = read.number('resolutionGoalArcsec', false);
  const hoursAsked = read.number('hoursAsked', false);
  if (hoursAsked !== null && !(hoursAsked > 0)) read.errors.hoursAsked = 'Must be above 0 hours.';
  if (spectralResolutionKHz !== null && !(spectralResolutionKHz > 0)) {
    read.errors.spectralResolutionKHz = 'Must be above 0 kHz.';
  } else if (
    spectralResolutionKHz !== null &&
    bandwidthMHz !== null &&
    spectralResolutionKHz > bandwidthMHz * 1000
  ) {
    read.errors.spectralResolutionKHz = `Must not exceed the bandwidth (${bandwidthMHz * 1000} kHz).`;
  }

  if (Object.keys(read.errors).length > 0) {
    return { status: 'invalid', errors: read.errors, others: [] };
  }
  if (read.missing.length > 0 || !observatory || !target || !band || !configuration) {
    return { status: 'incomplete', missing: read.missing };
  }

  const frequency =
    useLine && target.line
      ? { line: lineInput(target.line) }
      : { frequencyGHz: frequencyGHz as number };
  const overheadFraction = observatory.overheadFraction;
  const base = {
    array: {
      antennas: observatory.antennas,
      dishDiameterM: observatory.dishDiameterM,
      latitudeDeg: observatory.latitudeDeg,
      longitudeDeg: observatory.longitudeDeg,
      elevationLimitDeg: observatory.elevationLimitDeg,
      correlatorEfficiency: observatory.correlatorEfficiency,
      overheadFraction,
      beamFactor: observatory.beamFactor,
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
    ...frequency,
    bandwidthMHz: bandwidthMHz as number,
    polarizations: values.polarizations === '1' ? 1 : 2,
    target: {
      raDeg: target.raDeg,
      decDeg: target.decDeg,
      extentArcsec: target.extentArcsec,
      resolutionGoalArcsec,
    },
    rmsGoalMicroJy,
  } as CalcInput;

  try {
    // The hours asked include every pointing and the overheads; the library wants the on-source
    // time of one pointing, and the pointings depend on the frequency: find them first.
    const first = evaluateObservation({ ...base, onSourceHours: null });
    const onSourceHours =
      hoursAsked === null ? null : hoursAsked / (first.pointings * (1 + overheadFraction));
    const input = { ...base, onSourceHours } as CalcInput;
    const result = onSourceHours === null ? first : evaluateObservation(input);
    const hoursForGoal =
      result.onSourceHoursForGoal === null
        ? null
        : result.onSourceHoursForGoal * result.pointings * (1 + overheadFraction);
    return { status: 'ready', input, result, onSourceHours, hoursForGoal };
  } catch (error) {
    if (!(error instanceof CalcInputError)) throw error;
    const errors: FieldErrors = {};
    const others: string[] = [];
    for (const issue of error.issues) {
      const field = observationFieldOf(issue.path);
      if (field) errors[field] ??= issue.message;
      else others.push(`${issue.path}: ${issue.message}`);
    }
    return { status: 'invalid', errors, others };
  }
}

/** The form's values for a stored observation (or a new one). */
export function observationFormValues(
  observation: ObservationInput | undefined,
  defaults: { targetId?: string; bandId?: string; configurationId?: string } = {},
): ObservationFormValues {
  const text = (x: number | null | undefined) => (x === null || x === undefined ? '' : String(x));
  return {
    targetId: observation?.targetId ?? defaults.targetId ?? '',
    bandId: observation?.bandId ?? defaults.bandId ?? '',
    configurationId: observation?.configurationId ?? defaults.configurationId ?? '',
    frequencySource: observation && observation.frequencyGHz === null ? 'line' : 'sky',
    frequencyGHz: text(observation?.frequencyGHz),
    bandwidthMHz: text(observation?.bandwidthMHz),
    spectralResolutionKHz: text(observation?.spectralResolutionKHz),
    polarizations: observation?.polarizations === 1 ? '1' : '2',
    rmsGoalMicroJy: text(observation?.rmsGoalMicroJy),
    resolutionGoalArcsec: text(observation?.resolutionGoalArcsec),
    hoursAsked: text(observation?.hoursAsked),
  };
}

/** What the server is sent for these values; call it only once the preview has no errors. */
export function observationInputOf(values: ObservationFormValues): ObservationInput {
  const num = (text: string) => {
    const parsed = parseNumber(text);
    return typeof parsed === 'number' ? parsed : null;
  };
  return {
    targetId: values.targetId,
    bandId: values.bandId,
    configurationId: values.configurationId,
    frequencyGHz: values.frequencySource === 'line' ? null : num(values.frequencyGHz),
    bandwidthMHz: num(values.bandwidthMHz) as number,
    spectralResolutionKHz: num(values.spectralResolutionKHz),
    polarizations: values.polarizations === '1' ? 1 : 2,
    rmsGoalMicroJy: num(values.rmsGoalMicroJy),
    resolutionGoalArcsec: num(values.resolutionGoalArcsec),
    hoursAsked: num(values.hoursAsked) as number,
  };
}
