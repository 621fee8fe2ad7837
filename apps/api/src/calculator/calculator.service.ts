import { Injectable } from '@nestjs/common';
import {
  CalcInputError,
  evaluateObservation,
  type InputIssue,
  type LineInput,
  type ObservationInput,
  type ObservationResult,
} from '@skyhours/calc';
import { validationFailed } from '../common/errors/app-error.js';
import type { CalculateDto, LineDto } from './dto/calculate.dto.js';

/** The calculator on the server: the same library the browser runs, so both give one answer. */
@Injectable()
export class CalculatorService {
  calculate(dto: CalculateDto): ObservationResult {
    const issues = contractIssues(dto);
    try {
      const result = evaluateObservation(toObservationInput(dto));
      if (issues.length > 0) throw validationFailed(issues);
      return result;
    } catch (error) {
      if (error instanceof CalcInputError) throw validationFailed([...issues, ...error.issues]);
      throw error;
    }
  }
}

/** Rules of the HTTP contract that the library, which ignores unknown keys, does not see. */
function contractIssues(dto: CalculateDto): InputIssue[] {
  const line = dto.line;
  if (line?.redshift != null && line.convention != null) {
    return [
      {
        path: 'line.convention',
        message: 'Goes with velocityKmS; a redshift needs no convention.',
      },
    ];
  }
  return [];
}

/**
 * A plain ObservationInput from the validated DTO. The values are passed on untouched (null stays
 * null): the library checks ranges and the rules between fields, and names each bad one.
 */
function toObservationInput(dto: CalculateDto): ObservationInput {
  const { array, configuration, band, target } = dto;
  const common = {
    array: {
      antennas: array.antennas,
      dishDiameterM: array.dishDiameterM,
      latitudeDeg: array.latitudeDeg,
      longitudeDeg: array.longitudeDeg,
      elevationLimitDeg: array.elevationLimitDeg,
      correlatorEfficiency: array.correlatorEfficiency,
      overheadFraction: array.overheadFraction,
      beamFactor: array.beamFactor ?? null,
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
    bandwidthMHz: dto.bandwidthMHz,
    polarizations: dto.polarizations,
    target: {
      raDeg: target.raDeg,
      decDeg: target.decDeg,
      extentArcsec: target.extentArcsec,
      resolutionGoalArcsec: target.resolutionGoalArcsec ?? null,
    },
    rmsGoalMicroJy: dto.rmsGoalMicroJy ?? null,
    onSourceHours: dto.onSourceHours ?? null,
  };
  // Both may be given (the library then names both fields); the cast only widens the union.
  return {
    ...common,
    frequencyGHz: dto.frequencyGHz ?? null,
    line: dto.line == null ? null : toLineInput(dto.line),
  } as ObservationInput;
}

/**
 * Only the keys that carry a value: the library tells a redshift line from a velocity line by the
 * presence of the `redshift` key, so a `"redshift": null` beside a velocity must not reach it.
 */
function toLineInput(line: LineDto): LineInput {
  const shift =
    line.redshift != null
      ? { redshift: line.redshift }
      : { velocityKmS: line.velocityKmS ?? null, convention: line.convention ?? null };
  return { restGHz: line.restGHz, ...shift } as LineInput;
}
