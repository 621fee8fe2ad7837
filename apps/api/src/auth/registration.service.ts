import { Injectable } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import type { DataSource } from 'typeorm';
import { AuditService } from '../audit/audit.service.js';
import type { RequestOrigin } from '../audit/request-origin.js';
import { AppConfig } from '../config/app-config.js';
import { MailService } from '../mail/mail.service.js';
import { EmailVerificationService } from '../users/email-verification.service.js';
import { User } from '../users/entities/user.entity.js';
import { registrationAttemptEmail } from './auth-emails.js';
import type { RegisterDto } from './dto/register.dto.js';
import { hashPassword } from './password.js';

export const REGISTRATION_ACCEPTED =
  'Thank you. We have sent a message to this address: open the link in it to confirm the address and finish.';

/**
 * Registration answers the same whether or not the address already has an account, after the
 * same work (the password is hashed either way): a new address gets a verification link, a taken
 * one gets a note to its owner. The new account holds no role until its address is confirmed.
 */
@Injectable()
export class RegistrationService {
  constructor(
    @InjectDataSource() private readonly dataSource: DataSource,
    private readonly verification: EmailVerificationService,
    private readonly mail: MailService,
    private readonly audit: AuditService,
    private readonly config: AppConfig,
  ) {}

  async register(dto: RegisterDto, origin: RequestOrigin): Promise<void> {
    const passwordHash = await hashPassword(dto.password);
    await this.dataSource.transaction(async (manager) => {
      // ON CONFLICT rather than a look-up first, so two registrations at once cannot both insert.
      const inserted: { id: string }[] = await manager.query(
        `INSERT INTO users (email, name, affiliation, country, orcid, password_hash)
         VALUES ($1, $2, $3, $4, $5, $6)
         ON CONFLICT (email) DO NOTHING
         RETURNING id`,
        [dto.email, dto.name, dto.affiliation, dto.country, dto.orcid ?? null, passwordHash],
      );
      const created = inserted[0];
      if (created) {
        await this.verification.send({ id: created.id, email: dto.email, name: dto.name }, manager);
        await this.audit.record(
          {
            actorId: created.id,
            ip: origin.ip,
            action: 'auth.registered',
            subjectType: 'user',
            subjectId: created.id,
          },
          manager,
        );
        return;
      }
      const owner = await manager.findOneByOrFail(User, { email: dto.email });
      await this.mail.enqueue(registrationAttemptEmail(owner, this.config.publicUrl), manager);
      await this.audit.record(
        { ...origin, action: 'auth.register-existing', subjectType: 'user', subjectId: owner.id },
        manager,
      );
    });
  }
}
