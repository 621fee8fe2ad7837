import { ApiProperty } from '@nestjs/swagger';
import { GLOBAL_ROLES, type GlobalRole, type User } from '../entities/user.entity.js';

/** An account as the Accounts screen shows it. */
export class UserResponse {
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

  @ApiProperty()
  active: boolean;

  @ApiProperty({ enum: GLOBAL_ROLES, isArray: true })
  globalRoles: GlobalRole[];

  @ApiProperty({ nullable: true, type: String, format: 'date-time' })
  lastSignInAt: string | null;

  @ApiProperty({ format: 'date-time' })
  createdAt: string;

  static from(user: User): UserResponse {
    return {
      id: user.id,
      email: user.email,
      name: user.name,
      affiliation: user.affiliation,
      country: user.country,
      orcid: user.orcid,
      emailVerified: user.emailVerifiedAt !== null,
      active: user.active,
      globalRoles: user.roles,
      lastSignInAt: user.lastSignInAt?.toISOString() ?? null,
      createdAt: user.createdAt.toISOString(),
    };
  }
}

export class UserPageResponse {
  @ApiProperty({ type: [UserResponse] })
  items: UserResponse[];

  @ApiProperty({ description: 'Accounts matching the filters, over all pages' })
  total: number;

  @ApiProperty()
  page: number;

  @ApiProperty()
  pageSize: number;
}
