/**
 * From the form's text to the library's numbers and back: each typed value is parsed and put in
 * the library's units, the library computes (the same code the server runs), and every problem,
 * whether a parse error or the library's own validation, is named by the form field it is about.
 */
import {
  CalcInputError,
  CoordinateParseError,
  evaluateObservation,
  validateObservationInput,
  type InputIssue,
  parseDeclination,
  parseRightAscension,
  type ArraySettings,
  type BandSettings,
  type ConfigurationSettings,
  type LineInput,
  type ObservationInput,
  type ObservationResult,
} from '@skyhours/calc';
import type { StoredBand, StoredConfiguration, StoredObservatory } from './api';
import type {
  AngleUnit,
  CalculatorValues,
  FieldName,
  FluxUnit,
  FrequencyUnit,
  TimeUnit,
} from './form-values';

/** The stored records the form names, once they are loaded. */
export interface StoredSetup {
  observatory: StoredObservatory;
  configuration: StoredConfiguration | undefined;
  band: StoredBand | undefined;
}

export type FieldErrors = Partial<Record<FieldName, string>>;

export type Calculation =
  | { status: 'ready'; input: ObservationInput; result: ObservationResult }
  /** `errors` by field; `others` for problems no field of the form shows. */
  | { status: 'invalid'; errors: FieldErrors; others: string[] }
  /** The stored setup is chosen but not loaded (yet, or at all). */
  | { status: 'waiting' };

/**
 * Conversions to the library's units. Each divides or multiplies by a whole number, so that
 * 1400 MHz is exactly 1.4 GHz (× 0.001 would give 1.4000000000000001).
 */
type Convert = (x: number) => number;
export const toGHz: Record<FrequencyUnit, Convert> = { GHz: (x) => x, MHz: (x) => x / 1000 };
export const toArcsec: Record<AngleUnit, Convert> = { arcsec: (x) => x, arcmin: (x) => x * 60 };
export const toMicroJy: Record<FluxUnit, Convert> = { uJy: (x) => x, mJy: (x) => x * 1000 };
export const toHours: Record<TimeUnit, Convert> = { h: (x) => x, min: (x) => x / 60 };
/** And back, for the results. */
export const fromArcsec: Record<AngleUnit, Convert> = { arcsec: (x) => x, arcmin: (x) => x / 60 };
export const fromMicroJy: Record<FluxUnit, Convert> = { uJy: (x) => x, mJy: (x) => x / 1000 };
export const fromHours: Record<TimeUnit, Convert> = { h: (x) => x, min: (x) => x * 60 };

const same: Convert = (x) => x;

const NUMBER = /^[+-]?(?:\d+(?:\.\d*)?|\.\d+)(?:e[+-]?\d+)?$/i;

/** A typed number: null when left empty, a message when it is not a number. */
export function parseNumber(text: string): number | null | { error: string } {
  const trimmed = text.trim().replace(/^−/, '-');
  if (trimmed === '') return null;
  if (NUMBER.test(trimmed)) return Number(trimmed);
  if (/^[+-]?\d*,\d+$/.test(trimmed)) return { error: 'Use a point for decimals, e.g. 1.4.' };
  return { error: `“${trimmed.slice(0, 20)}” is not a number.` };
}

/** Collects the problems of one conversion. */
class Reader {
  readonly errors: FieldErrors = {};

  constructor(private readonly values: CalculatorValues) {}

  /** The field as a number, converted; NaN (and an error) when it is missing or not a number. */
  required(field: FieldName, convert = same): number {
    const parsed = parseNumber(this.values[field]);
    if (parsed === null) return this.fail(field, 'Required.');
    if (typeof parsed === 'object') return this.fail(field, parsed.error);
    return convert(parsed);
  }

  /** The field as a number, converted, or null when it is left empty. */
  optional(field: FieldName, convert = same): number | null {
    const parsed = parseNumber(this.values[field]);
    if (parsed === null) return null;
    if (typeof parsed === 'object') return this.fail(field, parsed.error);
    return convert(parsed);
  }

