import { Injectable } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import type { DataSource, EntityManager } from 'typeorm';
import { type OutboxAttachment, OutboxMessage } from './outbox-message.entity.js';
import { type EmailContent, renderEmail } from './render-email.js';

export interface OutgoingEmail {
  to: string;
  subject: string;
  kind: string;
  content: EmailContent;
  attachments?: { filename: string; contentType: string; content: Buffer }[];
}

/**
 * The one way to send e-mail: the message is written to the outbox with the same EntityManager
 * (so the same transaction) as the change that causes it; the outbox worker delivers it.
 */
@Injectable()
export class MailService {
  constructor(@InjectDataSource() private readonly dataSource: DataSource) {}

  async enqueue(
    emails: OutgoingEmail | OutgoingEmail[],
    manager: EntityManager = this.dataSource.manager,
  ): Promise<void> {
    const list = Array.isArray(emails) ? emails : [emails];
    if (list.length === 0) return;
    const rows = list.map((email) => {
      const { text, html } = renderEmail(email.content);
      const attachments: OutboxAttachment[] = (email.attachments ?? []).map((a) => ({
        filename: a.filename,
        contentType: a.contentType,
        content: a.content.toString('base64'),
      }));
      return manager.create(OutboxMessage, {
        to: email.to,
        subject: email.subject,
        kind: email.kind,
        text,
        html,
        attachments,
      });
    });
    await manager.save(OutboxMessage, rows, { chunk: 100 });
  }
}
