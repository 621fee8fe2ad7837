import { ApiProperty } from '@nestjs/swagger';
import { ArrayUnique, IsArray, IsBoolean, IsIn, IsOptional } from 'class-validator';
import { GLOBAL_ROLES, type GlobalRole } from '../entities/user.entity.js';

/**
 * PATCH /api/users/:id (admin). Only the global roles are set here: proposer comes with a verified
 * address, and chair and referee are granted per call, by the call's own routes.
 */
export class UpdateUserDto {
  @ApiProperty({ required: false, enum: GLOBAL_ROLES, isArray: true, example: ['staff'] })
  @IsOptional()
  @IsArray()
  @ArrayUnique()
  @IsIn(GLOBAL_ROLES, {
    each: true,
    message: `roles may hold only ${GLOBAL_ROLES.join(' and ')} (chair and referee are granted per call)`,
  })
  roles?: GlobalRole[];

  @ApiProperty({
    required: false,
    description: 'false deactivates the account and ends its sessions',
  })
  @IsOptional()
  @IsBoolean()
  active?: boolean;
}
