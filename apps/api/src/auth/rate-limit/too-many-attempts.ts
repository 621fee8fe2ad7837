import { HttpStatus } from '@nestjs/common';
import type { Response } from 'express';
import { AppError } from '../../common/errors/app-error.js';

/**
 * The 429 answer: the one envelope, with a Retry-After header (seconds, RFC 9110 §10.2.3) set on
 * the response that will carry it.
 */
export function tooManyAttempts(res: Response | undefined, retryAfterSeconds: number): AppError {
  const seconds = Math.max(1, Math.ceil(retryAfterSeconds));
  res?.setHeader('Retry-After', String(seconds));
  const minutes = Math.ceil(seconds / 60);
  return new AppError(
    HttpStatus.TOO_MANY_REQUESTS,
    'RATE_LIMITED',
    `Too many attempts. Try again in ${minutes === 1 ? 'a minute' : `${minutes} minutes`}.`,
  );
}
