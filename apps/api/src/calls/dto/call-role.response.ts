import { ApiProperty } from '@nestjs/swagger';
import { CALL_ROLES, type CallRole } from '../entities/call-role.entity.js';

/** A granted role (active) or one waiting for its address to register and verify (pending). */
export class CallRoleResponse {
  @ApiProperty() id: string;
  @ApiProperty() email: string;
  @ApiProperty({ nullable: true, type: String, description: 'null while pending' })
  name: string | null;
  @ApiProperty({ enum: CALL_ROLES }) role: CallRole;
  @ApiProperty({ enum: ['active', 'pending'] }) state: 'active' | 'pending';
  @ApiProperty({ description: 'When it was granted or the invitation sent' }) grantedAt: string;
  @ApiProperty({ nullable: true, type: String }) grantedBy: string | null;
}

export class CallRoleListResponse {
  @ApiProperty({ type: [CallRoleResponse] }) items: CallRoleResponse[];
}
