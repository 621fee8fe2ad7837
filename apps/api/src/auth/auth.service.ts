import { HttpStatus, Injectable } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import type { Request } from 'express';
import type { DataSource } from 'typeorm';
import { AuditService } from '../audit/audit.service.js';
import { originOf } from '../audit/request-origin.js';
import { AppError, validationFailed } from '../common/errors/app-error.js';
import { AppConfig } from '../config/app-config.js';
import { MailService } from '../mail/mail.service.js';
import { User } from '../users/entities/user.entity.js';
import { UsersService } from '../users/users.service.js';
import { passwordChangedEmail } from './auth-emails.js';
import type { ChangePasswordDto } from './dto/change-password.dto.js';
import { decoyHash, hashPassword, verifyPassword } from './password.js';
import { SignInLimiter } from './rate-limit/sign-in-limiter.js';
import type { SessionUser } from './session-user.js';

export const invalidCredentials = () =>
  new AppError(HttpStatus.UNAUTHORIZED, 'INVALID_CREDENTIALS', 'E-mail or password is not right');

@Injectable()
export class AuthService {
  constructor(
    @InjectDataSource() private readonly dataSource: DataSource,
    private readonly users: UsersService,
    private readonly limiter: SignInLimiter,
    private readonly audit: AuditService,
    private readonly mail: MailService,
    private readonly config: AppConfig,
  ) {}

  /**
   * Unknown e-mail, wrong password and deactivated account give the same answer after the same
   * work (a decoy hash is checked for an unknown e-mail, and every failure is counted and logged),
   * so the answer tells nothing about accounts. Too many failures answer 429 before any check.
   */
  async validateCredentials(req: Request, email: string, password: string): Promise<SessionUser> {
    await this.limiter.assertMayTry(req, email);
    const user = await this.users.findByEmailWithHash(email);
    const ok = await verifyPassword(password, user?.passwordHash ?? (await decoyHash()));
    if (!user || !ok || !user.active) {
      await this.audit.record({
        actorId: null,
        ip: req.ip ?? null,
        action: 'auth.sign-in-failed',
        subjectType: user ? 'user' : undefined,
        subjectId: user?.id,
        details: {
          email: email.slice(0, 254),
          reason: !user ? 'unknown-email' : !ok ? 'wrong-password' : 'deactivated',
        },
      });
      await this.limiter.recordFailure(req, email);
      throw invalidCredentials();
    }
    await this.limiter.recordSuccess(req, email);
    return this.users.toSessionUser(user);
  }

  /** After the session is established: note the time and log it. */
  async recordSignIn(req: Request, user: SessionUser): Promise<void> {
    await this.dataSource.transaction(async (manager) => {
      await manager.update(User, { id: user.id }, { lastSignInAt: new Date() });
      await this.audit.record(
        { ...originOf(req), action: 'auth.sign-in', subjectType: 'user', subjectId: user.id },
        manager,
      );
    });
  }

  async recordSignOut(req: Request): Promise<void> {
    if (!req.user) return;
    await this.audit.record({
      ...originOf(req),
      action: 'auth.sign-out',
      subjectType: 'user',
      subjectId: req.user.id,
    });
  }

  /**
   * Changes the signed-in user's password. A wrong current password counts as a failed sign-in
   * (the same limits apply) and answers 400 on `currentPassword`, not 401, since the session is
   * fine. Every other session of the account ends; this one is re-serialised with the new epoch
   * and lives on, with its CSRF token and its absolute expiry unchanged.
   */
  async changePassword(req: Request, me: SessionUser, dto: ChangePasswordDto): Promise<void> {
    await this.limiter.assertMayTry(req, me.email);
    const user = await this.users.findByIdWithHash(me.id);
    if (!user) throw invalidCredentials();
    if (!(await verifyPassword(dto.currentPassword, user.passwordHash))) {
      await this.audit.record({
        ...originOf(req),
        action: 'auth.password-change-failed',
        subjectType: 'user',
        subjectId: me.id,
      });
      await this.limiter.recordFailure(req, me.email);
      throw validationFailed([
        { path: 'currentPassword', message: 'The current password is not right' },
      ]);
    }
    if (dto.newPassword === dto.currentPassword) {
      throw validationFailed([
        { path: 'newPassword', message: 'The new password must differ from the current one' },
      ]);
    }
    const passwordHash = await hashPassword(dto.newPassword);
    const epoch = await this.dataSource.transaction(async (manager) => {
      const rows: [{ session_epoch: number }[], number] = await manager.query(
        `UPDATE users SET password_hash = $2, session_epoch = session_epoch + 1, updated_at = now()
          WHERE id = $1 RETURNING session_epoch`,
        [me.id, passwordHash],
      );
      await this.mail.enqueue(passwordChangedEmail(user, this.config.publicUrl), manager);
      await this.audit.record(
        {
          ...originOf(req),
          action: 'auth.password-changed',
          subjectType: 'user',
          subjectId: me.id,
        },
        manager,
      );
      return (rows[0][0] as { session_epoch: number }).session_epoch;
    });
    req.session.passport = { user: { id: me.id, epoch } };
    await new Promise<void>((resolve, reject) =>
      req.session.save((err: unknown) => (err ? reject(err) : resolve())),
    );
  }
}
