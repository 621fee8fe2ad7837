import { HttpStatus, Injectable } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import { isUUID } from 'class-validator';
import type { DataSource, EntityManager } from 'typeorm';
import { AuditService } from '../audit/audit.service.js';
import type { SessionUser } from '../auth/session-user.js';
import { Clock } from '../common/clock.js';
import { AppError, notFound } from '../common/errors/app-error.js';
import { AppConfig } from '../config/app-config.js';
import { MailService, type OutgoingEmail } from '../mail/mail.service.js';
import { User } from '../users/entities/user.entity.js';
import { effectiveStatus } from './call-lifecycle.js';
import { CallsService } from './calls.service.js';
import type { CallRoleResponse } from './dto/call-role.response.js';
import type { GrantCallRoleDto } from './dto/grant-call-role.dto.js';
import type { CallRole } from './entities/call-role.entity.js';
import type { Call } from './entities/call.entity.js';

const ROLE_WORDS: Record<CallRole, string> = {
  chair: 'chair of the time-allocation committee',
  referee: 'referee',
};

/** The user fields attaching invitations needs (a User entity will do). */
export interface VerifiedAddress {
  id: string;
  email: string;
  emailVerifiedAt: Date | null;
}

/**
 * Per-call roles. Staff grant chair or referee by e-mail address: an address with a verified
 * account gets the role at once; any other address gets a pending invitation that turns into the
 * role when the address registers and verifies (attachPendingInvitations).
 */
@Injectable()
export class CallRolesService {
  constructor(
    @InjectDataSource() private readonly dataSource: DataSource,
    private readonly calls: CallsService,
    private readonly clock: Clock,
    private readonly audit: AuditService,
    private readonly mail: MailService,
    private readonly config: AppConfig,
  ) {}

  async list(code: string): Promise<CallRoleResponse[]> {
    const call = await this.calls.findByCode(code);
    return this.listFor(this.dataSource.manager, call);
  }

  async grant(code: string, dto: GrantCallRoleDto, actor: SessionUser): Promise<CallRoleResponse> {
    return this.dataSource.transaction(async (manager) => {
      const now = this.clock.now();
      const call = await this.calls.findByCode(code, manager, true);
      if (effectiveStatus(call, now) === 'archived')
        throw new AppError(
          HttpStatus.CONFLICT,
          'CALL_ARCHIVED',
          `Call ${call.code} is archived; its roles no longer change`,
        );
      const email = dto.email.trim().toLowerCase();
      const user = await manager.findOneBy(User, { email });
      const verified = user !== null && user.active && user.emailVerifiedAt !== null;
      let id: string;
      if (verified) {
        const inserted = (await manager.query(
          `INSERT INTO call_roles (user_id, call_id, role, granted_by, granted_at)
           VALUES ($1, $2, $3, $4, $5) ON CONFLICT DO NOTHING RETURNING id`,
          [user.id, call.id, dto.role, actor.id, now],
        )) as { id: string }[];
        if (!inserted[0]) throw this.alreadyThere(call, email, dto.role, 'holds');
        id = inserted[0].id;
      } else {
        const inserted = (await manager.query(
          `INSERT INTO call_role_invitations (email, call_id, role, invited_by, invited_at)
           VALUES ($1, $2, $3, $4, $5) ON CONFLICT DO NOTHING RETURNING id`,
          [email, call.id, dto.role, actor.id, now],
        )) as { id: string }[];
        if (!inserted[0]) throw this.alreadyThere(call, email, dto.role, 'is invited as');
        id = inserted[0].id;
      }
      await this.audit.record(
        {
          actorId: actor.id,
          action: verified ? 'call_role.granted' : 'call_role.invited',
          subjectType: 'call',
          subjectId: call.id,
          details: { code: call.code, email, role: dto.role },
        },
        manager,
      );
      await this.mail.enqueue(this.invitationEmail(call, email, dto.role, user, verified), manager);
      const items = await this.listFor(manager, call);
      return items.find((i) => i.id === id) as CallRoleResponse;
    });
  }

  /** Takes a granted role or a pending invitation away (the id is either's). */
  async revoke(code: string, id: string, actor: SessionUser): Promise<void> {
    await this.dataSource.transaction(async (manager) => {
      const call = await this.calls.findByCode(code, manager, true);
      if (!isUUID(id)) throw notFound('Role');
      const removed = (await manager.query(
        `WITH r AS (DELETE FROM call_roles WHERE id = $1 AND call_id = $2
                     RETURNING role, (SELECT email FROM users WHERE users.id = user_id) AS email),
              i AS (DELETE FROM call_role_invitations WHERE id = $1 AND call_id = $2
                     RETURNING role, email)
         SELECT role, email, 'active' AS state FROM r
         UNION ALL SELECT role, email, 'pending' AS state FROM i`,
        [id, call.id],
      )) as { role: CallRole; email: string; state: string }[];
      const row = removed[0];
      if (!row) throw notFound('Role');
      await this.audit.record(
        {
          actorId: actor.id,
          action: row.state === 'active' ? 'call_role.revoked' : 'call_role.invitation_withdrawn',
          subjectType: 'call',
          subjectId: call.id,
          details: { code: call.code, email: row.email, role: row.role },
        },
        manager,
      );
    });
  }

