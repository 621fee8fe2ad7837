import { ApiProperty, ApiPropertyOptional } from '@nestjs/swagger';
import {
  IsBoolean,
  IsIn,
  IsNumber,
  IsOptional,
  IsString,
  MaxLength,
  Min,
  Max,
  ValidateIf,
} from 'class-validator';
import { IsInstant } from '../../calls/dto/is-instant.validator.js';
import { VersionDto } from '../../proposals/dto/version.dto.js';
import {
  LOST_REASONS,
  type LostReason,
  RUN_STATUSES,
  type RunStatus,
} from '../entities/run.entity.js';

/**
 * One change of a run: move it (both instants), lock or unlock it, or record it (observed with the
 * hours obtained, lost with a reason, or planned again to undo a record). `version` is the run's.
 */
export class UpdateRunDto extends VersionDto {
  @ApiPropertyOptional({ example: '2027-03-01T21:00:00Z' })
  @ValidateIf((o: UpdateRunDto) => o.startsAt !== undefined || o.endsAt !== undefined)
  @IsInstant()
  startsAt?: string;

  @ApiPropertyOptional({ example: '2027-03-01T23:30:00Z' })
  @ValidateIf((o: UpdateRunDto) => o.startsAt !== undefined || o.endsAt !== undefined)
  @IsInstant()
  endsAt?: string;

  @ApiPropertyOptional()
  @IsOptional()
  @IsBoolean()
  locked?: boolean;

  @ApiPropertyOptional({ enum: RUN_STATUSES })
  @IsOptional()
  @IsIn(RUN_STATUSES)
  status?: RunStatus;

  @ApiPropertyOptional({ example: 2.5, description: 'With status observed: hours obtained' })
  @ValidateIf((o: UpdateRunDto) => o.status === 'observed')
  @IsNumber({ allowNaN: false, allowInfinity: false })
  @Min(0)
  @Max(24)
  hoursObtained?: number;

  @ApiPropertyOptional({ description: 'With status observed: how good the data are' })
  @IsOptional()
  @IsString()
  @MaxLength(5000)
  qualityNote?: string;

  @ApiPropertyOptional({ enum: LOST_REASONS })
  @ValidateIf((o: UpdateRunDto) => o.status === 'lost')
  @IsIn(LOST_REASONS)
  lostReason?: LostReason;
}

/** Cuts a run in two at an instant strictly inside it. */
export class SplitRunDto extends VersionDto {
  @ApiProperty({ example: '2027-03-01T22:00:00Z' })
  @IsInstant()
  at: string;
}
