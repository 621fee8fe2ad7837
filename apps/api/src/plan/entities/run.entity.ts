import { Column, Entity, PrimaryGeneratedColumn } from 'typeorm';

export const RUN_STATUSES = ['planned', 'observed', 'lost'] as const;
export type RunStatus = (typeof RUN_STATUSES)[number];
export const LOST_REASONS = ['weather', 'fault'] as const;
export type LostReason = (typeof LOST_REASONS)[number];

/**
 * One block of observing. No two runs overlap anywhere (the table's exclusion constraint);
 * `version` is the concurrency token every change carries.
 */
@Entity('runs')
export class Run {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column('uuid', { name: 'call_id' })
  callId: string;

  @Column('uuid', { name: 'observation_id' })
  observationId: string;

  @Column('timestamptz', { name: 'starts_at' })
  startsAt: Date;

  @Column('timestamptz', { name: 'ends_at' })
  endsAt: Date;

  @Column('text', { default: 'planned' })
  status: RunStatus;

  @Column('boolean', { default: false })
  locked: boolean;

  @Column('double precision', { name: 'hours_obtained', nullable: true })
  hoursObtained: number | null;

  @Column('text', { name: 'quality_note', default: '' })
  qualityNote: string;

  @Column('text', { name: 'lost_reason', nullable: true })
  lostReason: LostReason | null;

  @Column('uuid', { name: 'recorded_by', nullable: true })
  recordedById: string | null;

  @Column('timestamptz', { name: 'recorded_at', nullable: true })
  recordedAt: Date | null;

  @Column('int', { default: 1 })
  version: number;

  @Column('timestamptz', { name: 'created_at' })
  createdAt: Date;

  @Column('timestamptz', { name: 'updated_at' })
  updatedAt: Date;
}
