import {
  Column,
  CreateDateColumn,
  Entity,
  JoinColumn,
  ManyToOne,
  PrimaryGeneratedColumn,
  UpdateDateColumn,
} from 'typeorm';
import type { VelocityConvention } from '@skyhours/calc';
import type { Proposal } from './proposal.entity.js';

/** One target: ICRS position in degrees, extent, expected flux density and an optional line. */
@Entity('proposal_targets')
export class ProposalTarget {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column('uuid', { name: 'proposal_id' })
  proposalId: string;

  @ManyToOne('Proposal', 'targets', { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'proposal_id' })
  proposal?: Proposal;

  /** Order of the list, as added. */
  @Column('int')
  position: number;

  @Column('text')
  name: string;

  @Column('double precision', { name: 'ra_deg' })
  raDeg: number;

  @Column('double precision', { name: 'dec_deg' })
  decDeg: number;

  /** Diameter of the region to image; 0 for a point source. */
  @Column('double precision', { name: 'extent_arcsec', default: 0 })
  extentArcsec: number;

  @Column('double precision', { name: 'flux_density_mjy', nullable: true })
  fluxDensityMJy: number | null;

  @Column('double precision', { name: 'line_rest_ghz', nullable: true })
  lineRestGHz: number | null;

  @Column('double precision', { name: 'line_velocity_km_s', nullable: true })
  lineVelocityKmS: number | null;

  @Column('text', { name: 'line_convention', nullable: true })
  lineConvention: VelocityConvention | null;

  @Column('double precision', { name: 'line_redshift', nullable: true })
  lineRedshift: number | null;

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' })
  createdAt: Date;

  @UpdateDateColumn({ name: 'updated_at', type: 'timestamptz' })
  updatedAt: Date;
}
