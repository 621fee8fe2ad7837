import { ApiProperty, IntersectionType, PartialType } from '@nestjs/swagger';
import { Type } from 'class-transformer';
import {
  IsBoolean,
  IsIn,
  IsNumber,
  IsOptional,
  IsString,
  MaxLength,
  ValidateNested,
} from 'class-validator';
import { VersionDto } from './version.dto.js';

const finite = { allowNaN: false, allowInfinity: false };

export class TargetLineDto {
  @ApiProperty({ example: 1.420405751768, description: 'Rest frequency of the line' })
  @IsNumber(finite)
  restGHz: number;

  @ApiProperty({ required: false, nullable: true, description: 'Positive recedes' })
  @IsOptional()
  @IsNumber(finite)
  velocityKmS?: number | null;

  @ApiProperty({ required: false, nullable: true, enum: ['radio', 'optical', 'relativistic'] })
  @IsOptional()
  @IsIn(['radio', 'optical', 'relativistic'])
  convention?: 'radio' | 'optical' | 'relativistic' | null;

  @ApiProperty({ required: false, nullable: true })
  @IsOptional()
  @IsNumber(finite)
  redshift?: number | null;
}

/** The target's fields without the version, shared by create and update. */
export class TargetFieldsDto {
  @ApiProperty({ example: 'Kestrel filament' })
  @IsString()
  @MaxLength(100)
  name: string;

  @ApiProperty({ example: '04:13:38.4', description: 'Sexagesimal hours or decimal degrees' })
  @IsString()
  @MaxLength(40)
  ra: string;

  @ApiProperty({ example: '+33:40:12', description: 'Sexagesimal or decimal degrees' })
  @IsString()
  @MaxLength(40)
  dec: string;

  @ApiProperty({ required: false, default: 0, description: 'Diameter to image; 0 for a point' })
  @IsOptional()
  @IsNumber(finite)
  extentArcsec?: number;

  @ApiProperty({ required: false, nullable: true })
  @IsOptional()
  @IsNumber(finite)
  fluxDensityMJy?: number | null;

  @ApiProperty({ required: false, nullable: true, type: TargetLineDto })
  @IsOptional()
  @ValidateNested()
  @Type(() => TargetLineDto)
  line?: TargetLineDto | null;
}

export class CreateTargetDto extends IntersectionType(TargetFieldsDto, VersionDto) {}

/** Only the fields sent change. */
export class UpdateTargetDto extends IntersectionType(PartialType(TargetFieldsDto), VersionDto) {}

export class ImportTargetsDto extends VersionDto {
  @ApiProperty({
    description:
      'CSV with the header name,ra,dec,extent_arcsec,flux_mjy,rest_ghz,velocity_km_s,convention,redshift (only name, ra and dec required)',
  })
  @IsString()
  @MaxLength(1_000_000)
  csv: string;

  @ApiProperty({ description: 'true: check and preview only, nothing saved' })
  @IsBoolean()
  dryRun: boolean;
}

export class ImportRowErrorResponse {
  @ApiProperty() column: string;
  @ApiProperty() message: string;
}

export class ImportRowResponse {
  @ApiProperty({ description: 'Line in the file (the header is line 1)' }) line: number;
  @ApiProperty() name: string;
  @ApiProperty({ type: Number, nullable: true }) raDeg: number | null;
  @ApiProperty({ type: Number, nullable: true }) decDeg: number | null;
  @ApiProperty({ type: Number, nullable: true }) extentArcsec: number | null;
  @ApiProperty({ type: Number, nullable: true }) fluxDensityMJy: number | null;
  @ApiProperty({ type: Number, nullable: true }) restGHz: number | null;
  @ApiProperty({ type: Number, nullable: true }) velocityKmS: number | null;
  @ApiProperty({ type: String, nullable: true }) convention: string | null;
  @ApiProperty({ type: Number, nullable: true }) redshift: number | null;
  @ApiProperty({ type: [ImportRowErrorResponse] }) errors: ImportRowErrorResponse[];
}

export class ImportPreviewResponse {
  @ApiProperty({ type: [ImportRowResponse] }) rows: ImportRowResponse[];
  @ApiProperty() valid: number;
  @ApiProperty() invalid: number;
}
