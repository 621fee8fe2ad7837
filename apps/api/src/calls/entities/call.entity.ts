import {
  Column,
  CreateDateColumn,
  Entity,
  JoinColumn,
  ManyToOne,
  OneToMany,
  PrimaryGeneratedColumn,
  UpdateDateColumn,
} from 'typeorm';
import { Observatory } from '../../observatory/entities/observatory.entity.js';
import type { CallStatus, ProposalKind } from '../call-lifecycle.js';
import { CallCapacity } from './call-capacity.entity.js';

/**
 * One call for proposals. Instants are stored in UTC; `timeZone` is the zone the call's dates are
 * announced in. `status` is the stored one: read the effective status through effectiveStatus().
 */
@Entity('calls')
export class Call {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  /** Upper case, e.g. SP27; proposal references start with it. */
  @Column('text', { unique: true })
  code: string;

  @Column('uuid', { name: 'observatory_id' })
  observatoryId: string;

  @ManyToOne(() => Observatory, { onDelete: 'RESTRICT' })
  @JoinColumn({ name: 'observatory_id' })
  observatory?: Observatory;

  @Column('text')
  title: string;

  @Column('text', { default: '' })
  description: string;

  @Column('text', { name: 'time_zone' })
  timeZone: string;

  @Column('timestamptz', { name: 'opens_at' })
  opensAt: Date;

  @Column('timestamptz', { name: 'deadline_at' })
  deadlineAt: Date;

  @Column('timestamptz', { name: 'review_due_at' })
  reviewDueAt: Date;

  @Column('int', { name: 'science_case_page_limit' })
  scienceCasePageLimit: number;

  @Column('double precision', { name: 'science_case_max_mb' })
  scienceCaseMaxMb: number;

  @Column('text', { name: 'proposal_kinds', array: true })
  proposalKinds: ProposalKind[];

  /** The largest request a single proposal may make, in hours. */
  @Column('double precision', { name: 'max_hours_per_proposal' })
  maxHoursPerProposal: number;

  @Column('int', { name: 'score_min' })
  scoreMin: number;

  @Column('int', { name: 'score_max' })
  scoreMax: number;

  @Column('boolean', { name: 'score_higher_is_better', default: true })
  scoreHigherIsBetter: boolean;

  @Column('int', { name: 'referees_per_proposal' })
  refereesPerProposal: number;

  @Column('boolean', { name: 'anonymous_review', default: false })
  anonymousReview: boolean;

  @Column('text', { default: 'planned' })
  status: CallStatus;

  @Column('timestamptz', { name: 'status_changed_at' })
  statusChangedAt: Date;

  @OneToMany(() => CallCapacity, (c) => c.call)
  capacities?: CallCapacity[];

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' })
  createdAt: Date;

  @UpdateDateColumn({ name: 'updated_at', type: 'timestamptz' })
  updatedAt: Date;
}
