import {
  Column,
  CreateDateColumn,
  Entity,
  OneToMany,
  PrimaryGeneratedColumn,
  UpdateDateColumn,
} from 'typeorm';
import { Configuration } from './configuration.entity.js';
import { ReceiverBand } from './receiver-band.entity.js';

/** One array and its site. Longitude is east-positive, as the calculator takes it. */
@Entity('observatories')
export class Observatory {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column('text', { unique: true })
  name: string;

  @Column('double precision', { name: 'site_latitude_deg' })
  latitudeDeg: number;

  @Column('double precision', { name: 'site_longitude_deg' })
  longitudeDeg: number;

  @Column('double precision', { name: 'site_elevation_m' })
  elevationM: number;

  @Column('double precision', { name: 'elevation_limit_deg' })
  elevationLimitDeg: number;

  @Column('int', { name: 'antenna_count' })
  antennas: number;

  @Column('double precision', { name: 'dish_diameter_m' })
  dishDiameterM: number;

  @Column('double precision', { name: 'correlator_efficiency' })
  correlatorEfficiency: number;

  /** Calibration and slewing time as a fraction of on-source time. */
  @Column('double precision', { name: 'calibration_overhead_fraction' })
  overheadFraction: number;

  /** Primary beam = beamFactor · λ/D. */
  @Column('double precision', { name: 'beam_factor', default: 1.13 })
  beamFactor: number;

  /** IANA name of the site's zone, e.g. America/Los_Angeles. */
  @Column('text', { name: 'time_zone' })
  timeZone: string;

  @OneToMany(() => Configuration, (c) => c.observatory)
  configurations?: Configuration[];

  @OneToMany(() => ReceiverBand, (b) => b.observatory)
  bands?: ReceiverBand[];

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' })
  createdAt: Date;

  @UpdateDateColumn({ name: 'updated_at', type: 'timestamptz' })
  updatedAt: Date;
}
