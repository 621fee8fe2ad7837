import { ApiProperty } from '@nestjs/swagger';
import { Transform } from 'class-transformer';
import { IsEmail, MaxLength } from 'class-validator';
import { IsAcceptablePassword } from '../password-policy.js';
import { TokenDto } from './token.dto.js';

export class PasswordResetRequestDto {
  @ApiProperty({ example: 'ada.quinterra@example.org' })
  @Transform(({ value }) => (typeof value === 'string' ? value.trim().toLowerCase() : value))
  @IsEmail({}, { message: 'email must be an e-mail address' })
  @MaxLength(254)
  email: string;
}

export class PasswordResetConfirmDto extends TokenDto {
  @ApiProperty({ description: 'The new password' })
  @IsAcceptablePassword()
  password: string;
}
