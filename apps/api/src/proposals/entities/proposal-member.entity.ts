import { Column, Entity, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import { User } from '../../users/entities/user.entity.js';
import type { Proposal } from './proposal.entity.js';

export const TEAM_ROLES = ['pi', 'coi'] as const;
export type TeamRole = (typeof TEAM_ROLES)[number];

/**
 * One person on a proposal's team: a user (joinedAt set), or an invitation to an address that
 * has no verified account yet (userId null), which turns into a member when that address
 * registers and verifies.
 */
@Entity('proposal_members')
export class ProposalMember {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column('uuid', { name: 'proposal_id' })
  proposalId: string;

  @ManyToOne('Proposal', 'members', { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'proposal_id' })
  proposal?: Proposal;

  @Column('uuid', { name: 'user_id', nullable: true })
  userId: string | null;

  @ManyToOne(() => User, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'user_id' })
  user?: User | null;

  /** The invited address, lower-cased (a joined member's current address is the user's). */
  @Column('text')
  email: string;

  @Column('text')
  role: TeamRole;

  /** The PI always has it; a Co-I when the PI grants it. */
  @Column('boolean', { name: 'can_edit' })
  canEdit: boolean;

  @Column('uuid', { name: 'invited_by', nullable: true })
  invitedById: string | null;

  @Column('timestamptz', { name: 'invited_at' })
  invitedAt: Date;

  @Column('timestamptz', { name: 'joined_at', nullable: true })
  joinedAt: Date | null;
}
