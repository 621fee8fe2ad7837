import { Column, Entity, PrimaryColumn } from 'typeorm';
import type { UnplacedReason } from '@skyhours/calc';

/** What the generator could not place last time, per observation. */
export interface StoredUnplaced {
  observationId: string;
  hoursUnplaced: number;
  reason: UnplacedReason;
}

/** One call's plan settings and the generator's last unplaced list; no row means the defaults. */
@Entity('plans')
export class PlanSettings {
  @PrimaryColumn('uuid', { name: 'call_id' })
  callId: string;

  /** Site's local hour (0–23) the daily maintenance starts at. */
  @Column('smallint', { name: 'maintenance_start_hour', default: 8 })
  maintenanceStartHour: number;

  @Column('smallint', { name: 'maintenance_hours', default: 0 })
  maintenanceHours: number;

  /** Fraction of the usable hours held back for weather, 0 ≤ f < 1. */
  @Column('double precision', { name: 'weather_reserve', default: 0.1 })
  weatherReserve: number;

  @Column('jsonb', { default: () => "'[]'" })
  unplaced: StoredUnplaced[];

  @Column('timestamptz', { name: 'generated_at', nullable: true })
  generatedAt: Date | null;

  @Column('uuid', { name: 'generated_by', nullable: true })
  generatedById: string | null;

  @Column('timestamptz', { name: 'updated_at' })
  updatedAt: Date;
}
