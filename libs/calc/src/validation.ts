/**
 * Validation of an observation (the body of `POST /api/calculator`). Every bad field is reported
 * by its path, so the web form can show each issue under its field.
 *
 * Beyond sign and range rules, each number has generous physical limits (a 1 cm to 10 km dish,
 * 1 kHz to 100 THz, …). They reject nothing a telescope could do, and they keep every derived
 * number finite: with them, no product or quotient of the formulas can overflow to Infinity.
 * Unknown keys are ignored; `null` and absent are the same for optional fields.
 */
import { SPEED_OF_LIGHT_M_PER_S } from './constants.js';
import type { InputIssue } from './errors.js';
import { formatNumber } from './format.js';
import { lineSkyFrequencyGHz, type LineInput, type VelocityConvention } from './line.js';

interface NumberRule {
  min: number;
  max: number;
  /** The bound itself is not allowed. */
  minOpen: boolean;
  maxOpen: boolean;
  integer: boolean;
  /** Appended to the bounds in messages: ' GHz', '°'. */
  unit: string;
}

/** Every rule gets all fields, so `checkNumber` reads one object shape (it runs ~25 times per input). */
function rule(
  min: number,
  max: number,
  unit = '',
  options: { minOpen?: boolean; maxOpen?: boolean; integer?: boolean } = {},
): NumberRule {
  return {
    min,
    max,
    minOpen: options.minOpen ?? false,
    maxOpen: options.maxOpen ?? false,
    integer: options.integer ?? false,
    unit,
  };
}

const FREQUENCY_GHZ = rule(1e-6, 1e5, ' GHz');
const EFFICIENCY = rule(1e-3, 1);
const BASELINE_M = rule(0.01, 1e10, ' m');
const ANY_NUMBER = rule(-Infinity, Infinity);

const RULES = {
  antennas: rule(2, 1e6, '', { integer: true }),
  dishDiameterM: rule(0.01, 1e4, ' m'),
  latitudeDeg: rule(-90, 90, '°'),
  longitudeDeg: rule(-180, 180, '°'),
  elevationLimitDeg: rule(-90, 90, '°', { minOpen: true, maxOpen: true }),
  overheadFraction: rule(0, 10),
  beamFactor: rule(0.5, 3),
  tsysK: rule(0.01, 1e6, ' K'),
  maxBandwidthMHz: rule(0, 1e6, ' MHz', { minOpen: true }),
  bandwidthMHz: rule(1e-6, 1e6, ' MHz'),
  raDeg: rule(0, 360, '°', { maxOpen: true }),
  decDeg: rule(-90, 90, '°'),
  extentArcsec: rule(0, 648_000, '″'),
  resolutionGoalArcsec: rule(0, 648_000, '″', { minOpen: true }),
  rmsGoalMicroJy: rule(1e-6, 1e15, ' µJy'),
  onSourceHours: rule(1e-6, 1e6, ' h'),
  redshift: rule(-1, 1e6, '', { minOpen: true }),
};

const CONVENTIONS: readonly VelocityConvention[] = ['radio', 'optical', 'relativistic'];
const C_KM_S = SPEED_OF_LIGHT_M_PER_S / 1000;

type Issues = InputIssue[];
type JsonObject = Record<string, unknown>;

function isObject(value: unknown): value is JsonObject {
  return typeof value === 'object' && value !== null && !Array.isArray(value);
}

function isAbsent(value: unknown): value is null | undefined {
  return value === undefined || value === null;
}

function show(value: unknown): string {
  if (typeof value === 'string') return JSON.stringify(value);
  if (Array.isArray(value)) return 'an array';
  if (typeof value === 'object' && value !== null) return 'an object';
  return String(value);
}

function bound(x: number): string {
  return Math.abs(x) >= 1e7 || (x !== 0 && Math.abs(x) < 1e-4)
    ? x.toExponential().replace('e+', 'e')
    : String(x);
}

function describe(rule: NumberRule): string {
  const unit = rule.unit;
  const kind = rule.integer ? 'a whole number' : 'a number';
  if (rule.min === -Infinity && rule.max === Infinity) return kind;
  if (!rule.minOpen && !rule.maxOpen) {
    return `${kind} from ${bound(rule.min)}${unit} to ${bound(rule.max)}${unit}`;
  }
  const lower = `${rule.minOpen ? 'greater than' : 'at least'} ${bound(rule.min)}${unit}`;
  const upper = `${rule.maxOpen ? 'below' : 'at most'} ${bound(rule.max)}${unit}`;
  return `${kind} ${lower} and ${upper}`;
}

