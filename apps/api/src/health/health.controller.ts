import { Controller, Get, Res } from '@nestjs/common';
import { ApiOkResponse, ApiServiceUnavailableResponse, ApiTags } from '@nestjs/swagger';
import type { Response } from 'express';
import { Public } from '../common/decorators/public.decorator.js';
import { HealthResponse } from './health.response.js';
import { HealthService } from './health.service.js';

@ApiTags('health')
@Controller('health')
export class HealthController {
  constructor(private readonly health: HealthService) {}

  @Public()
  @Get()
  @ApiOkResponse({ type: HealthResponse, description: 'PostgreSQL and the mail server answer' })
  @ApiServiceUnavailableResponse({ type: HealthResponse, description: 'one of them does not' })
  async check(@Res({ passthrough: true }) res: Response): Promise<HealthResponse> {
    const report = await this.health.check();
    res.status(report.status === 'ok' ? 200 : 503).setHeader('Cache-Control', 'no-store');
    return report;
  }
}
