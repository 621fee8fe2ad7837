import { HttpStatus, Injectable } from '@nestjs/common';
import { InjectRepository } from '@nestjs/typeorm';
import {
  CalcInputError,
  evaluateObservation,
  validateObservationInput,
  type ArraySettings,
  type BandSettings,
  type ConfigurationSettings,
  type InputIssue,
  type LineInput,
  type ObservationInput,
  type ObservationResult,
} from '@skyhours/calc';
import type { Repository } from 'typeorm';
import { AppError, validationFailed } from '../common/errors/app-error.js';
import { Configuration } from '../observatory/entities/configuration.entity.js';
import { Observatory } from '../observatory/entities/observatory.entity.js';
import { ReceiverBand } from '../observatory/entities/receiver-band.entity.js';
import type { CalculateDto, LineDto } from './dto/calculate.dto.js';

/** The stored records a request names by id. */
interface Stored {
  observatory: Observatory | null;
  configuration: Configuration | null;
  band: ReceiverBand | null;
}

/** The calculator on the server: the same library the browser runs, so both give one answer. */
@Injectable()
export class CalculatorService {
  constructor(
    @InjectRepository(Observatory) private readonly observatories: Repository<Observatory>,
    @InjectRepository(Configuration) private readonly configurations: Repository<Configuration>,
    @InjectRepository(ReceiverBand) private readonly bands: Repository<ReceiverBand>,
  ) {}

  async calculate(dto: CalculateDto): Promise<ObservationResult> {
    const stored = await this.loadStored(dto);
    const input = toObservationInput(dto, stored);
    const own = contractIssues(dto, stored);
    // The library reports a missing part too ("array: Required"); the contract's own sentence,
    // which names the id alternative, says it better.
    const library = validateObservationInput(input).filter(
      (issue) => !own.some((mine) => mine.path === issue.path),
    );
    const issues = [...own, ...library];
    if (issues.length > 0) throw validationFailed(issues);
    try {
      return evaluateObservation(input);
    } catch (error) {
      if (error instanceof CalcInputError) throw validationFailed([...error.issues]);
      throw error;
    }
  }

  /** Loads the records named by id; a 404 names every id that matches nothing. */
  private async loadStored(dto: CalculateDto): Promise<Stored> {
    const [observatory, configuration, band] = await Promise.all([
      dto.observatoryId ? this.observatories.findOneBy({ id: dto.observatoryId }) : null,
      dto.configurationId ? this.configurations.findOneBy({ id: dto.configurationId }) : null,
      dto.bandId ? this.bands.findOneBy({ id: dto.bandId }) : null,
    ]);
    const missing: InputIssue[] = [];
    if (dto.observatoryId && !observatory) {
      missing.push({ path: 'observatoryId', message: 'No stored observatory has this id.' });
    }
    if (dto.configurationId && !configuration) {
      missing.push({ path: 'configurationId', message: 'No stored configuration has this id.' });
    }
    if (dto.bandId && !band) {
      missing.push({ path: 'bandId', message: 'No stored receiver band has this id.' });
    }
    if (missing.length > 0) {
      throw new AppError(
        HttpStatus.NOT_FOUND,
        'NOT_FOUND',
        `Not found: ${missing.map((issue) => issue.path).join(', ')}`,
        missing,
      );
    }
    return { observatory, configuration, band };
  }
}

/** Rules of the HTTP contract that the library, which sees only the merged input, cannot check. */
function contractIssues(dto: CalculateDto, stored: Stored): InputIssue[] {
  const issues: InputIssue[] = [];
  const either = (inline: 'array' | 'configuration' | 'band', id: string, what: string) => {
    const hasInline = dto[inline] != null;
    const hasId = dto[id as keyof CalculateDto] != null;
    if (hasInline && hasId) {
      const message = `Give ${inline} or ${id}, not both.`;
      issues.push({ path: inline, message }, { path: id, message });
    } else if (!hasInline && !hasId) {
      issues.push({
        path: inline,
        message: `Required: an object, or ${id} naming a stored ${what}.`,
      });
    }
  };
  either('array', 'observatoryId', 'observatory');
  either('configuration', 'configurationId', 'configuration');
  either('band', 'bandId', 'receiver band');

  // A stored configuration or band of another observatory than the one named would mix two arrays.
  const { observatory, configuration, band } = stored;
  if (observatory && configuration && configuration.observatoryId !== observatory.id) {
    issues.push({
      path: 'configurationId',
      message: 'Belongs to another observatory than observatoryId.',
    });
  }
  if (observatory && band && band.observatoryId !== observatory.id) {
    issues.push({ path: 'bandId', message: 'Belongs to another observatory than observatoryId.' });
  }

  if (dto.line?.redshift != null && dto.line.convention != null) {
    issues.push({
      path: 'line.convention',
      message: 'Goes with velocityKmS; a redshift needs no convention.',
    });
  }
  return issues;
}

function arrayOf(dto: CalculateDto, observatory: Observatory | null): ArraySettings | undefined {
  const source = dto.array ?? observatory;
  if (!source) return undefined;
  return {
    antennas: source.antennas,
    dishDiameterM: source.dishDiameterM,
    latitudeDeg: source.latitudeDeg,
    longitudeDeg: source.longitudeDeg,
    elevationLimitDeg: source.elevationLimitDeg,
    correlatorEfficiency: source.correlatorEfficiency,
    overheadFraction: source.overheadFraction,
    beamFactor: source.beamFactor ?? null,
  };
}

function configurationOf(
  dto: CalculateDto,
  configuration: Configuration | null,
): ConfigurationSettings | undefined {
  const source = dto.configuration ?? configuration;
  return source
    ? { shortestBaselineM: source.shortestBaselineM, longestBaselineM: source.longestBaselineM }
    : undefined;
}

function bandOf(dto: CalculateDto, band: ReceiverBand | null): BandSettings | undefined {
  const source = dto.band ?? band;
  return source
    ? {
        minGHz: source.minGHz,
        maxGHz: source.maxGHz,
        tsysK: source.tsysK,
        apertureEfficiency: source.apertureEfficiency,
        maxBandwidthMHz: source.maxBandwidthMHz,
      }
    : undefined;
}

/**
 * A plain ObservationInput from the validated DTO and the stored records. The values are passed
 * on untouched (null stays null): the library checks ranges and the rules between fields.
 */
function toObservationInput(dto: CalculateDto, stored: Stored): ObservationInput {
  const { target } = dto;
  // A part missing or given twice is reported by contractIssues; the casts only widen.
  return {
    array: arrayOf(dto, stored.observatory) as ArraySettings,
    configuration: configurationOf(dto, stored.configuration) as ConfigurationSettings,
    band: bandOf(dto, stored.band) as BandSettings,
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
    // Both may be given (the library then names both fields).
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
