import { Column, CreateDateColumn, Entity, Index, PrimaryGeneratedColumn } from 'typeorm';

export const TOKEN_PURPOSES = ['verify-email', 'reset-password'] as const;
export type TokenPurpose = (typeof TOKEN_PURPOSES)[number];

/**
 * A single-use token sent by e-mail. Only its SHA-256 hash is stored, so a copy of the database
 * cannot be used to verify an address or reset a password.
 */
@Entity('account_tokens')
@Index('account_tokens_user', ['userId', 'purpose'])
export class AccountToken {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column('uuid', { name: 'user_id' })
  userId: string;

  @Column('text')
  purpose: TokenPurpose;

  /** Hex SHA-256 of the token. */
  @Column('text', { name: 'token_hash', unique: true })
  tokenHash: string;

  @Column('timestamptz', { name: 'expires_at' })
  expiresAt: Date;

  @Column('timestamptz', { name: 'used_at', nullable: true })
  usedAt: Date | null;

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' })
  createdAt: Date;
}
