import { ApiProperty } from '@nestjs/swagger';
import {
  ArrayMaxSize,
  ArrayMinSize,
  ArrayUnique,
  IsArray,
  IsIn,
  IsNumber,
  IsOptional,
  IsString,
  Length,
  Max,
  Min,
} from 'class-validator';
import {
  IEEE_LETTERS,
  type IeeeLetter,
  POLARIZATIONS,
  type Polarization,
} from '../entities/receiver-band.entity.js';

export class CreateReceiverBandDto {
  @ApiProperty({ example: 'L band' })
  @IsString()
  @Length(1, 60)
  name: string;

  @ApiProperty({ enum: IEEE_LETTERS, required: false, nullable: true, example: 'L' })
  @IsOptional()
  @IsIn(IEEE_LETTERS)
  ieeeLetter?: IeeeLetter | null;

  @ApiProperty({ example: 1 })
  @IsNumber({ allowNaN: false, allowInfinity: false })
  @Min(0.001)
  @Max(2000)
  minGHz: number;

  @ApiProperty({ example: 2 })
  @IsNumber({ allowNaN: false, allowInfinity: false })
  @Min(0.001)
  @Max(2000)
  maxGHz: number;

  @ApiProperty({ example: 28, description: 'System temperature, kelvin' })
  @IsNumber({ allowNaN: false, allowInfinity: false })
  @Min(1)
  @Max(10000)
  tsysK: number;

  @ApiProperty({ example: 0.65, description: 'Between 0 (exclusive) and 1' })
  @IsNumber({ allowNaN: false, allowInfinity: false })
  @Min(0.01)
  @Max(1)
  apertureEfficiency: number;

  @ApiProperty({ example: 1000, description: 'Widest instantaneous bandwidth, MHz' })
  @IsNumber({ allowNaN: false, allowInfinity: false })
  @Min(0.001)
  @Max(1e6)
  maxBandwidthMHz: number;

  @ApiProperty({
    enum: POLARIZATIONS,
    isArray: true,
    example: [1, 2],
    description: 'Numbers of polarisation products offered',
  })
  @IsArray()
  @ArrayMinSize(1)
  @ArrayMaxSize(2)
  @ArrayUnique()
  @IsIn(POLARIZATIONS, { each: true })
  polarizations: Polarization[];
}
