/**
 * `evaluateObservation`: every number of SCIENCE.md for one observation, and the nine checks.
 * The browser calls it for live previews and the server for validation, so both see the same answer.
 */
import { DEFAULT_BEAM_FACTOR, LOW_ELEVATION_DEG } from './constants.js';
import { CalcInputError } from './errors.js';
import { formatFixed, formatNumber } from './format.js';
import {
  largestAngularScaleArcsec,
  mosaicPointings,
  primaryBeamArcmin,
  resolutionArcsec,
  wavelengthM,
} from './geometry.js';
import { lineSkyFrequencyGHz } from './line.js';
import type { Check, ObservationInput, ObservationResult } from './observation-types.js';
import {
  brightnessTemperatureRmsK,
  effectiveAreaM2,
  imageRmsJy,
  integrationSForRms,
  sefdJy,
  totalTimeHours,
} from './sensitivity.js';
import { lstWindow, maxElevationDeg } from './sky.js';
import { validateObservationInput } from './validation.js';

/** An rms more than this factor above the goal is "short of goal". */
const SHORT_OF_GOAL_FACTOR = 1.1;
/** Time asked beyond this multiple of the time the goal needs is "above need". */
const ABOVE_NEED_FACTOR = 1.5;

/**
 * Evaluates one observation. Throws `CalcInputError` (with `.issues`) on invalid input; rule
 * failures are returned as `checks`, never thrown.
 *
 * Decisions where SCIENCE.md is silent:
 * - The band check is on the sky (centre) frequency, as SCIENCE.md states, not on the band edges.
 * - LOW_ELEVATION is not raised for a target that never rises: NEVER_RISES already blocks it.
 * - TIME_SHORT_OF_GOAL and TIME_ABOVE_NEED need both onSourceHours and rmsGoalMicroJy.
 * - The brightness rms takes the synthesised beam as a Gaussian of FWHM = resolutionArcsec.
 * - onSourceHours is per pointing; totalHours multiplies by the pointings and the overhead.
 */
