import { ApiProperty } from '@nestjs/swagger';
import { Transform } from 'class-transformer';
import { IsBoolean, IsEmail, MaxLength } from 'class-validator';
import { VersionDto } from './version.dto.js';

export class InviteMemberDto extends VersionDto {
  @ApiProperty({ example: 'colleague@example.org' })
  @Transform(({ value }) => (typeof value === 'string' ? value.trim().toLowerCase() : value))
  @MaxLength(320)
  @IsEmail({}, { message: 'email must be an e-mail address' })
  email: string;

  @ApiProperty({ description: 'Whether the Co-I may change the proposal' })
  @IsBoolean()
  canEdit: boolean;
}

export class UpdateMemberDto extends VersionDto {
  @ApiProperty()
  @IsBoolean()
  canEdit: boolean;
}
