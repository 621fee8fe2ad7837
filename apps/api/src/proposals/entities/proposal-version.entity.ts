import { Column, Entity, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import { User } from '../../users/entities/user.entity.js';
import type { ProposalSnapshot } from '../proposal-snapshot.js';
import { Proposal } from './proposal.entity.js';

/** One submission, frozen: everything as it was, and the compiled PDF made from it. */
@Entity('proposal_versions')
export class ProposalVersion {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column('uuid', { name: 'proposal_id' })
  proposalId: string;

  @ManyToOne(() => Proposal, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'proposal_id' })
  proposal?: Proposal;

  /** 1, 2, … per proposal. */
  @Column('int')
  number: number;

  @Column('timestamptz', { name: 'submitted_at' })
  submittedAt: Date;

  @Column('uuid', { name: 'submitted_by', nullable: true })
  submittedById: string | null;

  @ManyToOne(() => User, { onDelete: 'SET NULL' })
  @JoinColumn({ name: 'submitted_by' })
  submittedBy?: User | null;

  @Column('double precision', { name: 'total_hours' })
  totalHours: number;

  @Column('jsonb')
  snapshot: ProposalSnapshot;

  @Column('uuid', { name: 'science_case_id', nullable: true })
  scienceCaseId: string | null;

  /** Not read unless asked for: lists need only the metadata. */
  @Column('bytea', { name: 'compiled_pdf', select: false })
  compiledPdf?: Buffer;

  @Column('text', { name: 'compiled_pdf_sha256' })
  compiledPdfSha256: string;
}
