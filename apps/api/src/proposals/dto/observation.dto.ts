import { ApiProperty, IntersectionType, PartialType } from '@nestjs/swagger';
import { IsIn, IsNumber, IsOptional, IsUUID, Max, Min } from 'class-validator';
import { VersionDto } from './version.dto.js';

const finite = { allowNaN: false, allowInfinity: false };

/** One setup of one target; the calculator's numbers are the server's to compute. */
export class ObservationFieldsDto {
  @ApiProperty({ format: 'uuid', description: 'A target of this proposal' })
  @IsUUID()
  targetId: string;

  @ApiProperty({ format: 'uuid', description: "A receiver band of the call's observatory" })
  @IsUUID()
  bandId: string;

  @ApiProperty({ format: 'uuid', description: "A configuration of the call's observatory" })
  @IsUUID()
  configurationId: string;

  @ApiProperty({ required: false, nullable: true, description: "null: the target's line" })
  @IsOptional()
  @IsNumber(finite)
  @Min(1e-6)
  @Max(1e5)
  frequencyGHz?: number | null;

  @ApiProperty({ example: 500 })
  @IsNumber(finite)
  @Min(1e-6)
  @Max(1e6)
  bandwidthMHz: number;

  @ApiProperty({ required: false, nullable: true })
  @IsOptional()
  @IsNumber(finite)
  @Min(1e-6)
  spectralResolutionKHz?: number | null;

  @ApiProperty({ enum: [1, 2] })
  @IsIn([1, 2], { message: 'polarizations must be 1 or 2' })
  polarizations: 1 | 2;

  @ApiProperty({ required: false, nullable: true })
  @IsOptional()
  @IsNumber(finite)
  @Min(1e-6)
  @Max(1e15)
  rmsGoalMicroJy?: number | null;

  @ApiProperty({ required: false, nullable: true })
  @IsOptional()
  @IsNumber(finite)
  @Min(1e-6)
  @Max(648000)
  resolutionGoalArcsec?: number | null;

  @ApiProperty({ example: 12, description: 'Total hours, pointings and overheads included' })
  @IsNumber(finite)
  @Min(0.01)
  @Max(10000)
  hoursAsked: number;
}

export class CreateObservationDto extends IntersectionType(ObservationFieldsDto, VersionDto) {}

/** Only the fields sent change. */
export class UpdateObservationDto extends IntersectionType(
  PartialType(ObservationFieldsDto),
  VersionDto,
) {}
