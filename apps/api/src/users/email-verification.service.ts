import { HttpStatus, Injectable } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import type { DataSource, EntityManager } from 'typeorm';
import { AuditService } from '../audit/audit.service.js';
import { CallRolesService } from '../calls/call-roles.service.js';
import type { RequestOrigin } from '../audit/request-origin.js';
import { AppError } from '../common/errors/app-error.js';
import { AppConfig } from '../config/app-config.js';
import { MailService } from '../mail/mail.service.js';
import { AccountTokensService, TOKEN_LIFETIME_MINUTES } from './account-tokens.service.js';
import { User } from './entities/user.entity.js';

/** The e-mailed link that proves an account's address, and its redemption. */
@Injectable()
export class EmailVerificationService {
  constructor(
    @InjectDataSource() private readonly dataSource: DataSource,
    private readonly tokens: AccountTokensService,
    private readonly mail: MailService,
    private readonly config: AppConfig,
    private readonly audit: AuditService,
    private readonly callRoles: CallRolesService,
  ) {}

  /** A new link for an account that is not verified yet (asked for by its owner or an admin). */
  async resend(user: User, origin: RequestOrigin): Promise<void> {
    if (user.emailVerifiedAt) {
      throw new AppError(
        HttpStatus.CONFLICT,
        'ALREADY_VERIFIED',
        'This address is already confirmed',
      );
    }
    await this.dataSource.transaction(async (manager) => {
      await this.send(user, manager);
      await this.audit.record(
        { ...origin, action: 'user.verification-resent', subjectType: 'user', subjectId: user.id },
        manager,
      );
    });
  }

  /** Puts a fresh verification link in the outbox (earlier links stop working). */
  async send(user: Pick<User, 'id' | 'email' | 'name'>, manager: EntityManager): Promise<void> {
    const { token } = await this.tokens.issue(user.id, 'verify-email', manager);
    const url = `${this.config.publicUrl}/verify?token=${encodeURIComponent(token)}`;
    await this.mail.enqueue(
      {
        to: user.email,
        subject: 'Confirm your e-mail address for Skyhours',
        kind: 'auth.verify',
        content: {
          greeting: `Dear ${user.name},`,
          paragraphs: [
            'Please confirm that this address is yours. Until you do, you can sign in, but you cannot submit proposals or write reviews.',
          ],
          action: { label: 'Confirm my address', url },
          after: [
            `The link works once and for ${TOKEN_LIFETIME_MINUTES['verify-email'] / 60} hours. If you did not make a Skyhours account, ignore this message.`,
          ],
        },
      },
      manager,
    );
  }

  /** Marks the token's account verified; null when the token is unknown, used or expired. */
  async verify(token: string, origin: RequestOrigin): Promise<User | null> {
    return this.dataSource.transaction(async (manager) => {
      const userId = await this.tokens.redeem(token, 'verify-email', manager);
      if (!userId) return null;
      await manager.query(
        `UPDATE users SET email_verified_at = COALESCE(email_verified_at, now()), updated_at = now()
          WHERE id = $1`,
        [userId],
      );
      await this.audit.record(
        // Whoever opened the link holds the mailbox: the account's owner.
        {
          actorId: userId,
          ip: origin.ip,
          action: 'auth.email-verified',
          subjectType: 'user',
          subjectId: userId,
        },
        manager,
      );
      const user = await manager.findOneByOrFail(User, { id: userId });
      // Chair and referee grants made before the address had a verified account start now.
      await this.callRoles.attachPendingInvitations(user, manager);
      return user;
    });
  }
}
