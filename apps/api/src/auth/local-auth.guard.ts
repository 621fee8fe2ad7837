import { type ExecutionContext, Injectable } from '@nestjs/common';
import { AuthGuard } from '@nestjs/passport';
import type { Request } from 'express';
import { validationFailed } from '../common/errors/app-error.js';
import { invalidCredentials } from './auth.service.js';

/**
 * Checks e-mail and password with passport-local, then signs in. Passport's logIn regenerates the
 * session, so a session id known before sign-in is worthless after it (no fixation).
 */
@Injectable()
export class LocalAuthGuard extends AuthGuard('local') {
  override async canActivate(context: ExecutionContext): Promise<boolean> {
    await super.canActivate(context);
    const request = context.switchToHttp().getRequest<Request>();
    await super.logIn(request);
    request.session.signedInAt = Date.now();
    return true;
  }

  override handleRequest<T>(err: unknown, user: T | false, info?: { message?: string }): T {
    if (err) throw err;
    if (user) return user;
    if (info?.message === 'Missing credentials') {
      throw validationFailed([
        { path: 'email', message: 'email and password are required' },
        { path: 'password', message: 'email and password are required' },
      ]);
    }
    throw invalidCredentials();
  }
}
