import { Column, Entity, PrimaryColumn } from 'typeorm';

/** A conflict a referee declared themselves (the automatic ones are computed, never stored). */
@Entity('referee_conflicts')
export class RefereeConflict {
  @PrimaryColumn('uuid', { name: 'referee_id' })
  refereeId: string;

  @PrimaryColumn('uuid', { name: 'proposal_id' })
  proposalId: string;

  @Column('text')
  reason: string;

  @Column('timestamptz', { name: 'declared_at' })
  declaredAt: Date;
}
