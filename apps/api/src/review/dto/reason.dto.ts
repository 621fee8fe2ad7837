import { ApiProperty } from '@nestjs/swagger';
import { Transform } from 'class-transformer';
import { IsString, MaxLength, MinLength } from 'class-validator';
import { VersionDto } from '../../proposals/dto/version.dto.js';

/** Declining an assignment or declaring a conflict: the referee says why. */
export class ReasonDto extends VersionDto {
  @ApiProperty({ minLength: 1, maxLength: 2000, example: 'I collaborate with the PI.' })
  @Transform(({ value }) => (typeof value === 'string' ? value.trim() : value))
  @IsString()
  @MinLength(1, { message: 'reason must say why (it cannot be empty)' })
  @MaxLength(2000)
  reason: string;
}
