import { Column, Entity, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import { User } from '../../users/entities/user.entity.js';
import { Call } from './call.entity.js';

export const CALL_ROLES = ['chair', 'referee'] as const;
export type CallRole = (typeof CALL_ROLES)[number];

/** A role a user holds in one call (SessionUser.callRoles is read from these rows). */
@Entity('call_roles')
export class GrantedCallRole {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column('uuid', { name: 'user_id' })
  userId: string;

  @ManyToOne(() => User, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'user_id' })
  user?: User;

  @Column('uuid', { name: 'call_id' })
  callId: string;

  @ManyToOne(() => Call, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'call_id' })
  call?: Call;

  @Column('text')
  role: CallRole;

  @Column('uuid', { name: 'granted_by', nullable: true })
  grantedById: string | null;

  @ManyToOne(() => User, { onDelete: 'SET NULL' })
  @JoinColumn({ name: 'granted_by' })
  grantedBy?: User | null;

  @Column('timestamptz', { name: 'granted_at' })
  grantedAt: Date;
}
