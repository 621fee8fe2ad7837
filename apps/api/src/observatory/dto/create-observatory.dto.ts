import { ApiProperty } from '@nestjs/swagger';
import { IsInt, IsNumber, IsOptional, IsString, Length, Max, Min } from 'class-validator';
import { IsIanaZone } from './is-iana-zone.validator.js';

export class CreateObservatoryDto {
  @ApiProperty({ example: 'Larkspur Valley Array' })
  @IsString()
  @Length(2, 120)
  name: string;

  @ApiProperty({ example: 47.3, description: 'Site latitude, degrees north' })
  @IsNumber({ allowNaN: false, allowInfinity: false })
  @Min(-90)
  @Max(90)
  latitudeDeg: number;

  @ApiProperty({ example: -118.9, description: 'Site longitude, degrees east (west is negative)' })
  @IsNumber({ allowNaN: false, allowInfinity: false })
  @Min(-180)
  @Max(180)
  longitudeDeg: number;

  @ApiProperty({ example: 520, description: 'Site elevation above sea level, metres' })
  @IsNumber({ allowNaN: false, allowInfinity: false })
  @Min(-500)
  @Max(9000)
  elevationM: number;

  @ApiProperty({ example: 15, description: 'Lowest elevation the dishes observe at, degrees' })
  @IsNumber({ allowNaN: false, allowInfinity: false })
  @Min(0)
  @Max(89)
  elevationLimitDeg: number;

  @ApiProperty({ example: 18, description: 'Number of identical antennas' })
  @IsInt()
  @Min(2)
  @Max(10000)
  antennas: number;

  @ApiProperty({ example: 16 })
  @IsNumber({ allowNaN: false, allowInfinity: false })
  @Min(0.1)
  @Max(1000)
  dishDiameterM: number;

  @ApiProperty({ example: 0.88, description: 'Between 0 (exclusive) and 1' })
  @IsNumber({ allowNaN: false, allowInfinity: false })
  @Min(0.01)
  @Max(1)
  correlatorEfficiency: number;

  @ApiProperty({
    example: 0.2,
    description: 'Calibration overhead as a fraction of on-source time',
  })
  @IsNumber({ allowNaN: false, allowInfinity: false })
  @Min(0)
  @Max(5)
  overheadFraction: number;

  @ApiProperty({ example: 1.13, required: false, description: 'Primary beam = beamFactor · λ/D' })
  @IsOptional()
  @IsNumber({ allowNaN: false, allowInfinity: false })
  @Min(0.5)
  @Max(2)
  beamFactor?: number;

  @ApiProperty({ example: 'America/Los_Angeles', description: "IANA name of the site's zone" })
  @IsIanaZone()
  timeZone: string;
}
