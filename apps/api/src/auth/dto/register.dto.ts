import { ApiProperty } from '@nestjs/swagger';
import { Transform } from 'class-transformer';
import { IsEmail, MaxLength } from 'class-validator';
import { ProfileFieldsDto } from '../../users/dto/profile-fields.dto.js';
import {
  IsAcceptablePassword,
  PASSWORD_MAX_LENGTH,
  PASSWORD_MIN_LENGTH,
} from '../password-policy.js';

export class RegisterDto extends ProfileFieldsDto {
  @ApiProperty({ example: 'ada.quinterra@example.org' })
  @Transform(({ value }) => (typeof value === 'string' ? value.trim().toLowerCase() : value))
  @IsEmail({}, { message: 'email must be an e-mail address' })
  @MaxLength(254)
  email: string;

  @ApiProperty({
    minLength: PASSWORD_MIN_LENGTH,
    maxLength: PASSWORD_MAX_LENGTH,
    description: 'Not one of the common passwords of the zxcvbn-ts list',
  })
  @IsAcceptablePassword()
  password: string;
}
