import { Column, Entity, PrimaryColumn } from 'typeorm';

export type ReviewReminderKind = '3d' | '1d';

/** One reminder sent; the key makes each go once, and a moved due date earns fresh ones. */
@Entity('review_reminders')
export class ReviewReminder {
  @PrimaryColumn('uuid', { name: 'assignment_id' })
  assignmentId: string;

  @PrimaryColumn('text')
  kind: ReviewReminderKind;

  @PrimaryColumn('timestamptz', { name: 'due_at' })
  dueAt: Date;

  @Column('timestamptz', { name: 'sent_at' })
  sentAt: Date;
}
