import { Column, Entity, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import { User } from '../../users/entities/user.entity.js';
import type { CallRole } from './call-role.entity.js';
import { Call } from './call.entity.js';

/**
 * A role granted to an address that has no verified account yet. It becomes a GrantedCallRole when
 * that address registers and verifies (CallRolesService.attachPendingInvitations).
 */
@Entity('call_role_invitations')
export class CallRoleInvitation {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  /** Lower-cased. */
  @Column('text')
  email: string;

  @Column('uuid', { name: 'call_id' })
  callId: string;

  @ManyToOne(() => Call, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'call_id' })
  call?: Call;

  @Column('text')
  role: CallRole;

  @Column('uuid', { name: 'invited_by', nullable: true })
  invitedById: string | null;

  @ManyToOne(() => User, { onDelete: 'SET NULL' })
  @JoinColumn({ name: 'invited_by' })
  invitedBy?: User | null;

  @Column('timestamptz', { name: 'invited_at' })
  invitedAt: Date;
}