/** Pushes an issue unless `value` is a finite number obeying `rule`; returns whether it is valid. */
function checkNumber(
  issues: Issues,
  path: string,
  value: unknown,
  rule: NumberRule,
): value is number {
  let problem: string | null = null;
  if (isAbsent(value)) problem = `Required: ${describe(rule)}.`;
  else if (typeof value !== 'number') problem = `Must be ${describe(rule)}, got ${show(value)}.`;
  else if (!Number.isFinite(value)) problem = `Must be a finite number, got ${value}.`;
  else if (
    (rule.integer && !Number.isInteger(value)) ||
    (rule.minOpen ? value <= rule.min : value < rule.min) ||
    (rule.maxOpen ? value >= rule.max : value > rule.max)
  ) {
    problem = `Must be ${describe(rule)}, got ${value}.`;
  }
  if (problem === null) return true;
  issues.push({ path, message: problem });
  return false;
}

function checkOptionalNumber(issues: Issues, path: string, value: unknown, rule: NumberRule): void {
  if (!isAbsent(value)) checkNumber(issues, path, value, rule);
}

function checkObject(issues: Issues, path: string, value: unknown): value is JsonObject {
  if (isObject(value)) return true;
  issues.push({
    path,
    message: isAbsent(value) ? 'Required: an object.' : `Must be an object, got ${show(value)}.`,
  });
  return false;
}

function checkArray(issues: Issues, array: JsonObject): void {
  checkNumber(issues, 'array.antennas', array.antennas, RULES.antennas);
  checkNumber(issues, 'array.dishDiameterM', array.dishDiameterM, RULES.dishDiameterM);
  checkNumber(issues, 'array.latitudeDeg', array.latitudeDeg, RULES.latitudeDeg);
  checkNumber(issues, 'array.longitudeDeg', array.longitudeDeg, RULES.longitudeDeg);
  checkNumber(issues, 'array.elevationLimitDeg', array.elevationLimitDeg, RULES.elevationLimitDeg);
  checkNumber(issues, 'array.correlatorEfficiency', array.correlatorEfficiency, EFFICIENCY);
  checkNumber(issues, 'array.overheadFraction', array.overheadFraction, RULES.overheadFraction);
  checkOptionalNumber(issues, 'array.beamFactor', array.beamFactor, RULES.beamFactor);
}

function checkConfiguration(issues: Issues, configuration: JsonObject): void {
  const { shortestBaselineM, longestBaselineM } = configuration;
  const shortestOk = checkNumber(
    issues,
    'configuration.shortestBaselineM',
    shortestBaselineM,
    BASELINE_M,
  );
  const longestOk = checkNumber(
    issues,
    'configuration.longestBaselineM',
    longestBaselineM,
    BASELINE_M,
  );
  if (shortestOk && longestOk && shortestBaselineM > longestBaselineM) {
    issues.push({
      path: 'configuration.shortestBaselineM',
      message: `Must not exceed the longest baseline (${longestBaselineM} m), got ${shortestBaselineM} m.`,
    });
  }
}

function checkBand(issues: Issues, band: JsonObject): void {
  const { minGHz, maxGHz } = band;
  const minOk = checkNumber(issues, 'band.minGHz', minGHz, FREQUENCY_GHZ);
  const maxOk = checkNumber(issues, 'band.maxGHz', maxGHz, FREQUENCY_GHZ);
  if (minOk && maxOk && minGHz >= maxGHz) {
    issues.push({
      path: 'band.maxGHz',
      message: `Must be above the band's lower edge (${minGHz} GHz), got ${maxGHz} GHz.`,
    });
  }
  checkNumber(issues, 'band.tsysK', band.tsysK, RULES.tsysK);
  checkNumber(issues, 'band.apertureEfficiency', band.apertureEfficiency, EFFICIENCY);
  checkNumber(issues, 'band.maxBandwidthMHz', band.maxBandwidthMHz, RULES.maxBandwidthMHz);
}

/** Velocity limits per convention: a sky frequency must stay positive and finite. */
function checkVelocity(
  issues: Issues,
  velocity: unknown,
  convention: VelocityConvention,
): velocity is number {
  if (!checkNumber(issues, 'line.velocityKmS', velocity, ANY_NUMBER)) {
    return false;
  }
  const c = formatNumber(C_KM_S, 9);
  const ok = convention === 'optical' ? velocity > -C_KM_S : Math.abs(velocity) < C_KM_S;
  if (!ok) {
    issues.push({
      path: 'line.velocityKmS',
      message:
        convention === 'optical'
          ? `Must be above −c (−${c} km/s) in the optical convention, got ${velocity} km/s.`
          : `Must lie strictly between −c and c (±${c} km/s) in the ${convention} convention, got ${velocity} km/s.`,
    });
  }
  return ok;
}

