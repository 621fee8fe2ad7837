import { Column, CreateDateColumn, Entity, Index, PrimaryGeneratedColumn } from 'typeorm';

export interface OutboxAttachment {
  filename: string;
  contentType: string;
  /** base64 */
  content: string;
}

/**
 * An e-mail waiting to be sent. Rows are written in the same transaction as the change that causes
 * them, and a worker sends them, so a mail server that is away loses nothing.
 */
@Entity('outbox_messages')
@Index('outbox_due', ['nextAttemptAt'], { where: 'sent_at IS NULL' })
export class OutboxMessage {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' })
  createdAt: Date;

  @Column('text', { name: 'to_address' })
  to: string;

  @Column('text')
  subject: string;

  @Column('text')
  text: string;

  @Column('text', { nullable: true })
  html: string | null;

  @Column('jsonb', { default: [] })
  attachments: OutboxAttachment[];

  /** Why the message exists, e.g. `auth.verify`; handy in the admin's view and in tests. */
  @Column('text')
  kind: string;

  @Column('int', { default: 0 })
  attempts: number;

  @Column('timestamptz', { name: 'next_attempt_at', default: () => 'now()' })
  nextAttemptAt: Date;

  @Column('text', { name: 'last_error', nullable: true })
  lastError: string | null;

  @Column('timestamptz', { name: 'sent_at', nullable: true })
  sentAt: Date | null;
}
