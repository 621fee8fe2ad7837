import { ApiProperty } from '@nestjs/swagger';
import { Type } from 'class-transformer';
import { IsInt, Max, Min } from 'class-validator';

export class VersionSummaryResponse {
  @ApiProperty() number: number;
  @ApiProperty() submittedAt: string;
  @ApiProperty({ type: String, nullable: true, description: 'Name of who submitted it' })
  submittedBy: string | null;
  @ApiProperty() totalHours: number;
}

export class VersionChangeResponse {
  @ApiProperty({ example: 'observations.1.hoursAsked' }) path: string;
  @ApiProperty({ example: 'Observation 2 · hours asked' }) label: string;
  @ApiProperty({ nullable: true }) before: unknown;
  @ApiProperty({ nullable: true }) after: unknown;
}

export class VersionComparisonResponse {
  @ApiProperty({ type: [VersionChangeResponse] }) changes: VersionChangeResponse[];
}

export class CompareVersionsQuery {
  @ApiProperty({ example: 1 })
  @Type(() => Number)
  @IsInt()
  @Min(1)
  @Max(1_000_000)
  from: number;

  @ApiProperty({ example: 2 })
  @Type(() => Number)
  @IsInt()
  @Min(1)
  @Max(1_000_000)
  to: number;
}