function checkLine(issues: Issues, line: unknown): void {
  if (!checkObject(issues, 'line', line)) return;
  const { restGHz, velocityKmS, convention, redshift } = line;
  const restOk = checkNumber(issues, 'line.restGHz', restGHz, FREQUENCY_GHZ);
  const hasVelocity = !isAbsent(velocityKmS);
  if (hasVelocity === !isAbsent(redshift)) {
    issues.push({
      path: 'line',
      message: hasVelocity
        ? 'Give velocityKmS (with a convention) or redshift, not both.'
        : 'Give velocityKmS with a convention, or redshift.',
    });
    return;
  }
  let shift: LineInput | null = null;
  if (hasVelocity) {
    if (!isConvention(convention)) {
      issues.push({
        path: 'line.convention',
        message: `Must be "radio", "optical" or "relativistic", got ${show(convention)}.`,
      });
    } else if (checkVelocity(issues, velocityKmS, convention)) {
      shift = { restGHz: restGHz as number, velocityKmS, convention };
    }
  } else if (checkNumber(issues, 'line.redshift', redshift, RULES.redshift)) {
    shift = { restGHz: restGHz as number, redshift };
  }
  if (!restOk || shift === null) return;
  const skyGHz = lineSkyFrequencyGHz(shift);
  if (!(skyGHz >= FREQUENCY_GHZ.min && skyGHz <= FREQUENCY_GHZ.max)) {
    issues.push({
      path: hasVelocity ? 'line.velocityKmS' : 'line.redshift',
      message: `Gives a sky frequency of ${formatNumber(skyGHz, 4)} GHz, outside the ${bound(FREQUENCY_GHZ.min)} to ${bound(FREQUENCY_GHZ.max)} GHz the calculator handles.`,
    });
  }
}

function isConvention(value: unknown): value is VelocityConvention {
  return CONVENTIONS.includes(value as VelocityConvention);
}

function checkTarget(issues: Issues, target: JsonObject): void {
  checkNumber(issues, 'target.raDeg', target.raDeg, RULES.raDeg);
  checkNumber(issues, 'target.decDeg', target.decDeg, RULES.decDeg);
  checkNumber(issues, 'target.extentArcsec', target.extentArcsec, RULES.extentArcsec);
  checkOptionalNumber(
    issues,
    'target.resolutionGoalArcsec',
    target.resolutionGoalArcsec,
    RULES.resolutionGoalArcsec,
  );
}

/** Every problem of an observation input, each named by its path; empty when it is valid. */
export function validateObservationInput(input: unknown): InputIssue[] {
  const issues: Issues = [];
  if (!isObject(input)) {
    issues.push({ path: '', message: `The observation must be an object, got ${show(input)}.` });
    return issues;
  }
  if (checkObject(issues, 'array', input.array)) checkArray(issues, input.array);
  if (checkObject(issues, 'configuration', input.configuration)) {
    checkConfiguration(issues, input.configuration);
  }
  if (checkObject(issues, 'band', input.band)) checkBand(issues, input.band);

  const hasFrequency = !isAbsent(input.frequencyGHz);
  const hasLine = !isAbsent(input.line);
  if (hasFrequency && hasLine) {
    const message = 'Give frequencyGHz or line, not both.';
    issues.push({ path: 'frequencyGHz', message }, { path: 'line', message });
  } else if (hasFrequency) {
    checkNumber(issues, 'frequencyGHz', input.frequencyGHz, FREQUENCY_GHZ);
  } else if (hasLine) {
    checkLine(issues, input.line);
  } else {
    issues.push({
      path: 'frequencyGHz',
      message: 'Give frequencyGHz, or a line with its rest frequency and a velocity or redshift.',
    });
  }

  checkNumber(issues, 'bandwidthMHz', input.bandwidthMHz, RULES.bandwidthMHz);
  if (input.polarizations !== 1 && input.polarizations !== 2) {
    issues.push({
      path: 'polarizations',
      message: isAbsent(input.polarizations)
        ? 'Required: 1 or 2.'
        : `Must be 1 or 2, got ${show(input.polarizations)}.`,
    });
  }
  if (checkObject(issues, 'target', input.target)) checkTarget(issues, input.target);
  checkOptionalNumber(issues, 'rmsGoalMicroJy', input.rmsGoalMicroJy, RULES.rmsGoalMicroJy);
  checkOptionalNumber(issues, 'onSourceHours', input.onSourceHours, RULES.onSourceHours);
  return issues;
}
