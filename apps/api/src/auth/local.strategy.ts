import { Injectable } from '@nestjs/common';
import { PassportStrategy } from '@nestjs/passport';
import type { Request } from 'express';
import { Strategy } from 'passport-local';
import { AuthService } from './auth.service.js';
import type { SessionUser } from './session-user.js';

@Injectable()
export class LocalStrategy extends PassportStrategy(Strategy) {
  constructor(private readonly auth: AuthService) {
    // The request is passed on for the client address (rate limits, audit log).
    super({ usernameField: 'email', passwordField: 'password', passReqToCallback: true });
  }

  validate(req: Request, email: string, password: string): Promise<SessionUser> {
    return this.auth.validateCredentials(req, email, password);
  }
}
