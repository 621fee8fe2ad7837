import { ApiProperty } from '@nestjs/swagger';
import { Transform } from 'class-transformer';
import { IsEmail, IsIn, MaxLength } from 'class-validator';
import { CALL_ROLES, type CallRole } from '../entities/call-role.entity.js';

export class GrantCallRoleDto {
  @ApiProperty({ example: 'referee@example.org' })
  @Transform(({ value }) => (typeof value === 'string' ? value.trim().toLowerCase() : value))
  @IsEmail()
  @MaxLength(254)
  email: string;

  @ApiProperty({ enum: CALL_ROLES })
  @IsIn(CALL_ROLES)
  role: CallRole;
}