  /**
   * Turns the pending invitations of the user's address into roles. Call it in the transaction that
   * marks the address verified (registration's e-mail confirmation); it does nothing while the
   * address is unverified. Returns what was attached.
   */
  async attachPendingInvitations(
    user: VerifiedAddress,
    manager: EntityManager = this.dataSource.manager,
  ): Promise<{ callCode: string; role: CallRole }[]> {
    if (!user.emailVerifiedAt) return [];
    const attached = (await manager.query(
      `WITH taken AS (
         DELETE FROM call_role_invitations WHERE email = $1
         RETURNING call_id, role, invited_by, invited_at
       ), granted AS (
         INSERT INTO call_roles (user_id, call_id, role, granted_by, granted_at)
         SELECT $2, call_id, role, invited_by, $3 FROM taken
         ON CONFLICT DO NOTHING
         RETURNING call_id, role
       )
       SELECT c.id AS call_id, c.code, g.role FROM granted g JOIN calls c ON c.id = g.call_id
       ORDER BY c.code, g.role`,
      [user.email.trim().toLowerCase(), user.id, this.clock.now()],
    )) as { call_id: string; code: string; role: CallRole }[];
    for (const row of attached)
      await this.audit.record(
        {
          actorId: user.id,
          action: 'call_role.attached',
          subjectType: 'call',
          subjectId: row.call_id,
          details: { code: row.code, email: user.email, role: row.role },
        },
        manager,
      );
    return attached.map((r) => ({ callCode: r.code, role: r.role }));
  }

  private async listFor(manager: EntityManager, call: Call): Promise<CallRoleResponse[]> {
    const rows = (await manager.query(
      `SELECT r.id, u.email, u.name, r.role, 'active' AS state, r.granted_at AS at, g.name AS by
         FROM call_roles r JOIN users u ON u.id = r.user_id LEFT JOIN users g ON g.id = r.granted_by
        WHERE r.call_id = $1
       UNION ALL
       SELECT i.id, i.email, NULL, i.role, 'pending', i.invited_at, g.name
         FROM call_role_invitations i LEFT JOIN users g ON g.id = i.invited_by
        WHERE i.call_id = $1
       ORDER BY role, email`,
      [call.id],
    )) as {
      id: string;
      email: string;
      name: string | null;
      role: CallRole;
      state: 'active' | 'pending';
      at: Date;
      by: string | null;
    }[];
    return rows.map((r) => ({
      id: r.id,
      email: r.email,
      name: r.name,
      role: r.role,
      state: r.state,
      grantedAt: r.at.toISOString(),
      grantedBy: r.by,
    }));
  }

  private alreadyThere(call: Call, email: string, role: CallRole, verb: string): AppError {
    return new AppError(
      HttpStatus.CONFLICT,
      'CALL_ROLE_EXISTS',
      `${email} already ${verb} ${role} in call ${call.code}`,
    );
  }

  private invitationEmail(
    call: Call,
    email: string,
    role: CallRole,
    user: User | null,
    verified: boolean,
  ): OutgoingEmail {
    const base = this.config.publicUrl;
    const what = `${ROLE_WORDS[role]} of call ${call.code} (${call.title})`;
    const subject = `Invitation: ${role} of call ${call.code}`;
    if (verified && user)
      return {
        to: email,
        subject,
        kind: 'call-role-granted',
        content: {
          greeting: `Hello ${user.name},`,
          paragraphs: [
            `The observatory staff have made you ${what}.`,
            'Sign in to Skyhours to find the call on your desk.',
          ],
          action: { label: 'Open the call', url: `${base}/calls/${call.code}` },
        },
      };
    if (user)
      return {
        to: email,
        subject,
        kind: 'call-role-invited',
        content: {
          greeting: `Hello ${user.name},`,
          paragraphs: [
            `The observatory staff have invited you to be ${what}.`,
            'Your account’s e-mail address is not verified yet; the role is yours once it is. Sign in to send the confirmation e-mail again.',
          ],
          action: { label: 'Sign in', url: `${base}/sign-in` },
        },
      };
    return {
      to: email,
      subject,
      kind: 'call-role-invited',
      content: {
        greeting: 'Hello,',
        paragraphs: [
          `The observatory staff have invited you to be ${what}.`,
          'You have no Skyhours account at this address yet. Register with this address and confirm it; the role will be waiting for you.',
        ],
        action: {
          label: 'Register',
          url: `${base}/register?email=${encodeURIComponent(email)}`,
        },
      },
    };
  }
}
