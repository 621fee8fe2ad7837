import { ApiProperty } from '@nestjs/swagger';
import { Transform } from 'class-transformer';
import { IsISO31661Alpha2, IsOptional, IsString, MaxLength, MinLength } from 'class-validator';
import { normalizeOrcid } from '../orcid.js';
import { IsOrcid } from '../orcid.validator.js';

const trim = ({ value }: { value: unknown }) => (typeof value === 'string' ? value.trim() : value);

/** The details a person gives about themselves, at registration and on their profile. */
export class ProfileFieldsDto {
  @ApiProperty({ example: 'Ada Quinterra' })
  @Transform(trim)
  @IsString()
  @MinLength(1, { message: 'name must not be empty' })
  @MaxLength(200)
  name: string;

  @ApiProperty({ description: 'Institute name', example: 'Example Institute of Radio Physics' })
  @Transform(trim)
  @IsString()
  @MinLength(1, { message: 'affiliation must not be empty' })
  @MaxLength(300)
  affiliation: string;

  @ApiProperty({ description: "The institute's country, ISO 3166-1 alpha-2", example: 'NZ' })
  @Transform(({ value }) => (typeof value === 'string' ? value.trim().toUpperCase() : value))
  @IsISO31661Alpha2({ message: 'country must be a two-letter ISO 3166-1 country code' })
  country: string;

  @ApiProperty({
    required: false,
    nullable: true,
    description: 'ORCID iD, bare or as an https://orcid.org/ link; empty or null clears it',
    example: '0000-0002-1825-0097',
  })
  @Transform(({ value }) =>
    typeof value === 'string' ? normalizeOrcid(value) || null : (value ?? null),
  )
  @IsOptional()
  @IsOrcid()
  orcid?: string | null;
}
