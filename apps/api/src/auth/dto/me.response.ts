import { ApiProperty } from '@nestjs/swagger';
import { ROLES, type Role } from '../../users/entities/user.entity.js';
import type { CallRoleGrant, SessionUser } from '../session-user.js';

export class CallRoleResponse implements CallRoleGrant {
  @ApiProperty()
  callCode: string;

  @ApiProperty({ enum: ['chair', 'referee'] })
  role: 'chair' | 'referee';
}

export class MeResponse {
  @ApiProperty()
  id: string;

  @ApiProperty()
  email: string;

  @ApiProperty()
  name: string;

  @ApiProperty()
  affiliation: string;

  @ApiProperty()
  country: string;

  @ApiProperty({ nullable: true, type: String })
  orcid: string | null;

  @ApiProperty()
  emailVerified: boolean;

  @ApiProperty({ enum: ROLES, isArray: true })
  roles: Role[];

  @ApiProperty({ type: [CallRoleResponse] })
  callRoles: CallRoleResponse[];

  static from(user: SessionUser): MeResponse {
    const { id, email, name, affiliation, country, orcid, emailVerified, roles, callRoles } = user;
    return { id, email, name, affiliation, country, orcid, emailVerified, roles, callRoles };
  }
}
