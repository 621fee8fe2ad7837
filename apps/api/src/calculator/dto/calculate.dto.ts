import { applyDecorators } from '@nestjs/common';
import { ApiProperty, ApiPropertyOptional } from '@nestjs/swagger';
import { IsIn, IsOptional, IsUUID } from 'class-validator';
import { IntegerField, NumberField, NestedObject, OptionalNumberField } from './fields.js';

/** The body of POST /api/calculator, as SCIENCE.md "The calculator's HTTP contract" gives it. */

export class ArrayDto {
  @ApiProperty({ example: 18, description: 'Number of identical antennas N (≥ 2)' })
  @IntegerField()
  antennas: number;

  @ApiProperty({ example: 16, description: 'Dish diameter D in metres' })
  @NumberField()
  dishDiameterM: number;

  @ApiProperty({ example: 47.3, description: 'Site latitude, degrees north' })
  @NumberField()
  latitudeDeg: number;

  @ApiProperty({ example: -118.9, description: 'Site longitude, degrees east' })
  @NumberField()
  longitudeDeg: number;

  @ApiProperty({ example: 15, description: 'Lowest usable elevation, degrees' })
  @NumberField()
  elevationLimitDeg: number;

  @ApiProperty({ example: 0.88, description: 'Correlator efficiency η_c (0–1]' })
  @NumberField()
  correlatorEfficiency: number;

  @ApiProperty({
    example: 0.2,
    description: 'Calibration overhead as a fraction of on-source time',
  })
  @NumberField()
  overheadFraction: number;

  @ApiPropertyOptional({
    example: 1.13,
    nullable: true,
    type: Number,
    description: 'Primary beam = beamFactor · λ/D; absent or null: 1.13',
  })
  @OptionalNumberField()
  beamFactor?: number | null;
}

export class ConfigurationDto {
  @ApiProperty({ example: 30, description: 'Shortest baseline in metres' })
  @NumberField()
  shortestBaselineM: number;

  @ApiProperty({ example: 3200, description: 'Longest baseline in metres' })
  @NumberField()
  longestBaselineM: number;
}

export class BandDto {
  @ApiProperty({ example: 1, description: 'Lower edge of the band, GHz' })
  @NumberField()
  minGHz: number;

  @ApiProperty({ example: 2, description: 'Upper edge of the band, GHz' })
  @NumberField()
  maxGHz: number;

  @ApiProperty({ example: 28, description: 'System temperature T_sys, kelvin' })
  @NumberField()
  tsysK: number;

  @ApiProperty({ example: 0.65, description: 'Aperture efficiency η_a (0–1]' })
  @NumberField()
  apertureEfficiency: number;

  @ApiProperty({ example: 1000, description: 'Widest instantaneous bandwidth, MHz' })
  @NumberField()
  maxBandwidthMHz: number;
}

export const VELOCITY_CONVENTIONS = ['radio', 'optical', 'relativistic'] as const;

/** Either { restGHz, velocityKmS, convention } or { restGHz, redshift }. */
export class LineDto {
  @ApiProperty({ example: 1.420405751768, description: 'Rest frequency of the line, GHz' })
  @NumberField()
  restGHz: number;

  @ApiPropertyOptional({
    example: 1500,
    type: Number,
    description: 'Velocity in km/s (positive recedes); with convention, instead of redshift',
  })
  @OptionalNumberField()
  velocityKmS?: number | null;

  @ApiPropertyOptional({ enum: VELOCITY_CONVENTIONS, description: 'Goes with velocityKmS' })
  @IsOptional()
  @IsIn(VELOCITY_CONVENTIONS, { message: 'Must be "radio", "optical" or "relativistic".' })
  convention?: (typeof VELOCITY_CONVENTIONS)[number] | null;

  @ApiPropertyOptional({ example: 0.05, type: Number, description: 'Instead of velocityKmS' })
  @OptionalNumberField()
  redshift?: number | null;
}

export class TargetDto {
  @ApiProperty({ example: 150.1, description: 'ICRS right ascension, degrees [0, 360)' })
  @NumberField()
  raDeg: number;

  @ApiProperty({ example: 22.5, description: 'ICRS declination, degrees' })
  @NumberField()
  decDeg: number;

  @ApiProperty({
    example: 0,
    description: 'Diameter of the region to image, arcsec; 0 for a point',
  })
  @NumberField()
  extentArcsec: number;

  @ApiPropertyOptional({
    example: null,
    nullable: true,
    type: Number,
    description: 'Finest resolution the science needs, arcsec',
  })
  @OptionalNumberField()
  resolutionGoalArcsec?: number | null;
}

const StoredId = (what: string) =>
  applyDecorators(
    ApiPropertyOptional({
      format: 'uuid',
      description: `A stored ${what}, instead of the inline one`,
    }),
    IsOptional(),
    IsUUID('all', { message: `Must be the id of a stored ${what} (a UUID).` }),
  );

/**
 * Each of the array, the configuration and the band is given inline or named by the id of the
 * stored record (`observatoryId`, `configurationId`, `bandId`), not both.
 */
export class CalculateDto {
  @ApiPropertyOptional({ type: ArrayDto })
  @IsOptional()
  @NestedObject(() => ArrayDto)
  array?: ArrayDto | null;

  @StoredId('observatory (its array and site)')
  observatoryId?: string | null;

  @ApiPropertyOptional({ type: ConfigurationDto })
  @IsOptional()
  @NestedObject(() => ConfigurationDto)
  configuration?: ConfigurationDto | null;

  @StoredId('configuration')
  configurationId?: string | null;

  @ApiPropertyOptional({ type: BandDto })
  @IsOptional()
  @NestedObject(() => BandDto)
  band?: BandDto | null;

  @StoredId('receiver band')
  bandId?: string | null;

  @ApiPropertyOptional({
    example: 1.4,
    type: Number,
    description: 'Sky frequency, GHz; give this or line, not both',
  })
  @OptionalNumberField()
  frequencyGHz?: number | null;

  @ApiPropertyOptional({ type: LineDto, description: 'A line target; instead of frequencyGHz' })
  @IsOptional()
  @NestedObject(() => LineDto)
  line?: LineDto | null;

  @ApiProperty({ example: 500, description: 'Bandwidth, MHz' })
  @NumberField()
  bandwidthMHz: number;

  @ApiProperty({ enum: [1, 2], example: 2, description: 'Polarisations recorded' })
  @IsIn([1, 2], { message: 'Must be 1 or 2.' })
  polarizations: 1 | 2;

  @ApiProperty({ type: TargetDto })
  @NestedObject(() => TargetDto)
  target: TargetDto;

  @ApiPropertyOptional({
    example: 10,
    type: Number,
    nullable: true,
    description: 'rms goal, µJy/beam',
  })
  @OptionalNumberField()
  rmsGoalMicroJy?: number | null;

  @ApiPropertyOptional({
    example: 2,
    type: Number,
    nullable: true,
    description: 'On-source hours of one pointing',
  })
  @OptionalNumberField()
  onSourceHours?: number | null;
}
