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
import type { ProposalKind } from '../../calls/call-lifecycle.js';
import { Call } from '../../calls/entities/call.entity.js';
import type { DocumentFinding } from '../../documents/document-finding.js';
import type { ProposalMember } from './proposal-member.entity.js';
import type { ProposalObservation } from './proposal-observation.entity.js';
import type { ProposalTarget } from './proposal-target.entity.js';

export const PROPOSAL_STATUSES = [
  'draft',
  'submitted',
  'withdrawn',
  'under_review',
  'allocated',
  'not_allocated',
  'in_progress',
  'completed',
] as const;
export type ProposalStatus = (typeof PROPOSAL_STATUSES)[number];

/**
 * One proposal in one call. `version` counts every change (the concurrency token every write
 * carries); `submittedVersion` is the number of the latest frozen version, which a reopened draft
 * keeps until it is submitted again.
 */
@Entity('proposals')
export class Proposal {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column('uuid', { name: 'call_id' })
  callId: string;

  @ManyToOne(() => Call, { onDelete: 'RESTRICT' })
  @JoinColumn({ name: 'call_id' })
  call?: Call;

  /** 1–9999, numbered per call in order of creation. */
  @Column('int')
  number: number;

  /** `<call code>-<4 digits>`, e.g. SP27-0014. */
  @Column('text', { unique: true })
  reference: string;

  @Column('text')
  title: string;

  @Column('text', { default: '' })
  abstract: string;

  @Column('text', { name: 'science_category', nullable: true })
  scienceCategory: string | null;

  @Column('text')
  kind: ProposalKind;

  /** An earlier proposal of the same team that this one continues. */
  @Column('uuid', { name: 'continues_id', nullable: true })
  continuesId: string | null;

  @ManyToOne(() => Proposal, { onDelete: 'SET NULL' })
  @JoinColumn({ name: 'continues_id' })
  continues?: Proposal | null;

  @Column('text', { default: 'draft' })
  status: ProposalStatus;

  @Column('int', { default: 1 })
  version: number;

  @Column('int', { name: 'submitted_version', nullable: true })
  submittedVersion: number | null;

  @Column('timestamptz', { name: 'submitted_at', nullable: true })
  submittedAt: Date | null;

  @Column('timestamptz', { name: 'withdrawn_at', nullable: true })
  withdrawnAt: Date | null;

  /** The document services' findings for the current science case (anonymity). */
  @Column('jsonb', { name: 'science_case_findings', default: () => "'[]'" })
  scienceCaseFindings: DocumentFinding[];

  /** The team names those findings were made with; a different team means they are re-made. */
  @Column('text', { name: 'science_case_names_checked', array: true, default: () => "'{}'" })
  scienceCaseNamesChecked: string[];

  @Column('uuid', { name: 'created_by', nullable: true })
  createdById: string | null;

  @OneToMany('ProposalMember', 'proposal')
  members?: ProposalMember[];

  @OneToMany('ProposalTarget', 'proposal')
  targets?: ProposalTarget[];

  @OneToMany('ProposalObservation', 'proposal')
  observations?: ProposalObservation[];

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' })
  createdAt: Date;

  @UpdateDateColumn({ name: 'updated_at', type: 'timestamptz' })
  updatedAt: Date;
}
