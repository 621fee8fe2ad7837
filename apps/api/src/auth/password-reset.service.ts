import { Injectable } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import type { DataSource } from 'typeorm';
import { AuditService } from '../audit/audit.service.js';
import type { RequestOrigin } from '../audit/request-origin.js';
import { AppConfig } from '../config/app-config.js';
import { MailService } from '../mail/mail.service.js';
import { AccountTokensService, TOKEN_LIFETIME_MINUTES } from '../users/account-tokens.service.js';
import { User } from '../users/entities/user.entity.js';
import { passwordChangedEmail, passwordResetEmail } from './auth-emails.js';
import { hashPassword } from './password.js';
import { invalidToken } from './token-errors.js';

export const RESET_ACCEPTED =
  'If an account uses this address, we have sent it a link to choose a new password.';

@Injectable()
export class PasswordResetService {
  constructor(
    @InjectDataSource() private readonly dataSource: DataSource,
    private readonly tokens: AccountTokensService,
    private readonly mail: MailService,
    private readonly audit: AuditService,
    private readonly config: AppConfig,
  ) {}

  /**
   * Sends a reset link to an active account. An unknown or deactivated address gets nothing, and
   * the caller answers the same in every case; the audit entry is written either way so the two
   * paths do about the same work.
   */
  async request(email: string, origin: RequestOrigin): Promise<void> {
    await this.dataSource.transaction(async (manager) => {
      const user = await manager.findOneBy(User, { email });
      const known = user !== null && user.active;
      if (known) {
        const { token } = await this.tokens.issue(user.id, 'reset-password', manager);
        const url = `${this.config.publicUrl}/reset-password?token=${encodeURIComponent(token)}`;
        await this.mail.enqueue(
          passwordResetEmail(user, url, TOKEN_LIFETIME_MINUTES['reset-password']),
          manager,
        );
      }
      await this.audit.record(
        {
          ...origin,
          action: 'auth.password-reset-requested',
          subjectType: user ? 'user' : undefined,
          subjectId: user?.id,
          details: { email, sent: known },
        },
        manager,
      );
    });
  }

  /**
   * Sets the new password from a reset link. The link also proves the address, so an unconfirmed
   * one becomes confirmed. Every session of the account ends (the epoch is bumped).
   * Returns the account's e-mail, so the caller can clear its run of failed sign-ins.
   */
  async confirm(token: string, password: string, origin: RequestOrigin): Promise<string> {
    const passwordHash = await hashPassword(password);
    return this.dataSource.transaction(async (manager) => {
      const userId = await this.tokens.redeem(token, 'reset-password', manager);
      const user = userId ? await manager.findOneBy(User, { id: userId, active: true }) : null;
      if (!user) throw invalidToken();
      await manager.query(
        `UPDATE users SET password_hash = $2, session_epoch = session_epoch + 1,
                email_verified_at = COALESCE(email_verified_at, now()), updated_at = now()
          WHERE id = $1`,
        [user.id, passwordHash],
      );
      await this.mail.enqueue(passwordChangedEmail(user, this.config.publicUrl), manager);
      await this.audit.record(
        {
          actorId: user.id,
          ip: origin.ip,
          action: 'auth.password-reset',
          subjectType: 'user',
          subjectId: user.id,
        },
        manager,
      );
      return user.email;
    });
  }
}
