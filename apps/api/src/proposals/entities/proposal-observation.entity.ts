import {
  Column,
  CreateDateColumn,
  Entity,
  JoinColumn,
  ManyToOne,
  PrimaryGeneratedColumn,
  UpdateDateColumn,
} from 'typeorm';
import type { Check, ObservationResult } from '@skyhours/calc';
import { Configuration } from '../../observatory/entities/configuration.entity.js';
import { ReceiverBand } from '../../observatory/entities/receiver-band.entity.js';
import type { Proposal } from './proposal.entity.js';
import { ProposalTarget } from './proposal-target.entity.js';

/**
 * One target with one setup. `result` and `checks` are what the calculator library answered
 * when the observation (or its target) was last saved; submission computes them again.
 */
@Entity('proposal_observations')
export class ProposalObservation {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column('uuid', { name: 'proposal_id' })
  proposalId: string;

  @ManyToOne('Proposal', 'observations', { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'proposal_id' })
  proposal?: Proposal;

  @Column('int')
  position: number;

  @Column('uuid', { name: 'target_id' })
  targetId: string;

  @ManyToOne(() => ProposalTarget)
  @JoinColumn({ name: 'target_id' })
  target?: ProposalTarget;

  @Column('uuid', { name: 'band_id' })
  bandId: string;

  @ManyToOne(() => ReceiverBand)
  @JoinColumn({ name: 'band_id' })
  band?: ReceiverBand;

  @Column('uuid', { name: 'configuration_id' })
  configurationId: string;

  @ManyToOne(() => Configuration)
  @JoinColumn({ name: 'configuration_id' })
  configuration?: Configuration;

  /** null: the sky frequency of the target's line. */
  @Column('double precision', { name: 'frequency_ghz', nullable: true })
  frequencyGHz: number | null;

  @Column('double precision', { name: 'bandwidth_mhz' })
  bandwidthMHz: number;

  @Column('double precision', { name: 'spectral_resolution_khz', nullable: true })
  spectralResolutionKHz: number | null;

  @Column('smallint')
  polarizations: 1 | 2;

  @Column('double precision', { name: 'rms_goal_micro_jy', nullable: true })
  rmsGoalMicroJy: number | null;

  @Column('double precision', { name: 'resolution_goal_arcsec', nullable: true })
  resolutionGoalArcsec: number | null;

  /** Total hours, pointings and overheads included. */
  @Column('double precision', { name: 'hours_asked' })
  hoursAsked: number;

  @Column('jsonb')
  result: ObservationResult;

  /** The calculator's checks, their fields named as the observation's own fields. */
  @Column('jsonb')
  checks: Check[];

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' })
  createdAt: Date;

  @UpdateDateColumn({ name: 'updated_at', type: 'timestamptz' })
  updatedAt: Date;
}
