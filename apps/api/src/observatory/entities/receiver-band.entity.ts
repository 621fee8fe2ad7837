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

/** IEEE Std 521 radar-band letters (from memory); a band outside them has none. */
export const IEEE_LETTERS = [
  'HF',
  'VHF',
  'UHF',
  'L',
  'S',
  'C',
  'X',
  'Ku',
  'K',
  'Ka',
  'V',
  'W',
  'mm',
] as const;
export type IeeeLetter = (typeof IEEE_LETTERS)[number];

/** Numbers of polarisation products a band can record (the calculator's n_pol). */
export const POLARIZATIONS = [1, 2] as const;
export type Polarization = (typeof POLARIZATIONS)[number];

@Entity('receiver_bands')
export class ReceiverBand {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column('uuid', { name: 'observatory_id' })
  observatoryId: string;

  @ManyToOne('Observatory', 'bands', { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'observatory_id' })
  observatory?: Observatory;

  @Column('text')
  name: string;

  @Column('text', { name: 'ieee_letter', nullable: true })
  ieeeLetter: IeeeLetter | null;

  @Column('double precision', { name: 'min_ghz' })
  minGHz: number;

  @Column('double precision', { name: 'max_ghz' })
  maxGHz: number;

  @Column('double precision', { name: 'tsys_k' })
  tsysK: number;

  @Column('double precision', { name: 'aperture_efficiency' })
  apertureEfficiency: number;

  /** Widest instantaneous bandwidth. */
  @Column('double precision', { name: 'max_bandwidth_mhz' })
  maxBandwidthMHz: number;

  @Column('smallint', { array: true })
  polarizations: Polarization[];

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' })
  createdAt: Date;

  @UpdateDateColumn({ name: 'updated_at', type: 'timestamptz' })
  updatedAt: Date;
}
