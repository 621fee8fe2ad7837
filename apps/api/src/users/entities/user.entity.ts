import {
  Column,
  CreateDateColumn,
  Entity,
  PrimaryGeneratedColumn,
  UpdateDateColumn,
} from 'typeorm';

/** Roles held across the whole observatory. Referee and chair are granted per call elsewhere. */
export const GLOBAL_ROLES = ['staff', 'admin'] as const;
export type GlobalRole = (typeof GLOBAL_ROLES)[number];

/** Every role a signed-in user can act in; proposer comes with a verified account. */
export const ROLES = ['proposer', 'referee', 'chair', 'staff', 'admin'] as const;
export type Role = (typeof ROLES)[number];

@Entity('users')
export class User {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  /** Stored lower-cased; unique. */
  @Column('text', { unique: true })
  email: string;

  @Column('text')
  name: string;

  @Column('text')
  affiliation: string;

  /** ISO 3166-1 alpha-2 */
  @Column('text')
  country: string;

  @Column('text', { nullable: true })
  orcid: string | null;

  @Column('text', { name: 'password_hash', select: false })
  passwordHash: string;

  @Column('timestamptz', { name: 'email_verified_at', nullable: true })
  emailVerifiedAt: Date | null;

  @Column('text', { array: true, default: () => "'{}'" })
  roles: GlobalRole[];

  /** Science categories a referee is happy to review. */
  @Column('text', { name: 'science_categories', array: true, default: () => "'{}'" })
  scienceCategories: string[];

  @Column('boolean', { default: true })
  active: boolean;

  /** Bumped when every session of the account must end (password change, deactivation). */
  @Column('int', { name: 'session_epoch', default: 0 })
  sessionEpoch: number;

  @Column('timestamptz', { name: 'last_sign_in_at', nullable: true })
  lastSignInAt: Date | null;

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' })
  createdAt: Date;

  @UpdateDateColumn({ name: 'updated_at', type: 'timestamptz' })
  updatedAt: Date;
}
