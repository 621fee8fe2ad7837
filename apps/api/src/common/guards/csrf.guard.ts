import { type CanActivate, type ExecutionContext, HttpStatus, Injectable } from '@nestjs/common';
import { Reflector } from '@nestjs/core';
import type { Request } from 'express';
import { csrf } from '../../auth/csrf.js';
import { SKIP_CSRF } from '../decorators/skip-csrf.decorator.js';
import { AppError } from '../errors/app-error.js';

const SAFE = new Set(['GET', 'HEAD', 'OPTIONS']);

@Injectable()
export class CsrfGuard implements CanActivate {
  constructor(private readonly reflector: Reflector) {}

  canActivate(context: ExecutionContext): boolean {
    const request = context.switchToHttp().getRequest<Request>();
    if (SAFE.has(request.method)) return true;
    if (
      this.reflector.getAllAndOverride<boolean>(SKIP_CSRF, [
        context.getHandler(),
        context.getClass(),
      ])
    )
      return true;
    if (csrf.isRequestValid(request)) return true;
    throw new AppError(
      HttpStatus.FORBIDDEN,
      'CSRF_INVALID',
      'The request lacks a valid X-CSRF-Token header; fetch one from GET /api/auth/csrf',
    );
  }
}
