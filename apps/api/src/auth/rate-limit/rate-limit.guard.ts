import { type CanActivate, type ExecutionContext, Injectable } from '@nestjs/common';
import { Reflector } from '@nestjs/core';
import { InjectDataSource } from '@nestjs/typeorm';
import { createHash } from 'node:crypto';
import type { Request, Response } from 'express';
import type { DataSource } from 'typeorm';
import { PgThrottlerStorage } from './pg-throttler.storage.js';
import type { Limit, RateLimitRule } from './rate-limits.js';
import { emailTracker, ipTracker } from './trackers.js';
import { tooManyAttempts } from './too-many-attempts.js';

export const RATE_LIMIT_KEY = 'skyhours:rate-limit';

/**
 * Counts the request against the route's limits (per client address, per account) and answers
 * 429 with Retry-After once one is passed. Runs after the global guards, before validation, so a
 * malformed request counts too.
 */
@Injectable()
export class RateLimitGuard implements CanActivate {
  private readonly storage: PgThrottlerStorage;

  constructor(
    private readonly reflector: Reflector,
    @InjectDataSource() dataSource: DataSource,
  ) {
    this.storage = new PgThrottlerStorage(dataSource);
  }

  async canActivate(context: ExecutionContext): Promise<boolean> {
    const rule = this.reflector.get<RateLimitRule | undefined>(
      RATE_LIMIT_KEY,
      context.getHandler(),
    );
    if (!rule) return true;
    const req = context.switchToHttp().getRequest<Request>();
    const route = `${context.getClass().name}.${context.getHandler().name}`;
    const counted: { name: string; limit: Limit; tracker: string }[] = [];
    if (rule.perIp) counted.push({ name: 'ip', limit: rule.perIp, tracker: ipTracker(req) });
    if (rule.perAccount) {
      const tracker =
        rule.perAccount.by === 'body-email'
          ? `email:${emailTracker(req.body)}`
          : `user:${req.user?.id ?? ''}`;
      counted.push({ name: 'account', limit: rule.perAccount, tracker });
    }
    for (const { name, limit, tracker } of counted) {
      const key = createHash('sha256').update(`${route}:${name}:${tracker}`).digest('hex');
      const windowMs = limit.windowSeconds * 1000;
      const state = await this.storage.increment(key, windowMs, limit.limit, windowMs);
      if (state.isBlocked) {
        throw tooManyAttempts(
          context.switchToHttp().getResponse<Response>(),
          state.timeToBlockExpire,
        );
      }
    }
    return true;
  }
}
