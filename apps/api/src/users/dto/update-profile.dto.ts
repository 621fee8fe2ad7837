import { PartialType } from '@nestjs/swagger';
import { ProfileFieldsDto } from './profile-fields.dto.js';

/** PATCH /api/auth/me: any of the profile fields. The e-mail address is not changed here. */
export class UpdateProfileDto extends PartialType(ProfileFieldsDto) {}
