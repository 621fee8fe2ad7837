import { type ExecutionContext, Injectable } from '@nestjs/common';
import { AuthGuard } from '@nestjs/passport';
import { isEmail } from 'class-validator';
import type { Request } from 'express';
import { type FieldIssue, validationFailed } from '../common/errors/app-error.js';
import { invalidCredentials } from './auth.service.js';

/**
 * Checks e-mail and password with passport-local, then signs in. Passport's logIn regenerates the
 * session, so a session id known before sign-in is worthless after it (no fixation).
 * Guards run before the validation pipe, so the body's shape is checked here first.
 */
@Injectable()
export class LocalAuthGuard extends AuthGuard('local') {
  override async canActivate(context: ExecutionContext): Promise<boolean> {
    const request = context.switchToHttp().getRequest<Request>();
    assertCredentialShape(request.body);
    await super.canActivate(context);
    await super.logIn(request);
    request.session.signedInAt = Date.now();
    return true;
  }

  override handleRequest<T>(err: unknown, user: T | false): T {
    if (err) throw err;
    if (user) return user;
    throw invalidCredentials();
  }
}

function assertCredentialShape(body: unknown): void {
  const { email, password } = (body ?? {}) as { email?: unknown; password?: unknown };
  const issues: FieldIssue[] = [];
  if (typeof email !== 'string' || email.trim() === '')
    issues.push({ path: 'email', message: 'email and password are required' });
  else if (email.length > 254 || !isEmail(email.trim()))
    issues.push({ path: 'email', message: 'email must be an e-mail address' });
  if (typeof password !== 'string' || password === '')
    issues.push({ path: 'password', message: 'email and password are required' });
  else if (password.length > 1024)
    issues.push({ path: 'password', message: 'password must be at most 1024 characters' });
  if (issues.length > 0) throw validationFailed(issues);
}
