import { applyDecorators, SetMetadata, UseGuards } from '@nestjs/common';
import { RATE_LIMIT_KEY, RateLimitGuard } from './rate-limit.guard.js';
import type { RateLimitRule } from './rate-limits.js';

/**
 * Limits the route per client address and/or per account (numbers in rate-limits.ts), with the
 * counters in PostgreSQL so the limit holds across API processes.
 */
export const RateLimit = (rule: RateLimitRule) =>
  applyDecorators(SetMetadata(RATE_LIMIT_KEY, rule), UseGuards(RateLimitGuard));
