import { ApiProperty } from '@nestjs/swagger';
import { IsISO8601, IsNumber, IsOptional, IsString, Length, Max, Min } from 'class-validator';

export class CreateConfigurationDto {
  @ApiProperty({ example: 'compact' })
  @IsString()
  @Length(1, 60)
  name: string;

  @ApiProperty({ example: 30 })
  @IsNumber({ allowNaN: false, allowInfinity: false })
  @Min(0.1)
  @Max(1e7)
  shortestBaselineM: number;

  @ApiProperty({ example: 600 })
  @IsNumber({ allowNaN: false, allowInfinity: false })
  @Min(0.1)
  @Max(1e7)
  longestBaselineM: number;

  @ApiProperty({ example: '2026-09-01', description: 'First day in use (YYYY-MM-DD)' })
  @IsISO8601({ strict: true, strictSeparator: true })
  @Length(10, 10, { message: 'inUseFrom must be a calendar date YYYY-MM-DD' })
  inUseFrom: string;

  @ApiProperty({
    example: '2027-01-31',
    required: false,
    nullable: true,
    description: 'Last day in use (YYYY-MM-DD); null: until further notice',
  })
  @IsOptional()
  @IsISO8601({ strict: true, strictSeparator: true })
  @Length(10, 10, { message: 'inUseTo must be a calendar date YYYY-MM-DD' })
  inUseTo?: string | null;
}
