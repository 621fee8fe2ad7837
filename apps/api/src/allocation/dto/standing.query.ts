import { ApiProperty } from '@nestjs/swagger';
import { IsIn, IsOptional } from 'class-validator';

export class StandingQuery {
  @ApiProperty({ required: false, enum: ['json', 'csv'], default: 'json' })
  @IsOptional()
  @IsIn(['json', 'csv'], { message: 'format must be json or csv' })
  format: 'json' | 'csv' = 'json';
}
