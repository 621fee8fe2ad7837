import {
  type ArgumentsHost,
  Catch,
  type ExceptionFilter,
  HttpException,
  HttpStatus,
  Logger,
} from '@nestjs/common';
import type { Response } from 'express';
import { QueryFailedError } from 'typeorm';
import type { ErrorEnvelope } from '../errors/app-error.js';

const CODES: Record<number, string> = {
  400: 'BAD_REQUEST',
  401: 'UNAUTHENTICATED',
  403: 'FORBIDDEN',
  404: 'NOT_FOUND',
  405: 'METHOD_NOT_ALLOWED',
  409: 'CONFLICT',
  413: 'PAYLOAD_TOO_LARGE',
  415: 'UNSUPPORTED_MEDIA_TYPE',
  422: 'UNPROCESSABLE',
  429: 'RATE_LIMITED',
  503: 'UNAVAILABLE',
};

/** Turns every error into the one envelope; only a real fault becomes a 500, and it is logged. */
export function toEnvelope(error: unknown): ErrorEnvelope {
  if (error instanceof HttpException) {
    const status = error.getStatus();
    const body = error.getResponse();
    if (typeof body === 'object' && body !== null && 'code' in body) {
      return body as ErrorEnvelope;
    }
    const raw = typeof body === 'string' ? body : (body as { message?: unknown }).message;
    const message = Array.isArray(raw) ? raw.join('; ') : String(raw ?? error.message);
    return { statusCode: status, code: CODES[status] ?? 'ERROR', message };
  }
  // Errors thrown by Express middleware (body-parser, multer) carry a status of their own.
  const status =
    (error as { status?: unknown; statusCode?: unknown })?.status ??
    (error as { statusCode?: unknown })?.statusCode;
  if (typeof status === 'number' && status >= 400 && status < 500) {
    const type = (error as { type?: string }).type;
    const message =
      type === 'entity.parse.failed'
        ? 'The request body is not valid JSON'
        : type === 'entity.too.large'
          ? 'The request body is too large'
          : String((error as Error).message);
    return { statusCode: status, code: CODES[status] ?? 'BAD_REQUEST', message };
  }
  if (error instanceof QueryFailedError) {
    const pgCode = (error as unknown as { code?: string }).code;
    if (pgCode === '23505') {
      return { statusCode: 409, code: 'CONFLICT', message: 'That already exists' };
    }
    if (pgCode === '22P02' || pgCode === '22003' || pgCode === '22007' || pgCode === '22008') {
      return {
        statusCode: 400,
        code: 'BAD_REQUEST',
        message: 'A value in the request has the wrong form',
      };
    }
  }
  return {
    statusCode: HttpStatus.INTERNAL_SERVER_ERROR,
    code: 'INTERNAL',
    message: 'Something went wrong on our side',
  };
}

@Catch()
export class ErrorEnvelopeFilter implements ExceptionFilter {
  private readonly logger = new Logger('Errors');

  catch(error: unknown, host: ArgumentsHost): void {
    const response = host.switchToHttp().getResponse<Response>();
    const envelope = toEnvelope(error);
    if (envelope.statusCode >= 500) {
      this.logger.error(error instanceof Error ? (error.stack ?? error.message) : String(error));
    }
    if (response.headersSent) return;
    response.status(envelope.statusCode).json(envelope);
  }
}
