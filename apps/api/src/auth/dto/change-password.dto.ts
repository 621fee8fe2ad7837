import { ApiProperty } from '@nestjs/swagger';
import { IsString, MaxLength, MinLength } from 'class-validator';
import { IsAcceptablePassword } from '../password-policy.js';

export class ChangePasswordDto {
  @ApiProperty()
  @IsString()
  @MinLength(1, { message: 'currentPassword is required' })
  @MaxLength(1024)
  currentPassword: string;

  @ApiProperty()
  @IsAcceptablePassword()
  newPassword: string;
}