export function evaluateObservation(input: ObservationInput): ObservationResult {
  const issues = validateObservationInput(input);
  if (issues.length > 0) throw new CalcInputError(issues);

  const { array, configuration, band, target } = input;
  const beamFactor = array.beamFactor ?? DEFAULT_BEAM_FACTOR;
  const line = input.line ?? null;
  const skyFrequencyGHz =
    line !== null ? lineSkyFrequencyGHz(line) : (input.frequencyGHz as number);
  const lambdaM = wavelengthM({ frequencyHz: skyFrequencyGHz * 1e9 });

  const resolution = resolutionArcsec({
    wavelengthM: lambdaM,
    longestBaselineM: configuration.longestBaselineM,
  });
  const largestScale = largestAngularScaleArcsec({
    wavelengthM: lambdaM,
    shortestBaselineM: configuration.shortestBaselineM,
  });
  const primaryBeam = primaryBeamArcmin({
    wavelengthM: lambdaM,
    dishDiameterM: array.dishDiameterM,
    beamFactor,
  });
  const pointings = mosaicPointings({
    extentArcsec: target.extentArcsec,
    wavelengthM: lambdaM,
    dishDiameterM: array.dishDiameterM,
    beamFactor,
  });

  const area = effectiveAreaM2({
    dishDiameterM: array.dishDiameterM,
    apertureEfficiency: band.apertureEfficiency,
  });
  const sefd = sefdJy({ tsysK: band.tsysK, effectiveAreaM2: area });
  // Object literals written out in full (no spreads) keep one shape per call site: this is the
  // hot path of every live preview and every validation on the server.
  const bandwidthHz = input.bandwidthMHz * 1e6;
  const onSourceHours = input.onSourceHours ?? null;
  const rmsGoalMicroJy = input.rmsGoalMicroJy ?? null;
  const rmsMicroJy =
    onSourceHours === null
      ? null
      : imageRmsJy({
          sefdJy: sefd,
          correlatorEfficiency: array.correlatorEfficiency,
          polarizations: input.polarizations,
          antennas: array.antennas,
          bandwidthHz,
          integrationS: onSourceHours * 3600,
        }) * 1e6;
  const onSourceHoursForGoal =
    rmsGoalMicroJy === null
      ? null
      : integrationSForRms({
          sefdJy: sefd,
          correlatorEfficiency: array.correlatorEfficiency,
          polarizations: input.polarizations,
          antennas: array.antennas,
          bandwidthHz,
          rmsJy: rmsGoalMicroJy * 1e-6,
        }) / 3600;

  // The time asked and its rms: onSourceHours when given, else what the goal needs.
  const hoursAsked = onSourceHours ?? onSourceHoursForGoal;
  const rmsAskedMicroJy = rmsMicroJy ?? rmsGoalMicroJy;
  const totalHours =
    hoursAsked === null
      ? null
      : totalTimeHours({
          onSourceHours: hoursAsked,
          pointings,
          overheadFraction: array.overheadFraction,
        });
  const brightnessRmsK =
    rmsAskedMicroJy === null
      ? null
      : brightnessTemperatureRmsK({
          rmsJy: rmsAskedMicroJy * 1e-6,
          wavelengthM: lambdaM,
          beamFwhmArcsec: resolution,
        });

  const maxElevation = maxElevationDeg({ latitudeDeg: array.latitudeDeg, decDeg: target.decDeg });
  const upWindow = lstWindow({
    latitudeDeg: array.latitudeDeg,
    decDeg: target.decDeg,
    elevationLimitDeg: array.elevationLimitDeg,
    raDeg: target.raDeg,
  });

  const result: ObservationResult = {
    skyFrequencyGHz,
    wavelengthM: lambdaM,
    resolutionArcsec: resolution,
    largestScaleArcsec: largestScale,
    primaryBeamArcmin: primaryBeam,
    pointings,
    effectiveAreaM2: area,
    sefdJy: sefd,
    rmsMicroJy,
    onSourceHoursForGoal,
    totalHours,
    brightnessRmsK,
    maxElevationDeg: maxElevation,
    hoursAboveLimit: upWindow.hoursAboveLimit,
    lstRiseHours: upWindow.lstRiseHours,
    lstSetHours: upWindow.lstSetHours,
    checks: [],
  };
  result.checks = checkObservation(input, result, upWindow.visibility === 'never-rises');
  return result;
}

const ghz = (x: number): string => formatNumber(x, 6);
const deg = (x: number): string => formatFixed(x, 1);
/** "43.2% above" for modest excesses, "64.1 times" for large ones. */
const excess = (ratio: number): string =>
  ratio < 2 ? `${formatNumber((ratio - 1) * 100)}% above` : `${formatNumber(ratio)} times`;

