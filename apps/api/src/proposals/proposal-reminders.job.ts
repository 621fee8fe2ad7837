import { Injectable, Logger } from '@nestjs/common';
import { Cron, CronExpression } from '@nestjs/schedule';
import { InjectDataSource } from '@nestjs/typeorm';
import type { DataSource } from 'typeorm';
import { AuditService } from '../audit/audit.service.js';
import { Clock } from '../common/clock.js';
import { AppConfig } from '../config/app-config.js';
import { MailService } from '../mail/mail.service.js';
import { reminderEmail } from './proposal-emails.js';

interface DueReminder {
  proposal_id: string;
  kind: '7d' | '1d';
  reference: string;
  title: string;
  submitted_version: number | null;
  code: string;
  deadline_at: Date;
  recipients: { email: string; name: string }[];
}

/**
 * E-mails the team of every unsubmitted draft 7 days and 1 day before its call's deadline. Each
 * reminder is recorded in proposal_reminders in the same transaction as its e-mails, and the
 * record's primary key decides who sends it: with two API processes, one inserts and mails, the
 * other finds the row and does nothing.
 */
@Injectable()
export class ProposalRemindersJob {
  private readonly logger = new Logger('ProposalRemindersJob');

  constructor(
    @InjectDataSource() private readonly dataSource: DataSource,
    private readonly clock: Clock,
    private readonly mail: MailService,
    private readonly audit: AuditService,
    private readonly config: AppConfig,
  ) {}

  @Cron(CronExpression.EVERY_10_MINUTES, { name: 'proposal-reminders', waitForCompletion: true })
  async run(): Promise<void> {
    try {
      const sent = await this.sendDue();
      if (sent) this.logger.log(`sent ${sent} deadline reminder(s)`);
    } catch (error) {
      this.logger.warn(`sending reminders failed: ${String(error)}`);
    }
  }

  /**
   * Sends the reminders that are due now: '7d' from 7 days to 1 day before the deadline, '1d'
   * in the last day. A draft first seen inside the last day gets only the '1d' one. Returns how
   * many proposals were reminded.
   */
  async sendDue(): Promise<number> {
    const now = this.clock.now();
    return this.dataSource.transaction(async (manager) => {
      const due = (await manager.query(
        `WITH claimed AS (
           INSERT INTO proposal_reminders (proposal_id, kind, deadline_at, sent_at)
           SELECT p.id, k.kind, c.deadline_at, $1
             FROM proposals p
             JOIN calls c ON c.id = p.call_id
             CROSS JOIN (VALUES ('7d', interval '7 days', interval '1 day'),
                                ('1d', interval '1 day', interval '0')) AS k(kind, lead, until)
            WHERE p.status = 'draft' AND c.status = 'open' AND c.opens_at <= $1
              AND c.deadline_at - k.lead <= $1 AND c.deadline_at - k.until > $1
           ON CONFLICT DO NOTHING
           RETURNING proposal_id, kind
         )
         SELECT cl.proposal_id, cl.kind, p.reference, p.title, p.submitted_version, c.code,
                c.deadline_at,
                COALESCE(json_agg(json_build_object('email', u.email, 'name', u.name)
                                  ORDER BY m.role DESC, u.name) FILTER (WHERE u.id IS NOT NULL),
                         '[]') AS recipients
           FROM claimed cl
           JOIN proposals p ON p.id = cl.proposal_id
           JOIN calls c ON c.id = p.call_id
           LEFT JOIN proposal_members m ON m.proposal_id = p.id
           LEFT JOIN users u ON u.id = m.user_id AND u.active
          GROUP BY cl.proposal_id, cl.kind, p.reference, p.title, p.submitted_version, c.code,
                   c.deadline_at
          ORDER BY p.reference`,
        [now],
      )) as DueReminder[];
      for (const r of due) {
        await this.mail.enqueue(
          r.recipients.map((to) =>
            reminderEmail({
              base: this.config.publicUrl,
              proposal: { reference: r.reference, title: r.title },
              callCode: r.code,
              deadlineAt: r.deadline_at,
              now,
              submittedVersion: r.submitted_version,
              to,
            }),
          ),
          manager,
        );
        await this.audit.record(
          {
            actorId: null,
            action: 'proposal.reminder_sent',
            subjectType: 'proposal',
            subjectId: r.proposal_id,
            details: { reference: r.reference, kind: r.kind, recipients: r.recipients.length },
          },
          manager,
        );
      }
      return due.length;
    });
  }
}
