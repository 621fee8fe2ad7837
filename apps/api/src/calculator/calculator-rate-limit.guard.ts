import {
  type CanActivate,
  type ExecutionContext,
  HttpStatus,
  Injectable,
  type OnModuleDestroy,
} from '@nestjs/common';
import type { Request, Response } from 'express';
import { AppError } from '../common/errors/app-error.js';

/** Requests per client address and minute. A person typing sends a handful; a script, thousands. */
export const CALCULATOR_REQUESTS_PER_MINUTE = 120;
const WINDOW_MS = 60_000;

interface Window {
  startedAt: number;
  hits: number;
}

/**
 * Rate limit of POST /api/calculator: a fixed one-minute window per client address.
 *
 * The counts live in this process's memory, not in PostgreSQL: the route is a cheap, stateless,
 * public computation, so a count lost on restart, or kept apart per process, costs less than a
 * database write per request. It is written here rather than taken from @nestjs/throttler because
 * that package is CommonJS requiring the ESM-only @nestjs/common, which jest cannot load (only
 * Node's own loader can), so it would stop every e2e suite that boots the AppModule.
 */
@Injectable()
export class CalculatorRateLimitGuard implements CanActivate, OnModuleDestroy {
  private readonly windows = new Map<string, Window>();
  private readonly sweeper = setInterval(() => this.sweep(Date.now()), WINDOW_MS);

  constructor() {
    this.sweeper.unref();
  }

  canActivate(context: ExecutionContext): boolean {
    const http = context.switchToHttp();
    const req = http.getRequest<Request>();
    const res = http.getResponse<Response>();
    // req.ip honours the TRUST_PROXY setting (configure-app.ts), so behind a proxy it is the client.
    const key = req.ip ?? req.socket.remoteAddress ?? 'unknown';
    const now = Date.now();
    let window = this.windows.get(key);
    if (!window || now - window.startedAt >= WINDOW_MS) {
      window = { startedAt: now, hits: 0 };
      this.windows.set(key, window);
    }
    window.hits += 1;
    const resetSeconds = Math.ceil((window.startedAt + WINDOW_MS - now) / 1000);
    res.setHeader('RateLimit-Limit', CALCULATOR_REQUESTS_PER_MINUTE);
    res.setHeader('RateLimit-Remaining', Math.max(0, CALCULATOR_REQUESTS_PER_MINUTE - window.hits));
    res.setHeader('RateLimit-Reset', resetSeconds);
    if (window.hits <= CALCULATOR_REQUESTS_PER_MINUTE) return true;
    res.setHeader('Retry-After', resetSeconds);
    throw new AppError(
      HttpStatus.TOO_MANY_REQUESTS,
      'RATE_LIMITED',
      `More than ${CALCULATOR_REQUESTS_PER_MINUTE} calculations a minute from this address; try again in ${resetSeconds} s`,
    );
  }

  onModuleDestroy(): void {
    clearInterval(this.sweeper);
  }

  /** Forgets finished windows, so the map holds only the addresses of the last minute. */
  private sweep(now: number): void {
    for (const [key, window] of this.windows) {
      if (now - window.startedAt >= WINDOW_MS) this.windows.delete(key);
    }
  }
}
