import { Body, Controller, HttpCode, Post, UseGuards } from '@nestjs/common';
import {
  ApiBadRequestResponse,
  ApiOkResponse,
  ApiTags,
  ApiTooManyRequestsResponse,
} from '@nestjs/swagger';
import { Public } from '../common/decorators/public.decorator.js';
import { SkipCsrf } from '../common/decorators/skip-csrf.decorator.js';
import { CalculatorRateLimitGuard } from './calculator-rate-limit.guard.js';
import { CalculatorService } from './calculator.service.js';
import { CalculateDto } from './dto/calculate.dto.js';
import { CalculatorResponse } from './dto/calculator.response.js';

@ApiTags('calculator')
@Controller('calculator')
export class CalculatorController {
  constructor(private readonly calculator: CalculatorService) {}

  /** Anyone may compute; the POST changes nothing, so it needs no CSRF token. */
  @Public()
  @SkipCsrf()
  @UseGuards(CalculatorRateLimitGuard)
  @Post()
  @HttpCode(200)
  @ApiOkResponse({ type: CalculatorResponse, description: 'Every number and the checks' })
  @ApiBadRequestResponse({ description: 'VALIDATION_FAILED; issues name each bad field by path' })
  @ApiTooManyRequestsResponse({ description: 'RATE_LIMITED: too many requests from this IP' })
  calculate(@Body() body: CalculateDto): CalculatorResponse {
    return CalculatorResponse.from(this.calculator.calculate(body));
  }
}
