import {
  Injectable,
  Logger,
  type OnApplicationBootstrap,
  type OnApplicationShutdown,
} from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import type { DataSource } from 'typeorm';
import { AppConfig } from '../config/app-config.js';
import { MailTransport } from './mail-transport.js';
import type { OutboxAttachment } from './outbox-message.entity.js';

interface DueRow {
  id: string;
  to_address: string;
  subject: string;
  text: string;
  html: string | null;
  attachments: OutboxAttachment[];
  attempts: number;
}

const BATCH = 20;
/** Retry after 5 s, 10 s, 20 s … capped at an hour. */
export const backoffSeconds = (attempts: number): number => Math.min(5 * 2 ** attempts, 3600);

/**
 * Sends what the outbox holds. Rows are claimed with FOR UPDATE SKIP LOCKED inside a transaction,
 * so any number of API processes can run this worker and each message goes out once.
 */
@Injectable()
export class OutboxWorker implements OnApplicationBootstrap, OnApplicationShutdown {
  private readonly logger = new Logger('Outbox');
  private timer?: NodeJS.Timeout;
  private running?: Promise<void>;
  private stopped = false;

  constructor(
    @InjectDataSource() private readonly dataSource: DataSource,
    private readonly transport: MailTransport,
    private readonly config: AppConfig,
  ) {}

  onApplicationBootstrap(): void {
    this.schedule();
  }

  async onApplicationShutdown(): Promise<void> {
    this.stopped = true;
    clearTimeout(this.timer);
    await this.running;
  }

  private schedule(): void {
    if (this.stopped) return;
    this.timer = setTimeout(() => {
      this.running = this.drain()
        .then(() => undefined)
        .catch((err: unknown) => this.logger.warn(`outbox pass failed: ${String(err)}`))
        .finally(() => this.schedule());
    }, this.config.get('OUTBOX_POLL_MS'));
    this.timer.unref();
  }

  /** Sends every message that is due; returns how many went out. */
  async drain(): Promise<number> {
    let sent = 0;
    for (;;) {
      const { claimed, delivered } = await this.pass();
      sent += delivered;
      if (claimed < BATCH || this.stopped) return sent;
    }
  }

  private async pass(): Promise<{ claimed: number; delivered: number }> {
    return this.dataSource.transaction(async (manager) => {
      const rows: DueRow[] = await manager.query(
        `SELECT id, to_address, subject, text, html, attachments, attempts
           FROM outbox_messages
          WHERE sent_at IS NULL AND next_attempt_at <= now()
          ORDER BY created_at
          LIMIT $1
          FOR UPDATE SKIP LOCKED`,
        [BATCH],
      );
      let delivered = 0;
      for (const row of rows) {
        try {
          await this.transport.transporter.sendMail({
            from: this.transport.from,
            to: row.to_address,
            subject: row.subject,
            text: row.text,
            html: row.html ?? undefined,
            attachments: row.attachments.map((a) => ({
              filename: a.filename,
              contentType: a.contentType,
              content: Buffer.from(a.content, 'base64'),
            })),
          });
          await manager.query(
            `UPDATE outbox_messages SET sent_at = now(), attempts = attempts + 1, last_error = NULL WHERE id = $1`,
            [row.id],
          );
          delivered++;
        } catch (err) {
          await manager.query(
            `UPDATE outbox_messages
                SET attempts = attempts + 1, last_error = $2, next_attempt_at = now() + make_interval(secs => $3)
              WHERE id = $1`,
            [row.id, String(err).slice(0, 500), backoffSeconds(row.attempts)],
          );
        }
      }
      return { claimed: rows.length, delivered };
    });
  }
}
