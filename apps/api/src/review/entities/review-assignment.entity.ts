import { Column, Entity, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import { Proposal } from '../../proposals/entities/proposal.entity.js';
import { User } from '../../users/entities/user.entity.js';

export const ASSIGNMENT_STATUSES = [
  'invited',
  'accepted',
  'declined',
  'conflicted',
  'submitted',
] as const;
export type AssignmentStatus = (typeof ASSIGNMENT_STATUSES)[number];

/**
 * One referee asked to review one proposal; the review itself (score, comments, expertise) lives
 * on the same row. `version` is the concurrency token every write of the review carries.
 */
@Entity('review_assignments')
export class ReviewAssignment {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column('uuid', { name: 'proposal_id' })
  proposalId: string;

  @ManyToOne(() => Proposal, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'proposal_id' })
  proposal?: Proposal;

  @Column('uuid', { name: 'referee_id' })
  refereeId: string;

  @ManyToOne(() => User, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'referee_id' })
  referee?: User;

  @Column('text', { default: 'invited' })
  status: AssignmentStatus;

  /** The chair who placed it by hand, or null for the automatic pass. */
  @Column('uuid', { name: 'assigned_by', nullable: true })
  assignedById: string | null;

  @Column('timestamptz', { name: 'assigned_at' })
  assignedAt: Date;

  @Column('timestamptz', { name: 'notified_at', nullable: true })
  notifiedAt: Date | null;

  @Column('text', { name: 'decline_reason', nullable: true })
  declineReason: string | null;

  @Column('double precision', { nullable: true })
  score: number | null;

  @Column('text', { name: 'comment_to_pi', default: '' })
  commentToPi: string;

  @Column('text', { name: 'comment_to_committee', default: '' })
  commentToCommittee: string;

  @Column('smallint', { nullable: true })
  expertise: number | null;

  @Column('timestamptz', { name: 'submitted_at', nullable: true })
  submittedAt: Date | null;

  @Column('int', { default: 1 })
  version: number;

  @Column('timestamptz', { name: 'updated_at' })
  updatedAt: Date;
}
