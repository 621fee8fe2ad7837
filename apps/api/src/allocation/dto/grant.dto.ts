import { ApiProperty } from '@nestjs/swagger';
import { Type } from 'class-transformer';
import {
  ArrayMaxSize,
  IsArray,
  IsIn,
  IsNumber,
  IsOptional,
  IsString,
  IsUUID,
  MaxLength,
  Min,
  ValidateNested,
} from 'class-validator';
import type { GrantRequest, Tier } from '../standing-contract.js';

export const TIERS = ['tier1', 'tier2', 'tier3', 'not_allocated'] as const satisfies Tier[];

export class ObservationHoursDto {
  @ApiProperty({ description: 'An observation of the proposal' })
  @IsUUID('all', { message: 'id must be the id of one of the proposal’s observations' })
  id: string;

  @ApiProperty({ description: 'Hours granted: 0 up to the hours asked' })
  @IsNumber(
    { allowNaN: false, allowInfinity: false },
    { message: 'hours must be a number of hours' },
  )
  @Min(0, { message: 'hours must be 0 or more' })
  hours: number;
}

/** `PUT /api/proposals/:reference/grant` (GrantRequest of the standing contract). */
export class GrantDto implements GrantRequest {
  @ApiProperty({ enum: TIERS })
  @IsIn(TIERS, { message: `tier must be one of ${TIERS.join(', ')}` })
  tier: Tier;

  @ApiProperty({
    type: [ObservationHoursDto],
    required: false,
    description:
      'Hours per observation; an observation left out gets the hours it asked (none when not allocated)',
  })
  @IsOptional()
  @IsArray({ message: 'observations must be a list of { id, hours }' })
  @ArrayMaxSize(200)
  @ValidateNested({ each: true })
  @Type(() => ObservationHoursDto)
  observations?: ObservationHoursDto[];

  @ApiProperty({ required: false, maxLength: 5000 })
  @IsOptional()
  @IsString({ message: 'note must be text' })
  @MaxLength(5000, { message: 'note must be at most 5000 characters' })
  note?: string;
}
