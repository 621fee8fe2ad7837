import { Column, Entity, PrimaryColumn } from 'typeorm';

/** Hours granted to one observation; it exists only under its proposal's grant row. */
@Entity('observation_grants')
export class ObservationGrant {
  @PrimaryColumn('uuid', { name: 'observation_id' })
  observationId: string;

  @Column('uuid', { name: 'proposal_id' })
  proposalId: string;

  @Column('double precision')
  hours: number;
}
