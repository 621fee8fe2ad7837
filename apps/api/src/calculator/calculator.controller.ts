import { Body, Controller, HttpCode, Post } from '@nestjs/common';
import {
  ApiBadRequestResponse,
  ApiNotFoundResponse,
  ApiOkResponse,
  ApiTags,
  ApiTooManyRequestsResponse,
} from '@nestjs/swagger';
import { RateLimit } from '../auth/rate-limit/rate-limit.decorator.js';
import type { RateLimitRule } from '../auth/rate-limit/rate-limits.js';
import { Public } from '../common/decorators/public.decorator.js';
import { SkipCsrf } from '../common/decorators/skip-csrf.decorator.js';
import { CalculatorService } from './calculator.service.js';
import { CalculateDto } from './dto/calculate.dto.js';
import { CalculatorResponse } from './dto/calculator.response.js';

/**
 * Per client address: ample for a person or a script checking observations one by one (the
 * Calculator page computes in the browser and does not call this), not for bulk computing.
 */
export const CALCULATOR_RATE_LIMIT = {
  perIp: { limit: 120, windowSeconds: 60 },
} as const satisfies RateLimitRule;

@ApiTags('calculator')
@Controller('calculator')
export class CalculatorController {
  constructor(private readonly calculator: CalculatorService) {}

  /** Anyone may compute; the POST changes nothing, so it needs no CSRF token. */
  @Public()
  @SkipCsrf()
  @RateLimit(CALCULATOR_RATE_LIMIT)
  @Post()
  @HttpCode(200)
  @ApiOkResponse({ type: CalculatorResponse, description: 'Every number and the checks' })
  @ApiBadRequestResponse({ description: 'VALIDATION_FAILED; issues name each bad field by path' })
  @ApiNotFoundResponse({ description: 'NOT_FOUND; issues name each id that matches nothing' })
  @ApiTooManyRequestsResponse({ description: 'RATE_LIMITED: too many requests from this IP' })
  async calculate(@Body() body: CalculateDto): Promise<CalculatorResponse> {
    return CalculatorResponse.from(await this.calculator.calculate(body));
  }
}