/** The nine checks of SCIENCE.md, blockers first, then warnings, then notes. */
function checkObservation(
  input: ObservationInput,
  r: ObservationResult,
  neverRises: boolean,
): Check[] {
  const { array, configuration, band, target } = input;
  const checks: Check[] = [];
  const line = input.line ?? null;

  if (r.skyFrequencyGHz < band.minGHz || r.skyFrequencyGHz > band.maxGHz) {
    const what = line
      ? `The line's sky frequency of ${ghz(r.skyFrequencyGHz)} GHz (rest ${ghz(line.restGHz)} GHz)`
      : `The frequency of ${ghz(r.skyFrequencyGHz)} GHz`;
    checks.push({
      level: 'blocker',
      code: 'FREQUENCY_OUTSIDE_BAND',
      field: line ? 'line.restGHz' : 'frequencyGHz',
      message: `${what} lies outside the band, ${ghz(band.minGHz)}–${ghz(band.maxGHz)} GHz.`,
    });
  }
  if (input.bandwidthMHz > band.maxBandwidthMHz) {
    checks.push({
      level: 'blocker',
      code: 'BANDWIDTH_TOO_WIDE',
      field: 'bandwidthMHz',
      message: `The bandwidth of ${formatNumber(input.bandwidthMHz, 4)} MHz exceeds the band's widest, ${formatNumber(band.maxBandwidthMHz, 4)} MHz.`,
    });
  }
  if (neverRises) {
    checks.push({
      level: 'blocker',
      code: 'NEVER_RISES',
      field: 'target.decDeg',
      message: `At latitude ${deg(array.latitudeDeg)}° a target at declination ${deg(target.decDeg)}° never rises above the elevation limit of ${deg(array.elevationLimitDeg)}° (it culminates at ${deg(r.maxElevationDeg)}°).`,
    });
  }
  const goalArcsec = target.resolutionGoalArcsec ?? null;
  if (goalArcsec !== null && goalArcsec < r.resolutionArcsec) {
    checks.push({
      level: 'warning',
      code: 'RESOLUTION_NOT_REACHED',
      field: 'target.resolutionGoalArcsec',
      message: `The resolution goal of ${formatNumber(goalArcsec)}″ is finer than the ${formatNumber(r.resolutionArcsec)}″ (λ/B) that the longest baseline of ${formatNumber(configuration.longestBaselineM, 4)} m reaches at ${ghz(r.skyFrequencyGHz)} GHz.`,
    });
  }
  if (target.extentArcsec > r.largestScaleArcsec) {
    checks.push({
      level: 'warning',
      code: 'EXTENT_EXCEEDS_LARGEST_SCALE',
      field: 'target.extentArcsec',
      message: `The target's extent of ${formatNumber(target.extentArcsec)}″ exceeds the largest angular scale of ${formatNumber(r.largestScaleArcsec)}″ (shortest baseline ${formatNumber(configuration.shortestBaselineM, 4)} m at ${ghz(r.skyFrequencyGHz)} GHz): flux on larger scales will be resolved out.`,
    });
  }
  const goal = input.rmsGoalMicroJy ?? null;
  const hours = input.onSourceHours ?? null;
  if (goal !== null && hours !== null && r.rmsMicroJy !== null && r.onSourceHoursForGoal !== null) {
    if (r.rmsMicroJy > SHORT_OF_GOAL_FACTOR * goal) {
      checks.push({
        level: 'warning',
        code: 'TIME_SHORT_OF_GOAL',
        field: 'onSourceHours',
        message: `${formatNumber(hours)} h on source reaches ${formatNumber(r.rmsMicroJy)} µJy, ${excess(r.rmsMicroJy / goal)} the goal of ${formatNumber(goal)} µJy; the goal needs ${formatNumber(r.onSourceHoursForGoal)} h per pointing.`,
      });
    }
    if (hours > ABOVE_NEED_FACTOR * r.onSourceHoursForGoal) {
      checks.push({
        level: 'warning',
        code: 'TIME_ABOVE_NEED',
        field: 'onSourceHours',
        message: `${formatNumber(hours)} h on source is ${formatNumber(hours / r.onSourceHoursForGoal)} times the ${formatNumber(r.onSourceHoursForGoal)} h that the goal of ${formatNumber(goal)} µJy needs; it would reach ${formatNumber(r.rmsMicroJy)} µJy.`,
      });
    }
  }
  if (!neverRises && r.maxElevationDeg < LOW_ELEVATION_DEG) {
    checks.push({
      level: 'warning',
      code: 'LOW_ELEVATION',
      field: 'target.decDeg',
      message: `At latitude ${deg(array.latitudeDeg)}° a target at declination ${deg(target.decDeg)}° culminates at ${deg(r.maxElevationDeg)}° elevation, below ${LOW_ELEVATION_DEG}°: expect more atmosphere, a higher system temperature and a short window.`,
    });
  }
  if (r.pointings > 1) {
    checks.push({
      level: 'note',
      code: 'MOSAIC_REQUIRED',
      field: 'target.extentArcsec',
      message: `The target's extent of ${formatNumber(target.extentArcsec)}″ exceeds half the primary beam of ${formatNumber(r.primaryBeamArcmin)}′: a mosaic of ${formatNumber(r.pointings, 6)} pointings is needed.`,
    });
  }
  return checks;
}
