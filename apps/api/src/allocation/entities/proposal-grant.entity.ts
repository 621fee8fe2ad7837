import { Column, Entity, PrimaryColumn } from 'typeorm';
import type { Tier } from '../standing-contract.js';

/** The chair's decision on one proposal; no row means undecided. Hours per observation beside it. */
@Entity('proposal_grants')
export class ProposalGrant {
  @PrimaryColumn('uuid', { name: 'proposal_id' })
  proposalId: string;

  @Column('text')
  tier: Tier;

  @Column('text', { default: '' })
  note: string;

  @Column('uuid', { name: 'decided_by', nullable: true })
  decidedById: string | null;

  @Column('timestamptz', { name: 'updated_at' })
  updatedAt: Date;
}
