import { ApiProperty } from '@nestjs/swagger';
import { Transform } from 'class-transformer';
import { IsIn, IsOptional, IsString, MaxLength } from 'class-validator';
import { GLOBAL_ROLES, type GlobalRole } from '../entities/user.entity.js';
import { PageQueryDto } from './page-query.dto.js';

export const USER_SORTS = [
  'name',
  'email',
  'affiliation',
  'country',
  'createdAt',
  'lastSignInAt',
] as const;
export type UserSort = (typeof USER_SORTS)[number];
export const USER_STATUSES = ['active', 'unverified', 'deactivated'] as const;
export type UserStatus = (typeof USER_STATUSES)[number];

export class ListUsersQuery extends PageQueryDto {
  @ApiProperty({ required: false, description: 'Part of the name, e-mail or affiliation' })
  @Transform(({ value }) => (typeof value === 'string' ? value.trim() : value))
  @IsOptional()
  @IsString()
  @MaxLength(200)
  q?: string;

  @ApiProperty({ required: false, enum: GLOBAL_ROLES })
  @IsOptional()
  @IsIn(GLOBAL_ROLES)
  role?: GlobalRole;

  @ApiProperty({ required: false, enum: USER_STATUSES })
  @IsOptional()
  @IsIn(USER_STATUSES)
  status?: UserStatus;

  @ApiProperty({ required: false, enum: USER_SORTS, default: 'name' })
  @IsOptional()
  @IsIn(USER_SORTS)
  sort: UserSort = 'name';

  @ApiProperty({ required: false, enum: ['asc', 'desc'], default: 'asc' })
  @IsOptional()
  @IsIn(['asc', 'desc'])
  order: 'asc' | 'desc' = 'asc';
}