  coordinate(field: 'ra' | 'dec'): number {
    const text = this.values[field];
    if (text.trim() === '') return this.fail(field, 'Required.');
    try {
      return field === 'ra' ? parseRightAscension(text) : parseDeclination(text);
    } catch (error) {
      if (error instanceof CoordinateParseError) return this.fail(field, error.message);
      throw error;
    }
  }

  fail(field: FieldName, message: string): number {
    this.errors[field] ??= message;
    return Number.NaN;
  }
}

function storedParts(setup: StoredSetup) {
  const { observatory: o, configuration, band } = setup;
  const array: ArraySettings = {
    antennas: o.antennas,
    dishDiameterM: o.dishDiameterM,
    latitudeDeg: o.latitudeDeg,
    longitudeDeg: o.longitudeDeg,
    elevationLimitDeg: o.elevationLimitDeg,
    correlatorEfficiency: o.correlatorEfficiency,
    overheadFraction: o.overheadFraction,
    beamFactor: o.beamFactor,
  };
  return {
    array,
    configuration: configuration && {
      shortestBaselineM: configuration.shortestBaselineM,
      longestBaselineM: configuration.longestBaselineM,
    },
    band: band && {
      minGHz: band.minGHz,
      maxGHz: band.maxGHz,
      tsysK: band.tsysK,
      apertureEfficiency: band.apertureEfficiency,
      maxBandwidthMHz: band.maxBandwidthMHz,
    },
  };
}

function customParts(read: Reader) {
  const overhead = read.required('overheadPercent');
  const array: ArraySettings = {
    antennas: read.required('antennas'),
    dishDiameterM: read.required('dishDiameterM'),
    latitudeDeg: read.required('latitudeDeg'),
    longitudeDeg: read.required('longitudeDeg'),
    elevationLimitDeg: read.required('elevationLimitDeg'),
    correlatorEfficiency: read.required('correlatorEfficiency'),
    overheadFraction: overhead / 100,
    beamFactor: read.optional('beamFactor'),
  };
  const configuration: ConfigurationSettings = {
    shortestBaselineM: read.required('shortestBaselineM'),
    longestBaselineM: read.required('longestBaselineM'),
  };
  const band: BandSettings = {
    minGHz: read.required('bandMinGHz'),
    maxGHz: read.required('bandMaxGHz'),
    tsysK: read.required('tsysK'),
    apertureEfficiency: read.required('apertureEfficiency'),
    maxBandwidthMHz: read.required('maxBandwidthMHz'),
  };
  return { array, configuration, band };
}

function lineOf(values: CalculatorValues, read: Reader): LineInput {
  const restGHz = read.required('restFrequency', toGHz[values.restUnit]);
  return values.shift === 'velocity'
    ? { restGHz, velocityKmS: read.required('velocity'), convention: values.convention }
    : { restGHz, redshift: read.required('redshift') };
}

/** The library's input paths, and the form field that shows each one's problems. */
const FIELD_OF_PATH: Record<string, FieldName> = {
  // Missing only when the stored one named is not found.
  configuration: 'configuration',
  band: 'band',
  'array.antennas': 'antennas',
  'array.dishDiameterM': 'dishDiameterM',
  'array.latitudeDeg': 'latitudeDeg',
  'array.longitudeDeg': 'longitudeDeg',
  'array.elevationLimitDeg': 'elevationLimitDeg',
  'array.correlatorEfficiency': 'correlatorEfficiency',
  'array.overheadFraction': 'overheadPercent',
  'array.beamFactor': 'beamFactor',
  'configuration.shortestBaselineM': 'shortestBaselineM',
  'configuration.longestBaselineM': 'longestBaselineM',
  'band.minGHz': 'bandMinGHz',
  'band.maxGHz': 'bandMaxGHz',
  'band.tsysK': 'tsysK',
  'band.apertureEfficiency': 'apertureEfficiency',
  'band.maxBandwidthMHz': 'maxBandwidthMHz',
  frequencyGHz: 'frequency',
  line: 'restFrequency',
  'line.restGHz': 'restFrequency',
  'line.velocityKmS': 'velocity',
  'line.convention': 'convention',
  'line.redshift': 'redshift',
  bandwidthMHz: 'bandwidthMHz',
  polarizations: 'polarizations',
  'target.raDeg': 'ra',
  'target.decDeg': 'dec',
  'target.extentArcsec': 'extent',
  'target.resolutionGoalArcsec': 'resolutionGoal',
  rmsGoalMicroJy: 'rmsGoal',
  onSourceHours: 'time',
};

