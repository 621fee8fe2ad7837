import { ApiProperty } from '@nestjs/swagger';

export class HealthResponse {
  @ApiProperty({ enum: ['ok', 'degraded'] })
  status: 'ok' | 'degraded';

  @ApiProperty({ enum: ['up', 'down'] })
  database: 'up' | 'down';

  @ApiProperty({ enum: ['up', 'down'] })
  mail: 'up' | 'down';

  @ApiProperty({ example: '0.1.0' })
  version: string;
}
