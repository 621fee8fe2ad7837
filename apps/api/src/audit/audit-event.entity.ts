import { Column, CreateDateColumn, Entity, Index, PrimaryGeneratedColumn } from 'typeorm';

/** One change of state: who did what to which thing, when and from where. Never updated. */
@Entity('audit_events')
@Index(['subjectType', 'subjectId'])
export class AuditEvent {
  @PrimaryGeneratedColumn('identity', { type: 'bigint' })
  id: string;

  @CreateDateColumn({ name: 'at', type: 'timestamptz' })
  at: Date;

  @Column('uuid', { name: 'actor_id', nullable: true })
  actorId: string | null;

  @Column('text')
  action: string;

  @Column('text', { name: 'subject_type', nullable: true })
  subjectType: string | null;

  @Column('text', { name: 'subject_id', nullable: true })
  subjectId: string | null;

  @Column('jsonb', { default: {} })
  details: Record<string, unknown>;

  @Column('text', { nullable: true })
  ip: string | null;
}
