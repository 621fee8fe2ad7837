import { Column, Entity, JoinColumn, ManyToOne, PrimaryColumn } from 'typeorm';
import { Configuration } from '../../observatory/entities/configuration.entity.js';
import type { Call } from './call.entity.js';

/** Hours a call offers in one configuration; a configuration without a row is not on offer. */
@Entity('call_capacities')
export class CallCapacity {
  @PrimaryColumn('uuid', { name: 'call_id' })
  callId: string;

  @PrimaryColumn('uuid', { name: 'configuration_id' })
  configurationId: string;

  @ManyToOne('Call', 'capacities', { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'call_id' })
  call?: Call;

  @ManyToOne(() => Configuration, { onDelete: 'RESTRICT' })
  @JoinColumn({ name: 'configuration_id' })
  configuration?: Configuration;

  @Column('double precision', { name: 'hours_offered' })
  hoursOffered: number;
}
