import { Injectable } from '@nestjs/common';
import { PassportSerializer } from '@nestjs/passport';
import { UsersService } from '../users/users.service.js';
import type { SerializedSession, SessionUser } from './session-user.js';

/**
 * The session keeps only the user's id and session epoch; the user is reloaded on every request,
 * so a deactivation or a password change (which bumps the epoch) ends old sessions at once.
 */
@Injectable()
export class SessionSerializer extends PassportSerializer {
  constructor(private readonly users: UsersService) {
    super();
  }

  serializeUser(
    user: SessionUser,
    done: (err: unknown, session?: SerializedSession) => void,
  ): void {
    done(null, { id: user.id, epoch: user.sessionEpoch });
  }

  deserializeUser(
    session: SerializedSession,
    done: (err: unknown, user?: SessionUser | false) => void,
  ): void {
    this.users
      .loadSessionUser(session.id)
      .then((user) => done(null, user && user.sessionEpoch === session.epoch ? user : false))
      .catch((err: unknown) => done(err));
  }
}
