import { HttpStatus, Injectable } from '@nestjs/common';
import { AppError } from '../common/errors/app-error.js';
import { UsersService } from '../users/users.service.js';
import { decoyHash, verifyPassword } from './password.js';
import type { SessionUser } from './session-user.js';

export const invalidCredentials = () =>
  new AppError(HttpStatus.UNAUTHORIZED, 'INVALID_CREDENTIALS', 'E-mail or password is not right');

@Injectable()
export class AuthService {
  constructor(private readonly users: UsersService) {}

  /**
   * Unknown e-mail, wrong password and deactivated account give the same answer after the same
   * work (a decoy hash is checked for an unknown e-mail), so the answer tells nothing about accounts.
   */
  async validateCredentials(email: string, password: string): Promise<SessionUser> {
    const user = await this.users.findByEmailWithHash(email);
    const ok = await verifyPassword(password, user?.passwordHash ?? (await decoyHash()));
    if (!user || !ok || !user.active) throw invalidCredentials();
    return this.users.toSessionUser(user);
  }
}
