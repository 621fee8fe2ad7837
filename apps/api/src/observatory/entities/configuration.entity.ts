import {
  Column,
  CreateDateColumn,
  Entity,
  JoinColumn,
  ManyToOne,
  PrimaryGeneratedColumn,
  UpdateDateColumn,
} from 'typeorm';
import type { Observatory } from './observatory.entity.js';

/** One layout of the array's antennas. Dates are calendar days (YYYY-MM-DD) at the site. */
@Entity('configurations')
export class Configuration {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column('uuid', { name: 'observatory_id' })
  observatoryId: string;

  @ManyToOne('Observatory', 'configurations', { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'observatory_id' })
  observatory?: Observatory;

  @Column('text')
  name: string;

  @Column('double precision', { name: 'shortest_baseline_m' })
  shortestBaselineM: number;

  @Column('double precision', { name: 'longest_baseline_m' })
  longestBaselineM: number;

  @Column('date', { name: 'in_use_from' })
  inUseFrom: string;

  /** null: in use until further notice. */
  @Column('date', { name: 'in_use_to', nullable: true })
  inUseTo: string | null;

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' })
  createdAt: Date;

  @UpdateDateColumn({ name: 'updated_at', type: 'timestamptz' })
  updatedAt: Date;
}