/** The form field a library path (an issue's or a check's) is about, if the form shows it. */
export function fieldOfPath(path: string, setup: CalculatorValues['setup']): FieldName | null {
  const field = FIELD_OF_PATH[path];
  if (!field) return null;
  // A stored setup's numbers are not form fields: their problems are shown apart.
  const stored = /^(array|configuration|band)\./.test(path);
  return stored && setup === 'stored' ? null : field;
}

/**
 * Everything the Calculator shows for these values: the library's answer, or what stops it.
 * `stored` is null while the stored setup is not loaded.
 */
export function calculate(values: CalculatorValues, stored: StoredSetup | null): Calculation {
  const read = new Reader(values);
  let parts;
  if (values.setup === 'stored') {
    if (!stored) return { status: 'waiting' };
    parts = storedParts(stored);
    if (!parts.configuration) read.fail('configuration', 'Choose one of the configurations.');
    if (!parts.band) read.fail('band', 'Choose one of the receiver bands.');
  } else {
    parts = customParts(read);
  }

  const frequency =
    values.frequencyMode === 'sky'
      ? { frequencyGHz: read.required('frequency', toGHz[values.frequencyUnit]) }
      : { line: lineOf(values, read) };
  const input = {
    array: parts.array,
    configuration: parts.configuration as ConfigurationSettings,
    band: parts.band as BandSettings,
    ...frequency,
    bandwidthMHz: read.required('bandwidthMHz'),
    polarizations: values.polarizations === '1' ? 1 : 2,
    target: {
      raDeg: read.coordinate('ra'),
      decDeg: read.coordinate('dec'),
      extentArcsec: read.optional('extent', toArcsec[values.extentUnit]) ?? 0,
      resolutionGoalArcsec: read.optional('resolutionGoal', toArcsec[values.resolutionUnit]),
    },
    rmsGoalMicroJy: read.optional('rmsGoal', toMicroJy[values.rmsUnit]),
    onSourceHours: read.optional('time', toHours[values.timeUnit]),
  } as ObservationInput;
  // With a field unreadable, the library still judges the others, so every problem shows at once.
  const issues = Object.keys(read.errors).length > 0 ? validateObservationInput(input) : null;
  try {
    if (issues === null) return { status: 'ready', input, result: evaluateObservation(input) };
  } catch (error) {
    if (!(error instanceof CalcInputError)) throw error;
    return invalid(values, read.errors, error.issues);
  }
  return invalid(values, read.errors, issues);
}

function invalid(
  values: CalculatorValues,
  parseErrors: FieldErrors,
  issues: readonly InputIssue[],
): Calculation {
  const errors: FieldErrors = { ...parseErrors };
  const others: string[] = [];
  for (const issue of issues) {
    const field = fieldOfPath(issue.path, values.setup);
    // The library speaks of a fraction; the form asks for a percentage.
    const message = field === 'overheadPercent' ? 'Must be from 0 % to 1000 %.' : issue.message;
    // A field already marked (it could not be read) keeps its first, plainer message.
    if (field) errors[field] ??= message;
    else others.push(`${issue.path}: ${issue.message}`);
  }
  return { status: 'invalid', errors, others };
}
