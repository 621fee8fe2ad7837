import { Injectable, Logger } from '@nestjs/common';
import { Cron, CronExpression } from '@nestjs/schedule';
import { InjectDataSource } from '@nestjs/typeorm';
import type { DataSource } from 'typeorm';
import { AuditService } from '../audit/audit.service.js';
import { Clock } from '../common/clock.js';
import { AppConfig } from '../config/app-config.js';
import { MailService } from '../mail/mail.service.js';
import { reviewReminderEmail } from './review-emails.js';

interface DueReminder {
  referee_id: string;
  email: string;
  name: string;
  call_id: string;
  code: string;
  review_due_at: Date;
  kind: '3d' | '1d';
  proposals: { reference: string; title: string }[];
}

/**
 * E-mails every referee with reviews outstanding (invited or accepted) 3 days and 1 day before
 * their call's review due date: one e-mail per referee, call and kind, listing the proposals.
 * Each assignment's reminder is claimed in review_reminders in the same transaction as the
 * e-mail, and the table's key makes it go once, however many API processes run the job; a moved
 * due date earns fresh reminders.
 */
@Injectable()
export class ReviewRemindersJob {
  private readonly logger = new Logger('ReviewRemindersJob');

  constructor(
    @InjectDataSource() private readonly dataSource: DataSource,
    private readonly clock: Clock,
    private readonly mail: MailService,
    private readonly audit: AuditService,
    private readonly config: AppConfig,
  ) {}

  @Cron(CronExpression.EVERY_10_MINUTES, { name: 'review-reminders', waitForCompletion: true })
  async run(): Promise<void> {
    try {
      const sent = await this.sendDue();
      if (sent) this.logger.log(`sent ${sent} review reminder(s)`);
    } catch (error) {
      this.logger.warn(`sending review reminders failed: ${String(error)}`);
    }
  }

  /**
   * Sends what is due now: '3d' from 3 days to 1 day before the due date, '1d' in the last day.
   * An assignment first seen inside the last day gets only the '1d' one. Answers the e-mails sent.
   */
  async sendDue(): Promise<number> {
    const now = this.clock.now();
    return this.dataSource.transaction(async (manager) => {
      const due = (await manager.query(
        `WITH claimed AS (
           INSERT INTO review_reminders (assignment_id, kind, due_at, sent_at)
           SELECT a.id, k.kind, c.review_due_at, $1
             FROM review_assignments a
             JOIN proposals p ON p.id = a.proposal_id
             JOIN calls c ON c.id = p.call_id
             JOIN call_roles cr ON cr.call_id = c.id AND cr.user_id = a.referee_id AND cr.role = 'referee'
             CROSS JOIN (VALUES ('3d', interval '3 days', interval '1 day'),
                                ('1d', interval '1 day', interval '0')) AS k(kind, lead, until)
            WHERE a.status IN ('invited', 'accepted') AND c.status IN ('closed', 'open', 'in_review')
              AND c.deadline_at <= $1
              AND c.review_due_at - k.lead <= $1 AND c.review_due_at - k.until > $1
           ON CONFLICT DO NOTHING
           RETURNING assignment_id, kind
         )
         SELECT u.id AS referee_id, u.email, u.name, c.id AS call_id, c.code, c.review_due_at,
                cl.kind,
                json_agg(json_build_object('reference', p.reference, 'title', p.title)
                         ORDER BY p.reference) AS proposals
           FROM claimed cl
           JOIN review_assignments a ON a.id = cl.assignment_id
           JOIN proposals p ON p.id = a.proposal_id
           JOIN calls c ON c.id = p.call_id
           JOIN users u ON u.id = a.referee_id AND u.active
          GROUP BY u.id, u.email, u.name, c.id, c.code, c.review_due_at, cl.kind
          ORDER BY c.code, u.email, cl.kind`,
        [now],
      )) as DueReminder[];
      await this.mail.enqueue(
        due.map((r) =>
          reviewReminderEmail({
            base: this.config.publicUrl,
            to: { email: r.email, name: r.name },
            call: { code: r.code, reviewDueAt: r.review_due_at },
            kind: r.kind,
            proposals: r.proposals,
          }),
        ),
        manager,
      );
      for (const r of due)
        await this.audit.record(
          {
            actorId: null,
            action: 'review.reminder_sent',
            subjectType: 'call',
            subjectId: r.call_id,
            details: {
              code: r.code,
              refereeId: r.referee_id,
              kind: r.kind,
              proposals: r.proposals.length,
            },
          },
          manager,
        );
      return due.length;
    });
  }
}
