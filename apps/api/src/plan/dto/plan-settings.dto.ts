import { ApiProperty } from '@nestjs/swagger';
import { IsInt, IsNumber, Max, Min } from 'class-validator';

/** The plan's settings; all three are sent together. */
export class PlanSettingsDto {
  @ApiProperty({ example: 8, description: "Hour (0–23, the site's local time) maintenance starts" })
  @IsInt()
  @Min(0)
  @Max(23)
  maintenanceStartHour: number;

  @ApiProperty({ example: 4, description: 'Hours of daily maintenance (0 = none)' })
  @IsInt()
  @Min(0)
  @Max(23)
  maintenanceHours: number;

  @ApiProperty({ example: 0.1, description: 'Fraction of usable hours held back for weather' })
  @IsNumber({ allowNaN: false, allowInfinity: false })
  @Min(0)
  @Max(0.9)
  weatherReserve: number;
}
