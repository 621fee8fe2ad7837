import { ApiProperty } from '@nestjs/swagger';
import { Transform, Type } from 'class-transformer';
import {
  ArrayMaxSize,
  ArrayMinSize,
  ArrayUnique,
  IsArray,
  IsBoolean,
  IsIn,
  IsInt,
  IsNumber,
  IsOptional,
  IsString,
  IsUUID,
  Length,
  Matches,
  Max,
  MaxLength,
  Min,
  ValidateNested,
} from 'class-validator';
import { IsIanaZone } from '../../observatory/dto/is-iana-zone.validator.js';
import { PROPOSAL_KINDS, type ProposalKind } from '../call-lifecycle.js';
import { IsInstant } from './is-instant.validator.js';

export class CapacityDto {
  @ApiProperty({ format: 'uuid' })
  @IsUUID()
  configurationId: string;

  @ApiProperty({ example: 400, description: 'Hours on offer in this configuration' })
  @IsNumber({ allowNaN: false, allowInfinity: false })
  @Min(0.1)
  @Max(100000)
  hours: number;
}

export class CreateCallDto {
  @ApiProperty({ example: 'SP27', description: 'Letters, digits and dashes; stored upper case' })
  @Transform(({ value }) => (typeof value === 'string' ? value.trim().toUpperCase() : value))
  @IsString()
  @Matches(/^[A-Z][A-Z0-9-]{1,15}$/, {
    message: 'code must be 2–16 letters, digits or dashes, starting with a letter (e.g. SP27)',
  })
  code: string;

  @ApiProperty({ format: 'uuid' })
  @IsUUID()
  observatoryId: string;

  @ApiProperty({ example: 'Spring 2027 call for proposals' })
  @IsString()
  @Length(3, 200)
  title: string;

  @ApiProperty({ required: false, description: 'Plain text shown on the call page' })
  @IsOptional()
  @IsString()
  @MaxLength(20000)
  description?: string;

  @ApiProperty({
    example: 'America/Los_Angeles',
    description: "IANA zone the call's dates are announced in",
  })
  @IsIanaZone()
  timeZone: string;

  @ApiProperty({ example: '2026-12-01T09:00:00-08:00' })
  @IsInstant()
  opensAt: string;

  @ApiProperty({ example: '2027-01-15T17:00:00-08:00' })
  @IsInstant()
  deadlineAt: string;

  @ApiProperty({ example: '2027-02-26T17:00:00-08:00' })
  @IsInstant()
  reviewDueAt: string;

  @ApiProperty({ type: [CapacityDto] })
  @IsArray()
  @ArrayMaxSize(50)
  @ValidateNested({ each: true })
  @Type(() => CapacityDto)
  capacity: CapacityDto[];

  @ApiProperty({ example: 4, description: 'Pages allowed in the science case' })
  @IsInt()
  @Min(1)
  @Max(100)
  scienceCasePageLimit: number;

  @ApiProperty({ example: 5, description: 'Largest science-case PDF, megabytes' })
  @IsNumber({ allowNaN: false, allowInfinity: false })
  @Min(0.1)
  @Max(100)
  scienceCaseMaxMb: number;

  @ApiProperty({ enum: PROPOSAL_KINDS, isArray: true })
  @IsArray()
  @ArrayMinSize(1)
  @ArrayUnique()
  @IsIn(PROPOSAL_KINDS, { each: true })
  proposalKinds: ProposalKind[];

  @ApiProperty({ example: 200, description: 'Largest request per proposal, hours' })
  @IsNumber({ allowNaN: false, allowInfinity: false })
  @Min(0.1)
  @Max(100000)
  maxHoursPerProposal: number;

  @ApiProperty({ required: false, default: 1 })
  @IsOptional()
  @IsInt()
  @Min(-100)
  @Max(100)
  scoreMin?: number;

  @ApiProperty({ required: false, default: 10 })
  @IsOptional()
  @IsInt()
  @Min(-100)
  @Max(100)
  scoreMax?: number;

  @ApiProperty({ required: false, default: true })
  @IsOptional()
  @IsBoolean()
  scoreHigherIsBetter?: boolean;

  @ApiProperty({ required: false, default: 3 })
  @IsOptional()
  @IsInt()
  @Min(1)
  @Max(20)
  refereesPerProposal?: number;

  @ApiProperty({ required: false, default: false })
  @IsOptional()
  @IsBoolean()
  anonymousReview?: boolean;
}
