import { Injectable } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import { createHash } from 'node:crypto';
import type { Request } from 'express';
import type { DataSource } from 'typeorm';
import { PgThrottlerStorage } from './pg-throttler.storage.js';
import { SIGN_IN_FAILURE_LIMITS } from './rate-limits.js';
import { tooManyAttempts } from './too-many-attempts.js';
import { ipTracker } from './trackers.js';

const key = (parts: string) =>
  createHash('sha256').update(`sign-in-failures:${parts}`).digest('hex');

/**
 * Counts failed password checks per client address and per account (known or not, so a block
 * tells nothing about whether the account exists). Once either passes its limit, attempts are
 * refused with 429 before the password is even checked, until the window ends.
 */
@Injectable()
export class SignInLimiter {
  private readonly storage: PgThrottlerStorage;

  constructor(@InjectDataSource() dataSource: DataSource) {
    this.storage = new PgThrottlerStorage(dataSource);
  }

  private keys(req: Request, email: string) {
    const rule = SIGN_IN_FAILURE_LIMITS;
    return [
      { key: key(`ip:${ipTracker(req)}`), limit: rule.perIp },
      { key: key(`account:${email.trim().toLowerCase()}`), limit: rule.perAccount },
    ];
  }

  async assertMayTry(req: Request, email: string): Promise<void> {
    for (const { key } of this.keys(req, email)) {
      const state = await this.storage.peek(key);
      if (state?.isBlocked) throw tooManyAttempts(req.res, state.timeToBlockExpire);
    }
  }

  /** Counts a failure; throws the 429 when this one passed a limit. */
  async recordFailure(req: Request, email: string): Promise<void> {
    let retryAfter = 0;
    for (const { key, limit } of this.keys(req, email)) {
      const windowMs = limit.windowSeconds * 1000;
      const state = await this.storage.increment(key, windowMs, limit.limit, windowMs);
      if (state.isBlocked) retryAfter = Math.max(retryAfter, state.timeToBlockExpire);
    }
    if (retryAfter > 0) throw tooManyAttempts(req.res, retryAfter);
  }

  /** A right password ends the account's run of failures (not the address's). */
  async recordSuccess(req: Request, email: string): Promise<void> {
    const account = this.keys(req, email)[1];
    if (account) await this.storage.reset(account.key);
  }
}
