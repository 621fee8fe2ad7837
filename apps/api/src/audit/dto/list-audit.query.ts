import { ApiProperty } from '@nestjs/swagger';
import { IsOptional, IsString, IsUUID, Matches, MaxLength } from 'class-validator';
import { PageQueryDto } from '../../users/dto/page-query.dto.js';

export class ListAuditQuery extends PageQueryDto {
  @ApiProperty({
    required: false,
    description: 'An action, or a prefix ending in a dot: `auth.sign-in-failed`, `user.`',
  })
  @IsOptional()
  @IsString()
  @MaxLength(100)
  @Matches(/^[a-z0-9.-]+$/, { message: 'action may hold only a-z, 0-9, dots and hyphens' })
  action?: string;

  @ApiProperty({ required: false, description: 'Events by this account or about it' })
  @IsOptional()
  @IsUUID('all', { message: 'userId must be a UUID' })
  userId?: string;
}
